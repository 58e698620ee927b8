import { readFileSync } from "node:fs";
import path from "node:path";
import type { SheetInput } from "@/lib/sheet";

export function loadDoublerInput(): SheetInput {
  return JSON.parse(readFileSync(path.resolve(__dirname, "../../../fixtures/sheets/doubler-full.json"), "utf8")) as SheetInput;
}

/** Fisher–Yates with a fixed LCG: a reproducible reordering for determinism tests. */
export function shuffled<T>(items: readonly T[], seed: number): T[] {
  const out = [...items];
  let state = seed;
  for (let i = out.length - 1; i > 0; i--) {
    state = (state * 1103515245 + 12345) % 2147483648;
    const j = state % (i + 1);
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

/**
 * A drive sweep's stored curves that read `values` (by curve id and series) at every drive from +5 to
 * +15 dBm per port: a constructed set's figure at the multiplier's stated drive (+10 dBm) is the value itself.
 */
export function flatDriveCurves(values: { conversionLossDb?: number; suppressionDbc?: Record<number, number> }) {
  const flat = (y: number): [number, number][] => [[5, y], [15, y]];
  const curves = [];
  if (values.conversionLossDb !== undefined) {
    curves.push({ id: "conversion-loss-vs-drive", title: "", x: { label: "Per-port drive", unit: "dBm", scale: "linear" as const }, y: { label: "Conversion loss", unit: "dB" }, series: [{ name: "order 2", points: flat(values.conversionLossDb) }] });
  }
  if (values.suppressionDbc) {
    curves.push({
      id: "harmonic-suppression-vs-drive",
      title: "",
      x: { label: "Per-port drive", unit: "dBm", scale: "linear" as const },
      y: { label: "Suppression", unit: "dBc" },
      series: Object.entries(values.suppressionDbc).map(([order, y]) => ({ name: `order ${order}`, points: flat(y) })),
    });
  }
  return curves;
}
