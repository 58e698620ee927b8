import type { ParseOptions } from "./csv-common";
import { detectKind } from "./detect-kind";
import { parseDriveSweep } from "./drive-sweep";
import { parseFrequencySweep } from "./frequency-sweep";
import { parsePhaseNoise } from "./phase-noise";
import { decodeInput } from "./text-guards";
import { parseTouchstone } from "./touchstone";
import { parseTwoTone } from "./two-tone";
import type { MeasurementKind, ParsedMeasurement } from "./types";

export interface MeasurementFileInput extends ParseOptions {
  fileName: string;
  /** Give bytes (preferred: encoding and size are checked exactly) or text. */
  bytes?: Uint8Array;
  text?: string;
  /** Skip detection when the caller already knows the kind. */
  kind?: MeasurementKind;
}

/** Guards, kind detection and the matching parser. Throws IngestError only. */
export function parseMeasurementFile(input: MeasurementFileInput): ParsedMeasurement {
  const { fileName, maxBytes } = input;
  const text = decodeInput({ fileName, bytes: input.bytes, text: input.text, maxBytes });
  const kind = input.kind ?? detectKind(fileName, text);
  // The text is already checked: the parsers neither apply the size limit to a decoded string
  // nor run the guards over it again.
  const options = { maxBytes: Number.POSITIVE_INFINITY, textChecked: true, passive: input.passive };
  switch (kind) {
    case "drive-sweep":
      return { kind, ...parseDriveSweep(fileName, text, options) };
    case "frequency-sweep":
      return { kind, ...parseFrequencySweep(fileName, text, options) };
    case "two-tone":
      return { kind, ...parseTwoTone(fileName, text, options) };
    case "phase-noise":
      return { kind, ...parsePhaseNoise(fileName, text, options) };
    case "touchstone":
      return { kind, ...parseTouchstone(fileName, text, options) };
  }
}
