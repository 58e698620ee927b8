import { readFileSync } from "node:fs";
import path from "node:path";
import { type DeriveOptions, type DerivedParameter, deriveParameters } from "@/lib/analysis";
import { parseMeasurementFile } from "@/lib/ingest";

export const EXAMPLES = path.resolve(__dirname, "../../../fixtures/examples");

export function analyzeExample(name: string, options?: DeriveOptions) {
  const bytes = new Uint8Array(readFileSync(path.join(EXAMPLES, name)));
  return deriveParameters(parseMeasurementFile({ fileName: name, bytes }), options);
}

/** A file's text through the parser and the engine, as an upload of that name. */
export function analyzeText(text: string, options?: DeriveOptions, name = "trace.csv") {
  return deriveParameters(parseMeasurementFile({ fileName: name, bytes: new Uint8Array(Buffer.from(text, "utf8")) }), options);
}

/** The one parameter with this name whose conditions include every given entry; fails loudly otherwise. */
export function pick(parameters: DerivedParameter[], name: string, conditions: Record<string, string | number> = {}): DerivedParameter {
  const found = parameters.filter(
    (p) => p.name === name && Object.entries(conditions).every(([key, value]) => p.conditions[key] === value),
  );
  if (found.length !== 1) {
    throw new Error(`Expected one "${name}" with ${JSON.stringify(conditions)}, found ${found.length}`);
  }
  return found[0];
}

export function valueOf(parameters: DerivedParameter[], name: string, conditions: Record<string, string | number> = {}): number {
  const { value } = pick(parameters, name, conditions);
  if (value === null) throw new Error(`"${name}" has no value`);
  return value;
}

export const log10 = Math.log10;
