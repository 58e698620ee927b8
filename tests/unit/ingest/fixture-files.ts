import { readFileSync } from "node:fs";
import path from "node:path";

export const FIXTURES = path.resolve(__dirname, "../../../fixtures");

export function fixtureBytes(folder: "examples" | "malformed", name: string): Uint8Array {
  return new Uint8Array(readFileSync(path.join(FIXTURES, folder, name)));
}

export function fixtureText(folder: "examples" | "malformed", name: string): string {
  return readFileSync(path.join(FIXTURES, folder, name), "utf8");
}
