import { metaDate, metaImpedance, metaQuantity, metaString, rawMetadata, unknownMetadataKeys } from "./csv-metadata";
import { checkIncreasing, readCsvColumns, readCsvDocument, requireRows, unusedColumns, type ColumnRequest, type ColumnValues, type CsvDocument } from "./csv-table";
import { IngestError } from "./errors";
import { readParserInput } from "./text-guards";
import type { MeasurementKind, UnitConditions } from "./types";
import { RANGES } from "./units";

export type FileContent = string | Uint8Array;

export interface ParseOptions {
  /** Size limit in bytes (default 20 MiB). */
  maxBytes?: number;
  /** The content is text that already passed decodeInput's guards (parseMeasurementFile). */
  textChecked?: boolean;
  /**
   * Check the values as a passive part's (default true: every device class Benchfold knows is
   * passive): output above input, a negative loss or |S| above 0 dB is refused or warned (plausibility.ts).
   */
  passive?: boolean;
}

export function openCsv(fileName: string, content: FileContent, kind: MeasurementKind, options: ParseOptions = {}): CsvDocument {
  const text = readParserInput({ fileName, content, maxBytes: options.maxBytes, checked: options.textChecked });
  const doc = readCsvDocument(fileName, text);
  const declared = doc.metadata.get("kind");
  if (declared && declared.value.toLowerCase() !== kind) {
    throw new IngestError({
      fileName,
      code: "bad-metadata",
      line: declared.line,
      field: "kind",
      expected: kind,
      found: declared.value,
      detail: `this file declares kind "${declared.value}" but is being read as "${kind}"`,
    });
  }
  return doc;
}

export function readUnitConditions(doc: CsvDocument, warnings: string[]): UnitConditions {
  const serial = metaString(doc, "serial", true, "BFD-0001");
  const lot = metaString(doc, "lot", false, "L2405");
  const temperatureC = metaQuantity(doc, "temperature", "temperature", RANGES.temperatureC, false, "25 C");
  if (temperatureC === undefined) warnings.push('no "# temperature:" metadata; the measurement temperature is unknown');
  metaDate(doc, "date");
  const impedanceOhm = metaImpedance(doc);
  return { serial, lot, temperatureC, ...(impedanceOhm !== undefined ? { impedanceOhm } : {}), metadata: rawMetadata(doc) };
}

export function warnUnused(doc: CsvDocument, requests: ColumnRequest[], knownMetadata: string[], warnings: string[]): void {
  for (const col of unusedColumns(doc, requests)) warnings.push(`column "${col}" is not used by this kind and was ignored`);
  for (const key of unknownMetadataKeys(doc, knownMetadata)) warnings.push(`metadata "${key}" is not used by this kind`);
}

/**
 * Reads the data rows of a sweep: `requests[0]` is the swept column (input power, frequency,
 * offset), whose values must rise from row to row; at least `minRows` rows; unused columns and
 * metadata other than `knownMetadata` are reported in `warnings`. Returns one array per request.
 */
export function readSweepColumns(doc: CsvDocument, requests: ColumnRequest[], minRows: number, knownMetadata: string[], warnings: string[]): number[][] {
  return readSweepRows(doc, requests, minRows, knownMetadata, warnings).values;
}

/** readSweepColumns with the file line of each row, for checks that name a row. */
export function readSweepRows(doc: CsvDocument, requests: ColumnRequest[], minRows: number, knownMetadata: string[], warnings: string[]): ColumnValues {
  const read = readCsvColumns(doc, requests);
  requireRows(doc, read.lines, minRows);
  checkIncreasing(doc, requests[0], read.values[0], read.lines);
  warnUnused(doc, requests, knownMetadata, warnings);
  return read;
}
