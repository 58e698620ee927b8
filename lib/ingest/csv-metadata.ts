import { impedanceProblem, impedanceRangeOhm } from "../domain/analysis-settings";
import { calendarDateProblem } from "../schemas/calendar-date";
import type { CsvDocument, MetadataEntry } from "./csv-table";
import { IngestError, shortenFound } from "./errors";
import { parseNumberAt } from "./number";
import { acceptedUnits, describeQuantity, describeRange, findConversion, inRange, RANGES, type Quantity, type ValueRange } from "./units";

/** Metadata keys every CSV kind understands. */
export const COMMON_METADATA_KEYS = ["kind", "serial", "lot", "temperature", "device", "notes", "operator", "date", "instrument", "impedance"];

function missing(doc: CsvDocument, key: string, example: string): never {
  throw new IngestError({
    fileName: doc.fileName,
    code: "missing-metadata",
    field: key,
    expected: `# ${key}: ${example}`,
    detail: `required metadata "${key}" is missing; add a line "# ${key}: ${example}" above the header`,
  });
}

function bad(doc: CsvDocument, entry: MetadataEntry, expected: string, detail: string): never {
  throw new IngestError({
    fileName: doc.fileName,
    code: "bad-metadata",
    line: entry.line,
    field: entry.key,
    expected,
    found: shortenFound(entry.value),
    detail,
  });
}

export function metaString(doc: CsvDocument, key: string, required: true, example: string): string;
export function metaString(doc: CsvDocument, key: string, required: false, example: string): string | undefined;
export function metaString(doc: CsvDocument, key: string, required: boolean, example: string): string | undefined {
  const entry = doc.metadata.get(key);
  if (!entry) return required ? missing(doc, key, example) : undefined;
  if (entry.value === "") bad(doc, entry, example, `metadata "${key}" is empty; expected e.g. "${example}"`);
  return entry.value;
}

/** "# date: 2026-03-31": a calendar date as YYYY-MM-DD, by the same rule as every date field of the app. */
export function metaDate(doc: CsvDocument, key: string): string | undefined {
  const entry = doc.metadata.get(key);
  if (!entry) return undefined;
  const problem = calendarDateProblem(entry.value);
  if (problem) bad(doc, entry, "a calendar date as YYYY-MM-DD, e.g. 2026-03-31", problem);
  return entry.value;
}

/** "1.5 GHz", "0.4 dB", "25 C": a number, a space, a unit; returned in canonical units. */
export function metaQuantity(
  doc: CsvDocument,
  key: string,
  quantity: Quantity,
  range: ValueRange,
  required: boolean,
  example: string,
): number | undefined {
  const entry = doc.metadata.get(key);
  if (!entry) return required ? missing(doc, key, example) : undefined;
  const value = entry.value;
  const space = value.search(/\s/);
  const numberText = space === -1 ? value : value.slice(0, space);
  const unitText = space === -1 ? "" : value.slice(space + 1).trim();
  const expected = `${describeQuantity(quantity)} with its unit, e.g. "${example}"`;
  const x = parseNumberAt(numberText, 0, numberText.length, doc.decimalComma);
  if (!Number.isFinite(x)) bad(doc, entry, expected, `expected ${expected}, found "${shortenFound(value)}"`);
  if (unitText === "") bad(doc, entry, expected, `"${shortenFound(value)}" has no unit; expected ${expected}`);
  const conversion = findConversion(unitText, quantity);
  if (!conversion) {
    throw new IngestError({
      fileName: doc.fileName,
      code: "unknown-unit",
      line: entry.line,
      field: key,
      expected: acceptedUnits(quantity),
      found: shortenFound(unitText),
      detail: `unknown unit "${shortenFound(unitText)}" for ${describeQuantity(quantity)}; expected one of ${acceptedUnits(quantity)}`,
    });
  }
  const reason = conversion.invalid?.(x);
  if (reason !== undefined) {
    throw new IngestError({ fileName: doc.fileName, code: "out-of-range", line: entry.line, field: key, detail: `${reason}, found "${shortenFound(value)}"` });
  }
  const v = conversion.toCanonical(x);
  if (!inRange(v, range)) {
    throw new IngestError({
      fileName: doc.fileName,
      code: "out-of-range",
      line: entry.line,
      field: key,
      expected: describeRange(range),
      found: shortenFound(value),
      detail: `${shortenFound(value)} is outside the plausible range for ${describeQuantity(quantity)} (${describeRange(range)})`,
    });
  }
  return v;
}

