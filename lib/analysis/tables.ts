import type { ParsedMeasurement, TouchstoneData } from "../ingest/types";
import type { SettingSource } from "../domain/analysis-settings";
import { convertDbmToDbuv, convertDbmToVrms, DEFAULT_IMPEDANCE_OHM } from "../rf/units";

export interface ValueTableColumn {
  label: string;
  unit: string;
}

/**
 * Every value of a measurement at each of its points (frequency or drive step), not only a band's
 * worst case and centre: plain JSON for the CLI's --json, the set page and the bench API.
 */
export interface ValueTable {
  id: string;
  title: string;
  /** Impedance the Vrms and dBµV columns are referred to, Ω. */
  impedanceOhm?: number;
  /** Who stated that impedance: the file (a Touchstone file's reference impedance, or `# impedance:`), the upload, the command line, or Benchfold's default. */
  impedanceSource?: SettingSource;
  x: ValueTableColumn;
  columns: ValueTableColumn[];
  /** One row per point: x first, then one cell per column (null where a value cannot be computed). */
  rows: (number | null)[][];
}

export interface TabulateOptions {
  /** For dBm ↔ Vrms ↔ dBµV of CSV power readings; a Touchstone file's own reference impedance is used for it. 50 Ω by default. */
  impedanceOhm?: number;
  /** Where `impedanceOhm` came from (lib/analysis/settings.ts resolveAnalysisSettings); "engine" when it is not given. */
  impedanceSource?: SettingSource;
}

/**
 * The per-point tables of a parsed file. Computed on demand from the stored parse, never stored:
 * a 10,001-frequency s4p gives 10,001 rows of 36 values.
 */
export function tabulateValues(parsed: ParsedMeasurement, options: TabulateOptions = {}): ValueTable[] {
  const impedanceOhm = options.impedanceOhm ?? DEFAULT_IMPEDANCE_OHM;
  const impedanceSource: SettingSource = options.impedanceOhm === undefined ? "engine" : (options.impedanceSource ?? "engine");
  switch (parsed.kind) {
    case "touchstone":
      return [tabulateSParameters(parsed.data)];
    case "drive-sweep":
      return [
        powerTable({
          id: "output-power-per-step",
          title: "Output power of each order at each drive step",
          x: { label: "Source power", unit: "dBm", values: parsed.data.inputPowerDbm },
          series: parsed.data.harmonics.map((h) => ({ label: `order ${h.order}`, valuesDbm: h.outputPowerDbm })),
          impedanceOhm,
          impedanceSource,
        }),
      ];
    case "two-tone":
      return [
        powerTable({
          id: "two-tone-per-step",
          title: "Tone and third-order product output at each input level",
          x: { label: "Input per tone", unit: "dBm", values: parsed.data.inputPowerPerToneDbm },
          series: [
            { label: "tone", valuesDbm: parsed.data.fundamentalOutputDbm },
            { label: "IM3", valuesDbm: parsed.data.im3OutputDbm },
          ],
          impedanceOhm,
          impedanceSource,
        }),
      ];
    case "frequency-sweep": {
      const { frequencyHz, inputPowerDbm, outputPowerDbm } = parsed.data;
      const series = [
        ...(inputPowerDbm ? [{ label: "input", valuesDbm: inputPowerDbm }] : []),
        ...(outputPowerDbm ? [{ label: "output", valuesDbm: outputPowerDbm }] : []),
      ];
      if (series.length === 0) return [];
      return [powerTable({ id: "power-per-frequency", title: "Power at each frequency", x: { label: "Frequency", unit: "Hz", values: frequencyHz }, series, impedanceOhm, impedanceSource })];
    }
    case "phase-noise":
      return [];
  }
}

/** Each power reading as dBm, Vrms and dBµV into the impedance (lib/rf/units: Vrms = √(P·Z), dBµV = dBm + 10·log10(Z·10⁻³) + 120). */
function powerTable(input: {
  id: string;
  title: string;
  x: ValueTableColumn & { values: ArrayLike<number> };
  series: { label: string; valuesDbm: ArrayLike<number> }[];
  impedanceOhm: number;
  impedanceSource: SettingSource;
}): ValueTable {
  const { x, series, impedanceOhm, impedanceSource } = input;
  const columns: ValueTableColumn[] = [];
  for (const s of series) {
    columns.push({ label: `${s.label}`, unit: "dBm" }, { label: `${s.label}`, unit: "Vrms" }, { label: `${s.label}`, unit: "dBµV" });
  }
  const rows: (number | null)[][] = [];
  for (let k = 0; k < x.values.length; k++) {
    const row: (number | null)[] = [x.values[k]];
    for (const s of series) {
      const dbm = s.valuesDbm[k];
      row.push(dbm, convertDbmToVrms(dbm, impedanceOhm), convertDbmToDbuv(dbm, impedanceOhm));
    }
    rows.push(row);
  }
  return { id: input.id, title: input.title, impedanceOhm, impedanceSource, x: { label: x.label, unit: x.unit }, columns, rows };
}

/**
 * |Sij| in dB and ∠Sij in degrees (atan2, −180° to 180°, as scikit-rf's s_deg) for every path, and each
 * port's mismatch loss −10·log10(1 − |Sii|²) (Pozar, Microwave Engineering §2.3), at every frequency.
 */
function tabulateSParameters(data: TouchstoneData): ValueTable {
  const n = data.portCount;
  const count = data.frequencyHz.length;
  const columns: ValueTableColumn[] = [];
  // S(i,j) at frequency k is at (i·N + j)·F + k (lib/ingest/types.ts); read by index so that a parse
  // stored as JSON (plain arrays, not typed ones) tabulates the same.
  const { sRe, sIm } = data;
  const entries: number[] = [];
  for (let i = 1; i <= n; i++) {
    for (let j = 1; j <= n; j++) {
      columns.push({ label: `S${i}${j}`, unit: "dB" }, { label: `S${i}${j}`, unit: "deg" });
      entries.push(((i - 1) * n + (j - 1)) * count);
    }
  }
  for (let i = 1; i <= n; i++) columns.push({ label: `mismatch loss port ${i}`, unit: "dB" });
  const rows: (number | null)[][] = [];
  for (let k = 0; k < count; k++) {
    const row: (number | null)[] = [data.frequencyHz[k]];
    for (const start of entries) {
      const re = sRe[start + k];
      const im = sIm[start + k];
      row.push(20 * Math.log10(Math.hypot(re, im)), (Math.atan2(im, re) * 180) / Math.PI);
    }
    for (let i = 1; i <= n; i++) {
      const start = entries[(i - 1) * n + (i - 1)];
      const magnitudeSquared = sRe[start + k] ** 2 + sIm[start + k] ** 2;
      row.push(magnitudeSquared < 1 ? -10 * Math.log10(1 - magnitudeSquared) : null);
    }
    rows.push(row);
  }
  return {
    id: "s-parameters-per-frequency",
    title: "S-parameters and mismatch loss at each frequency",
    impedanceOhm: data.referenceOhm[0],
    impedanceSource: "file",
    x: { label: "Frequency", unit: "Hz" },
    columns,
    rows,
  };
}
