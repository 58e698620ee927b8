import { openCsv, readSweepColumns, readUnitConditions, type FileContent, type ParseOptions } from "./csv-common";
import { metaFrequencyBand, metaInteger, metaQuantity } from "./csv-metadata";
import { findColumn, requireColumn, type ColumnRequest, type CsvDocument } from "./csv-table";
import { IngestError } from "./errors";
import type { ParseResult, PhaseNoiseTrace } from "./types";
import { RANGES, type ValueRange } from "./units";
import { spurBandwidthKinds, spurBandwidthRangeHz, type SpurBandwidth, type SpurBandwidthKind } from "../domain/analysis-settings";

/** The metadata key, and the column name, of each kind of bandwidth (lib/domain/analysis-settings.ts). */
const BANDWIDTH_NAMES: Record<SpurBandwidthKind, string> = { noise: "noise_bandwidth", resolution: "resolution_bandwidth" };

const METADATA_KEYS = ["carrier_frequency", "carrier_power", "multiplication_factor", "integration_start", "integration_stop", ...Object.values(BANDWIDTH_NAMES)];

const BANDWIDTH_RANGE: ValueRange = { min: spurBandwidthRangeHz.min, max: spurBandwidthRangeHz.max, unit: "Hz", text: "from 1 mHz to 10 MHz" };

export function parsePhaseNoise(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<PhaseNoiseTrace> {
  const warnings: string[] = [];
  const doc = openCsv(fileName, content, "phase-noise", options);
  const unit = readUnitConditions(doc, warnings);
  const carrierFrequencyHz = metaQuantity(doc, "carrier_frequency", "frequency", RANGES.frequencyHz, true, "2 GHz")!;
  const carrierPowerDbm = metaQuantity(doc, "carrier_power", "power", RANGES.powerDbm, false, "3 dBm");
  const multiplicationFactor = metaInteger(doc, "multiplication_factor", 1, 1000, false, "2");

  const integrationBandHz = metaFrequencyBand(doc, "integration_start", "integration_stop");
  const spurBandwidth = metaSpurBandwidth(doc);

  const offset = requireColumn(doc, "offset", "frequency", RANGES.frequencyHz, "offset [Hz]");
  const l = requireColumn(doc, "l", "noise-dbc-hz", RANGES.noiseDbcHz, "L [dBc/Hz]");
  const bandwidthColumn = spurBandwidthColumn(doc, spurBandwidth);
  const input = inputColumn(doc, multiplicationFactor);
  const requests = [offset, l, ...(bandwidthColumn ? [bandwidthColumn.request] : []), ...(input ? [input] : [])];
  const values = readSweepColumns(doc, requests, 2, METADATA_KEYS, warnings);
  const [offsetHz, lDbcHz] = values;
  return {
    data: {
      ...unit,
      carrierFrequencyHz,
      carrierPowerDbm,
      multiplicationFactor,
      ...(integrationBandHz ? { integrationBandHz } : {}),
      ...(spurBandwidth ? { spurBandwidth } : {}),
      ...(bandwidthColumn ? { spurBandwidthColumn: { kind: bandwidthColumn.kind, hz: values[2] } } : {}),
      offsetHz,
      lDbcHz,
      ...(input ? { inputLDbcHz: values[values.length - 1] } : {}),
    },
    warnings,
  };
}

/**
 * `# noise_bandwidth: 1 kHz` (the analyzer's equivalent noise bandwidth, used as it is) or
 * `# resolution_bandwidth: 1 kHz` (its 3 dB RBW, turned into a noise bandwidth by lib/rf/spurs.ts):
 * one of the two, the bandwidth the whole trace was normalised to 1 Hz with.
 */
function metaSpurBandwidth(doc: CsvDocument): SpurBandwidth | undefined {
  const stated = spurBandwidthKinds.flatMap((kind) => {
    const hz = metaQuantity(doc, BANDWIDTH_NAMES[kind], "frequency", BANDWIDTH_RANGE, false, "1 kHz");
    return hz === undefined ? [] : [{ kind, hz }];
  });
  if (stated.length > 1) {
    const second = [...stated].sort((a, b) => lineOf(doc, a.kind) - lineOf(doc, b.kind))[1];
    const entry = doc.metadata.get(BANDWIDTH_NAMES[second.kind])!;
    throw new IngestError({
      fileName: doc.fileName,
      code: "bad-metadata",
      line: entry.line,
      field: entry.key,
      expected: "one bandwidth line: noise_bandwidth or resolution_bandwidth",
      found: entry.value,
      detail: "the file states both a noise bandwidth and a resolution bandwidth; keep the one the analyzer normalised the trace with",
    });
  }
  return stated[0];
}

const lineOf = (doc: CsvDocument, kind: SpurBandwidthKind) => doc.metadata.get(BANDWIDTH_NAMES[kind])!.line;

/** A `noise_bandwidth [Hz]` or `resolution_bandwidth [Hz]` column: the bandwidth at each offset. Never beside a bandwidth line, never both. */
function spurBandwidthColumn(doc: CsvDocument, line: SpurBandwidth | undefined): { kind: SpurBandwidthKind; request: ColumnRequest } | undefined {
  const columns = spurBandwidthKinds.flatMap((kind) => {
    const request = findColumn(doc, BANDWIDTH_NAMES[kind], "frequency", BANDWIDTH_RANGE);
    return request ? [{ kind, request }] : [];
  });
  if (columns.length === 0) return undefined;
  const column = columns.length > 1 ? columns.sort((a, b) => a.request.cell.index - b.request.cell.index)[1] : columns[0];
  if (columns.length > 1 || line) {
    throw new IngestError({
      fileName: doc.fileName,
      code: columns.length > 1 ? "duplicate-column" : "bad-metadata",
      line: doc.headerLine,
      column: column.request.cell.index + 1,
      field: column.request.cell.raw,
      expected: "the bandwidth stated once: one bandwidth column, or one bandwidth line",
      detail:
        columns.length > 1
          ? "the header has both a noise_bandwidth and a resolution_bandwidth column; keep the one the analyzer normalised the trace with"
          : `the file states its bandwidth twice: a "# ${BANDWIDTH_NAMES[line!.kind]}:" line and this column; keep one`,
    });
  }
  return column;
}

/** `L_input [dBc/Hz]`: the input signal's own L(f), which only means something through a stated ×N. */
function inputColumn(doc: CsvDocument, multiplicationFactor: number | undefined): ColumnRequest | undefined {
  const request = findColumn(doc, "l_input", "noise-dbc-hz", RANGES.noiseDbcHz);
  if (!request || (multiplicationFactor !== undefined && multiplicationFactor >= 2)) return request;
  throw new IngestError({
    fileName: doc.fileName,
    code: "missing-metadata",
    line: doc.headerLine,
    column: request.cell.index + 1,
    field: request.cell.raw,
    expected: "# multiplication_factor: 2",
    detail:
      multiplicationFactor === undefined
        ? `column "${request.cell.raw}" is the input's L(f) of a multiplier; add a line "# multiplication_factor: 2" (the device's N) above the header`
        : `column "${request.cell.raw}" is the input's L(f) of a multiplier, but multiplication_factor is 1; state the device's N (2 for a doubler)`,
  });
}
