/**
 * What the Touchstone reader knows about a file while it reads it: the option line's
 * settings, the version 2.0 keywords seen so far, and the section it is in.
 */
import { IngestError, type IngestErrorCode } from "../errors";

export type Format = "RI" | "MA" | "DB";

export const MAX_PORTS = 64;

export interface Pair {
  i: number;
  j: number;
}

export interface State {
  fileName: string;
  version: 1 | 2 | undefined;
  optionLine: number;
  frequencyScale: number;
  format: Format;
  referenceOhm: number;
  ports: number;
  twoPortOrder: "12_21" | "21_12" | undefined;
  matrix: "full" | "lower" | "upper";
  declaredFrequencies: number | undefined;
  declaredFrequenciesLine: number;
  references: number[] | undefined;
  referencesPending: number;
  referenceLine: number;
  inNetworkData: boolean;
  networkDataSeen: boolean;
  inInformation: boolean;
  skippingNoise: boolean;
  ended: boolean;
  comments: string[];
  warnings: string[];
  extraOptionLines: number;
}

/** Touchstone 1.1 defaults when the option line leaves a field out: GHz, S, MA, R 50. */
export function initialState(fileName: string): State {
  return {
    fileName,
    version: undefined,
    optionLine: 0,
    frequencyScale: 1e9,
    format: "MA",
    referenceOhm: 50,
    ports: 0,
    twoPortOrder: undefined,
    matrix: "full",
    declaredFrequencies: undefined,
    declaredFrequenciesLine: 0,
    references: undefined,
    referencesPending: 0,
    referenceLine: 0,
    inNetworkData: false,
    networkDataSeen: false,
    inInformation: false,
    skippingNoise: false,
    ended: false,
    comments: [],
    warnings: [],
    extraOptionLines: 0,
  };
}

export function fail(s: State, code: IngestErrorCode, detail: string, extra: Partial<ConstructorParameters<typeof IngestError>[0]> = {}): never {
  throw new IngestError({ fileName: s.fileName, code, detail, ...extra });
}

export function entryName(p: Pair): string {
  return p.i < 9 && p.j < 9 ? `S${p.i + 1}${p.j + 1}` : `S${p.i + 1},${p.j + 1}`;
}

export function partName(format: Format, part: number): string {
  if (format === "RI") return part === 0 ? "real part" : "imaginary part";
  if (format === "MA") return part === 0 ? "magnitude" : "angle";
  return part === 0 ? "magnitude in dB" : "angle";
}