export function metaInteger(
  doc: CsvDocument,
  key: string,
  min: number,
  max: number,
  required: boolean,
  example: string,
): number | undefined {
  const entry = doc.metadata.get(key);
  if (!entry) return required ? missing(doc, key, example) : undefined;
  const t = entry.value;
  const expected = `a whole number from ${min} to ${max}`;
  let ok = t.length > 0 && t.length <= 6;
  for (let i = 0; ok && i < t.length; i++) {
    const c = t.charCodeAt(i);
    if (c < 48 || c > 57) ok = false;
  }
  if (!ok) bad(doc, entry, expected, `expected ${expected}, found "${shortenFound(t)}"`);
  const n = Number(t);
  if (n < min || n > max) {
    throw new IngestError({
      fileName: doc.fileName,
      code: "out-of-range",
      line: entry.line,
      field: key,
      expected,
      found: t,
      detail: `${key} ${t} is outside ${min}…${max}`,
    });
  }
  return n;
}

const COMMON_METADATA_KEY_SET = new Set(COMMON_METADATA_KEYS);

/** Metadata lines no parser read, reported as a warning rather than dropped silently. */
export function unknownMetadataKeys(doc: CsvDocument, known: string[]): string[] {
  // The common keys' set is built once, not per file; a kind's own keys are only a handful.
  return [...doc.metadata.keys()].filter((k) => !COMMON_METADATA_KEY_SET.has(k) && !known.includes(k));
}

export function rawMetadata(doc: CsvDocument): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, e] of doc.metadata) out[k] = e.value;
  return out;
}

/** Two frequency lines that state a band together (`# integration_start: 12 kHz`, `# integration_stop: 20 MHz`): both or neither, start below stop. */
export function metaFrequencyBand(doc: CsvDocument, startKey: string, stopKey: string): { startHz: number; stopHz: number } | undefined {
  const startHz = metaQuantity(doc, startKey, "frequency", RANGES.frequencyHz, false, "12 kHz");
  const stopHz = metaQuantity(doc, stopKey, "frequency", RANGES.frequencyHz, false, "20 MHz");
  if (startHz === undefined && stopHz === undefined) return undefined;
  if (startHz === undefined) missing(doc, startKey, "12 kHz");
  if (stopHz === undefined) missing(doc, stopKey, "20 MHz");
  if (!(stopHz > startHz)) bad(doc, doc.metadata.get(stopKey)!, `a frequency above ${startKey}`, `${stopKey} must lie above ${startKey}`);
  return { startHz, stopHz };
}

/**
 * "# impedance: 75" (or "75 ohm", "75 Ω"): the impedance the file's power readings are referred to
 * for dBm ↔ Vrms ↔ dBµV, in ohms, from 1 to 1000 Ω.
 */
export function metaImpedance(doc: CsvDocument): number | undefined {
  const entry = doc.metadata.get("impedance");
  if (!entry) return undefined;
  const expected = `a resistance in ohms from ${impedanceRangeOhm.min} to ${impedanceRangeOhm.max}, e.g. "75" or "75 ohm"`;
  const match = /^(\S+?)\s*(ohms?|Ω|Ohms?)?$/i.exec(entry.value.trim());
  const ohm = match ? parseNumberAt(match[1], 0, match[1].length, doc.decimalComma) : Number.NaN;
  if (!Number.isFinite(ohm)) bad(doc, entry, expected, `expected ${expected}, found "${shortenFound(entry.value)}"`);
  const problem = impedanceProblem(ohm);
  if (problem) {
    throw new IngestError({ fileName: doc.fileName, code: "out-of-range", line: entry.line, field: "impedance", expected, found: shortenFound(entry.value), detail: `${problem}, found "${shortenFound(entry.value)}"` });
  }
  return ohm;
}
