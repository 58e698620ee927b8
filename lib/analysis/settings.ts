import {
  DEFAULT_ANALYSIS_IMPEDANCE_OHM,
  settingSources,
  settingSourceWords,
  type IntegrationBandHz,
  spurBandwidthKindWords,
  type SettingSource,
  type SpurBandwidth,
  type StatedAnalysisSettings,
} from "../domain/analysis-settings";
import { formatBand, formatQuantity } from "../format/quantity";
import type { ParsedMeasurement } from "../ingest/types";
import type { DeriveOptions } from "./types";

/** Band used when no source states one and there is no device class (the CLI without --class). */
export const ENGINE_INTEGRATION_BAND_HZ: IntegrationBandHz = { startHz: 10, stopHz: 1e6 };

export interface ResolvedSetting<T> {
  value: T;
  source: SettingSource;
}

export interface ResolvedAnalysisSettings {
  integrationBand: ResolvedSetting<IntegrationBandHz>;
  compressionReferenceDbm?: ResolvedSetting<number>;
  /** The impedance of power readings for dBm ↔ Vrms ↔ dBµV (lib/analysis/tables.ts); 50 Ω from the engine when no source states one. */
  impedance: ResolvedSetting<number>;
  /** The bandwidth the phase-noise trace was normalised with, for spurs in dBc; none when no source states one (a file's per-offset column is read by the engine itself). */
  spurBandwidth?: ResolvedSetting<SpurBandwidth>;
}

/** A setting the data cannot honour (a band outside the trace, a reference drive outside the sweep): a 422 in the app, exit 2 in the CLI. */
export class AnalysisSettingError extends Error {
  readonly field: "integrationBand" | "compressionReferenceDbm";
  constructor(field: AnalysisSettingError["field"], message: string) {
    super(message);
    this.name = "AnalysisSettingError";
    this.field = field;
  }
}

export function isAnalysisSettingError(error: unknown): error is AnalysisSettingError {
  return error instanceof AnalysisSettingError;
}

const settingLabels: Record<keyof StatedAnalysisSettings, string> = {
  integrationBandHz: "Integration band",
  compressionReferenceDbm: "Compression reference drive",
  impedanceOhm: "Impedance",
  spurBandwidth: "Analyzer bandwidth",
};

export type SettingLayers = Partial<Record<Exclude<SettingSource, "engine">, StatedAnalysisSettings | undefined>>;

/**
 * Each setting from the first source that states it, in the order of `settingSources`: the file's
 * own `# key: value` lines, then the upload form or bench API, then the command line, then the
 * device class's template; the engine's default last. `conflicts` names a lower source that
 * stated something else, so the caller can say the file's value was kept.
 */
export function resolveAnalysisSettings(layers: SettingLayers): { settings: ResolvedAnalysisSettings; conflicts: string[] } {
  const conflicts: string[] = [];
  const pick = <K extends keyof StatedAnalysisSettings>(key: K, describe: (v: NonNullable<StatedAnalysisSettings[K]>) => string) => {
    let chosen: ResolvedSetting<NonNullable<StatedAnalysisSettings[K]>> | undefined;
    for (const source of settingSources) {
      if (source === "engine") continue;
      const value = layers[source]?.[key];
      if (value === undefined) continue;
      if (!chosen) chosen = { value, source };
      else if (source !== "template" && describe(value) !== describe(chosen.value)) {
        conflicts.push(
          `${settingLabels[key]}: ${settingSourceWords[chosen.source]} says ${describe(chosen.value)}, ${settingSourceWords[source]} said ${describe(value)}; ${settingSourceWords[chosen.source]}'s is used`,
        );
      }
    }
    return chosen;
  };
  const band = pick("integrationBandHz", describeBand);
  const reference = pick("compressionReferenceDbm", describeDbm);
  const impedance = pick("impedanceOhm", describeOhm);
  const spurBandwidth = pick("spurBandwidth", describeSpurBandwidth);
  return {
    settings: {
      integrationBand: band ?? { value: ENGINE_INTEGRATION_BAND_HZ, source: "engine" },
      ...(reference ? { compressionReferenceDbm: reference } : {}),
      impedance: impedance ?? { value: DEFAULT_ANALYSIS_IMPEDANCE_OHM, source: "engine" },
      ...(spurBandwidth ? { spurBandwidth } : {}),
    },
    conflicts,
  };
}

/** "12 kHz–20 MHz", the band as every page prints it. */
export function describeBand(band: IntegrationBandHz, options: { plain?: boolean } = {}): string {
  return formatBand(band.startHz, band.stopHz, "Hz", { plain: options.plain, digits: { maxSignificant: 6 } });
}

function describeDbm(valueDbm: number): string {
  return `${valueDbm > 0 ? "+" : ""}${valueDbm} dBm`;
}

function describeOhm(ohm: number): string {
  return `${ohm} Ω`;
}

/** "resolution bandwidth 1 kHz". */
export function describeSpurBandwidth(bandwidth: SpurBandwidth): string {
  return `${spurBandwidthKindWords[bandwidth.kind]} ${formatQuantity(bandwidth.hz, "Hz", { digits: { maxSignificant: 6 } })}`;
}

/** What a parsed file states about its own analysis (its `# key: value` lines; a Touchstone file's reference impedance). */
export function fileAnalysisSettings(parsed: ParsedMeasurement): StatedAnalysisSettings {
  if (parsed.kind === "touchstone") return { impedanceOhm: parsed.data.referenceOhm[0] };
  const impedance = parsed.data.impedanceOhm !== undefined ? { impedanceOhm: parsed.data.impedanceOhm } : {};
  switch (parsed.kind) {
    case "phase-noise":
      return {
        ...(parsed.data.integrationBandHz ? { integrationBandHz: parsed.data.integrationBandHz } : {}),
        ...(parsed.data.spurBandwidth ? { spurBandwidth: parsed.data.spurBandwidth } : {}),
        ...impedance,
      };
    case "drive-sweep":
    case "two-tone":
      return { ...(parsed.data.compressionReferenceDbm !== undefined ? { compressionReferenceDbm: parsed.data.compressionReferenceDbm } : {}), ...impedance };
    default:
      return impedance;
  }
}

/** The engine's options for resolved settings, merged over any other options. */
export function deriveOptionsFor(settings: ResolvedAnalysisSettings, options: DeriveOptions = {}): DeriveOptions {
  return {
    ...options,
    phaseNoise: { ...options.phaseNoise, integrationBand: settings.integrationBand, ...(settings.spurBandwidth ? { spurBandwidth: settings.spurBandwidth } : {}) },
    compression: { ...options.compression, ...(settings.compressionReferenceDbm ? { referenceInputPowerDbm: settings.compressionReferenceDbm } : {}) },
  };
}
