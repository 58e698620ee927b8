import { openCsv, readSweepRows, readUnitConditions, type FileContent, type ParseOptions } from "./csv-common";
import { metaInteger, metaQuantity } from "./csv-metadata";
import { columnRequest, requireColumn, type ColumnRequest } from "./csv-table";
import { IngestError } from "./errors";
import { checkPassiveCsv } from "./plausibility";
import type { DriveSweep, ParseResult } from "./types";
import { RANGES } from "./units";

const METADATA_KEYS = ["input_frequency", "wanted_order", "splitter_excess_loss", "cable_loss", "compression_reference"];
export const MAX_HARMONIC_ORDER = 16;

/** Harmonic output columns are named p1_out, p2_out, … pN_out (order N). */
function harmonicOrder(name: string): number | undefined {
  if (name.length < 6 || name[0] !== "p" || !name.endsWith("_out")) return undefined;
  const digits = name.slice(1, -4);
  if (!/^[1-9][0-9]?$/.test(digits)) return undefined;
  return Number(digits);
}

export function parseDriveSweep(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<DriveSweep> {
  const warnings: string[] = [];
  const doc = openCsv(fileName, content, "drive-sweep", options);
  const unit = readUnitConditions(doc, warnings);
  const inputFrequencyHz = metaQuantity(doc, "input_frequency", "frequency", RANGES.frequencyHz, true, "1 GHz")!;
  const wantedOrder = metaInteger(doc, "wanted_order", 1, MAX_HARMONIC_ORDER, true, "2")!;
  let splitterExcessLossDb = metaQuantity(doc, "splitter_excess_loss", "ratio-db", RANGES.correctionDb, false, "0.4 dB");
  if (splitterExcessLossDb === undefined) {
    splitterExcessLossDb = 0;
    warnings.push('no "# splitter_excess_loss:" metadata; taken as 0 dB');
  }
  let cableLossDb = metaQuantity(doc, "cable_loss", "ratio-db", RANGES.correctionDb, false, "0.6 dB");
  if (cableLossDb === undefined) {
    cableLossDb = 0;
    warnings.push('no "# cable_loss:" metadata; taken as 0 dB');
  }

  const compressionReferenceDbm = metaQuantity(doc, "compression_reference", "power", RANGES.powerDbm, false, "-10 dBm");

  const input = requireColumn(doc, "input_power", "power", RANGES.powerDbm, "input_power [dBm]");
  const harmonicColumns: { order: number; request: ColumnRequest }[] = [];
  for (const cell of doc.header) {
    const order = harmonicOrder(cell.name);
    if (order === undefined) continue;
    if (order > MAX_HARMONIC_ORDER) {
      throw new IngestError({
        fileName,
        code: "out-of-range",
        line: doc.headerLine,
        column: cell.index + 1,
        field: cell.raw,
        detail: `harmonic order ${order} is above the supported ${MAX_HARMONIC_ORDER}`,
      });
    }
    harmonicColumns.push({ order, request: columnRequest(doc, cell, "power", RANGES.powerDbm) });
  }
  harmonicColumns.sort((a, b) => a.order - b.order);
  if (!harmonicColumns.some((h) => h.order === wantedOrder)) {
    throw new IngestError({
      fileName,
      code: "missing-column",
      line: doc.headerLine,
      field: `p${wantedOrder}_out`,
      expected: `p${wantedOrder}_out [dBm]`,
      detail: `wanted_order is ${wantedOrder} but there is no "p${wantedOrder}_out [dBm]" column; the header has ${doc.header
        .map((c) => `"${c.raw}"`)
        .join(", ")}`,
    });
  }

  const requests = [input, ...harmonicColumns.map((h) => h.request)];
  const { values, lines } = readSweepRows(doc, requests, 1, METADATA_KEYS, warnings);
  if (options.passive !== false) {
    // The input column is the total power at the source: a passive part's every harmonic stays below it.
    const outputs = harmonicColumns.map((h, k) => ({ request: h.request, values: values[k + 1] }));
    checkPassiveCsv(doc, { input: { request: input, values: values[0] }, outputs, losses: [], lines }, warnings);
  }

  // The unit conditions are listed rather than spread: object spread showed up in profiles of
  // many small files (one per file, thousands of files per upload).
  return {
    data: {
      serial: unit.serial,
      lot: unit.lot,
      temperatureC: unit.temperatureC,
      ...(unit.impedanceOhm !== undefined ? { impedanceOhm: unit.impedanceOhm } : {}),
      metadata: unit.metadata,
      inputFrequencyHz,
      wantedOrder,
      splitterExcessLossDb,
      cableLossDb,
      ...(compressionReferenceDbm !== undefined ? { compressionReferenceDbm } : {}),
      inputPowerDbm: values[0],
      harmonics: harmonicColumns.map((h, k) => ({ order: h.order, outputPowerDbm: values[k + 1] })),
    },
    warnings,
  };
}
