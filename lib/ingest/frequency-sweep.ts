import { openCsv, readSweepRows, readUnitConditions, type FileContent, type ParseOptions } from "./csv-common";
import { metaQuantity } from "./csv-metadata";
import { findColumn, requireColumn, type ColumnRequest } from "./csv-table";
import { IngestError } from "./errors";
import { checkPassiveCsv } from "./plausibility";
import type { FrequencySweep, ParseResult } from "./types";
import { RANGES, type Quantity, type ValueRange } from "./units";

const METADATA_KEYS = ["lo_power", "lo_frequency", "if_frequency"];

type SeriesKey = "inputPowerDbm" | "outputPowerDbm" | "conversionLossDb" | "isolationLoRfDb" | "isolationLoIfDb" | "isolationRfIfDb";

const SERIES: { column: string; key: SeriesKey; quantity: Quantity; range: ValueRange; measured: boolean }[] = [
  { column: "input_power", key: "inputPowerDbm", quantity: "power", range: RANGES.powerDbm, measured: false },
  { column: "output_power", key: "outputPowerDbm", quantity: "power", range: RANGES.powerDbm, measured: true },
  { column: "conversion_loss", key: "conversionLossDb", quantity: "ratio-db", range: RANGES.lossDb, measured: true },
  { column: "isolation_lo_rf", key: "isolationLoRfDb", quantity: "ratio-db", range: RANGES.lossDb, measured: true },
  { column: "isolation_lo_if", key: "isolationLoIfDb", quantity: "ratio-db", range: RANGES.lossDb, measured: true },
  { column: "isolation_rf_if", key: "isolationRfIfDb", quantity: "ratio-db", range: RANGES.lossDb, measured: true },
];

export function parseFrequencySweep(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<FrequencySweep> {
  const warnings: string[] = [];
  const doc = openCsv(fileName, content, "frequency-sweep", options);
  const unit = readUnitConditions(doc, warnings);
  const loPowerDbm = metaQuantity(doc, "lo_power", "power", RANGES.powerDbm, false, "7 dBm");
  const loFrequencyHz = metaQuantity(doc, "lo_frequency", "frequency", RANGES.frequencyHz, false, "2 GHz");
  const ifFrequencyHz = metaQuantity(doc, "if_frequency", "frequency", RANGES.frequencyHz, false, "70 MHz");

  const frequency = requireColumn(doc, "frequency", "frequency", RANGES.frequencyHz, "frequency [MHz]");
  const present: { key: SeriesKey; request: ColumnRequest }[] = [];
  for (const s of SERIES) {
    const request = findColumn(doc, s.column, s.quantity, s.range);
    if (request) present.push({ key: s.key, request });
  }
  if (!present.some((p) => SERIES.find((s) => s.key === p.key)!.measured)) {
    throw new IngestError({
      fileName,
      code: "missing-column",
      line: doc.headerLine,
      expected: SERIES.filter((s) => s.measured).map((s) => s.column).join(", "),
      detail: `a frequency sweep needs at least one of ${SERIES.filter((s) => s.measured)
        .map((s) => `"${s.column}"`)
        .join(", ")}; the header has ${doc.header.map((c) => `"${c.raw}"`).join(", ")}`,
    });
  }
  const requests = [frequency, ...present.map((p) => p.request)];
  const { values, lines } = readSweepRows(doc, requests, 1, METADATA_KEYS, warnings);

  const data: FrequencySweep = { ...unit, frequencyHz: values[0], loPowerDbm, loFrequencyHz, ifFrequencyHz };
  present.forEach((p, k) => (data[p.key] = values[k + 1]));
  if (options.passive !== false) {
    // Isolation columns are losses too: a passive part cannot show negative isolation beyond the uncertainty.
    const column = (key: SeriesKey) => {
      const k = present.findIndex((p) => p.key === key);
      return k === -1 ? undefined : { request: present[k].request, values: values[k + 1] };
    };
    const lossKeys: SeriesKey[] = ["conversionLossDb", "isolationLoRfDb", "isolationLoIfDb", "isolationRfIfDb"];
    const output = column("outputPowerDbm");
    checkPassiveCsv(
      doc,
      {
        input: column("inputPowerDbm"),
        outputs: output ? [output] : [],
        losses: lossKeys.map(column).filter((c) => c !== undefined),
        lines,
      },
      warnings,
    );
  }
  return { data, warnings };
}
