import { openCsv, readSweepRows, readUnitConditions, type FileContent, type ParseOptions } from "./csv-common";
import { metaQuantity } from "./csv-metadata";
import { requireColumn } from "./csv-table";
import { IngestError } from "./errors";
import { checkPassiveCsv } from "./plausibility";
import type { ParseResult, TwoTone } from "./types";
import { RANGES } from "./units";

const METADATA_KEYS = ["tone1_frequency", "tone2_frequency", "tone_spacing", "lo_power", "lo_frequency", "tone2_relative_level", "compression_reference"];

export function parseTwoTone(fileName: string, content: FileContent, options: ParseOptions = {}): ParseResult<TwoTone> {
  const warnings: string[] = [];
  const doc = openCsv(fileName, content, "two-tone", options);
  const unit = readUnitConditions(doc, warnings);
  const tone1FrequencyHz = metaQuantity(doc, "tone1_frequency", "frequency", RANGES.frequencyHz, false, "1000 MHz");
  const tone2FrequencyHz = metaQuantity(doc, "tone2_frequency", "frequency", RANGES.frequencyHz, false, "1001 MHz");
  let toneSpacingHz = metaQuantity(doc, "tone_spacing", "frequency", RANGES.frequencyHz, false, "1 MHz");
  const loPowerDbm = metaQuantity(doc, "lo_power", "power", RANGES.powerDbm, false, "7 dBm");
  const tone2RelativeLevelDb = metaQuantity(doc, "tone2_relative_level", "ratio-db", RANGES.toneLevelDifferenceDb, false, "-3 dB");
  const compressionReferenceDbm = metaQuantity(doc, "compression_reference", "power", RANGES.powerDbm, false, "-20 dBm");
  if (tone1FrequencyHz !== undefined && tone2FrequencyHz !== undefined) {
    const spacing = Math.abs(tone2FrequencyHz - tone1FrequencyHz);
    if (spacing === 0) {
      const entry = doc.metadata.get("tone2_frequency")!;
      throw new IngestError({
        fileName,
        code: "bad-metadata",
        line: entry.line,
        field: "tone2_frequency",
        detail: "the two tones have the same frequency",
      });
    }
    if (toneSpacingHz === undefined) toneSpacingHz = spacing;
    else if (Math.abs(toneSpacingHz - spacing) > 1e-6 * spacing) {
      const entry = doc.metadata.get("tone_spacing")!;
      throw new IngestError({
        fileName,
        code: "bad-metadata",
        line: entry.line,
        field: "tone_spacing",
        detail: `tone_spacing ${entry.value} disagrees with the tone frequencies, which are ${spacing} Hz apart`,
      });
    }
  }

  const input = requireColumn(doc, "input_power", "power", RANGES.powerDbm, "input_power [dBm]");
  const fundamental = requireColumn(doc, "fund_out", "power", RANGES.powerDbm, "fund_out [dBm]");
  const im3 = requireColumn(doc, "im3_out", "power", RANGES.powerDbm, "im3_out [dBm]");
  const requests = [input, fundamental, im3];
  const { values, lines } = readSweepRows(doc, requests, 1, METADATA_KEYS, warnings);
  if (options.passive !== false) {
    const outputs = [fundamental, im3].map((request, k) => ({ request, values: values[k + 1] }));
    checkPassiveCsv(doc, { input: { request: input, values: values[0] }, outputs, losses: [], lines }, warnings);
  }
  return {
    data: {
      ...unit,
      inputPowerPerToneDbm: values[0],
      fundamentalOutputDbm: values[1],
      im3OutputDbm: values[2],
      tone1FrequencyHz,
      tone2FrequencyHz,
      toneSpacingHz,
      loPowerDbm,
      ...(tone2RelativeLevelDb !== undefined ? { tone2RelativeLevelDb } : {}),
      ...(compressionReferenceDbm !== undefined ? { compressionReferenceDbm } : {}),
    },
    warnings,
  };
}
