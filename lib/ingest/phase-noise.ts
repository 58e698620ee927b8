import { openCsv, readSweepColumns, readUnitConditions, type FileContent, type ParseOptions } from "./csv-common";
import { metaFrequencyBand, metaInteger, metaQuantity } from "./csv-metadata";
import { requireColumn } from "./csv-table";
import type { ParseResult, PhaseNoiseTrace } from "./types";
import { RANGES } from "./units";

const METADATA_KEYS = ["carrier_frequency", "carrier_power", "multiplication_factor", "integration_start", "integration_stop"];

export function parsePhaseNoise(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<PhaseNoiseTrace> {
  const warnings: string[] = [];
  const doc = openCsv(fileName, content, "phase-noise", options);
  const unit = readUnitConditions(doc, warnings);
  const carrierFrequencyHz = metaQuantity(doc, "carrier_frequency", "frequency", RANGES.frequencyHz, true, "2 GHz")!;
  const carrierPowerDbm = metaQuantity(doc, "carrier_power", "power", RANGES.powerDbm, false, "3 dBm");
  const multiplicationFactor = metaInteger(doc, "multiplication_factor", 1, 1000, false, "2");

  const integrationBandHz = metaFrequencyBand(doc, "integration_start", "integration_stop");

  const offset = requireColumn(doc, "offset", "frequency", RANGES.frequencyHz, "offset [Hz]");
  const l = requireColumn(doc, "l", "noise-dbc-hz", RANGES.noiseDbcHz, "L [dBc/Hz]");
  const requests = [offset, l];
  const values = readSweepColumns(doc, requests, 2, METADATA_KEYS, warnings);
  return {
    data: { ...unit, carrierFrequencyHz, carrierPowerDbm, multiplicationFactor, ...(integrationBandHz ? { integrationBandHz } : {}), offsetHz: values[0], lDbcHz: values[1] },
    warnings,
  };
}
