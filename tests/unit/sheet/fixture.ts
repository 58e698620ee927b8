import { readFileSync } from "node:fs";
import path from "node:path";
import type { SheetInput } from "@/lib/sheet";

export function loadDoublerInput(): SheetInput {
  return JSON.parse(readFileSync(path.resolve(__dirname, "../../../fixtures/sheets/doubler-full.json"), "utf8")) as SheetInput;
}

/** Fisher–Yates with a fixed LCG: a reproducible reordering for determinism tests. */
export function shuffled<T>(items: readonly T[], seed: number): T[] {
  const out = [...items];
  let state = seed;
  for (let i = out.length - 1; i > 0; i--) {
    state = (state * 1103515245 + 12345) % 2147483648;
    const j = state % (i + 1);
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}
