import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import reference from "./reference/per-frequency-skrf.json";
import { tabulateValues } from "@/lib/analysis";
import { parseMeasurementFile } from "@/lib/ingest";
import type { TouchstoneData } from "@/lib/ingest/types";

// Every frequency of the example Touchstone files against scikit-rf 0.15 (Debian python3-scikit-rf): s_db, s_deg
// and −10·log10(1 − s_mag²) per port. Regenerate with `/usr/bin/python3 scripts/reference/skrf-per-frequency.py`.
type Row = { frequencyHz: number; sDb: number[][]; sDeg: number[][]; mismatchLossDb: number[] };
const files = reference.files as Record<string, { portCount: number; referenceOhm: number; rows: Row[] }>;
const ROOT = path.resolve(__dirname, "../../..");

describe.each(Object.keys(files))("per-frequency values of %s against scikit-rf", (name) => {
  const expected = files[name];
  const bytes = new Uint8Array(readFileSync(path.join(ROOT, "fixtures/examples", name)));
  const parsed = parseMeasurementFile({ fileName: name, bytes });
  // The stored parse is JSON (plain arrays): tabulate that too, as the set page and the API do.
  const data = parsed.data as TouchstoneData;
  const stored = { ...parsed, data: JSON.parse(JSON.stringify({ ...data, frequencyHz: Array.from(data.frequencyHz), sRe: Array.from(data.sRe), sIm: Array.from(data.sIm) })) } as typeof parsed;

  it.each([
    ["typed arrays", parsed],
    ["stored JSON", stored],
  ])("from %s", (_label, input) => {
    const [table] = tabulateValues(input);
    const n = expected.portCount;
    expect(table.rows.length).toBe(expected.rows.length);
    expect(table.impedanceOhm).toBe(expected.referenceOhm);
    expected.rows.forEach((row, k) => {
      const cells = table.rows[k];
      expect(cells[0]).toBeCloseTo(row.frequencyHz, 3);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const at = 1 + 2 * (i * n + j);
          expect(cells[at]).toBeCloseTo(row.sDb[i][j], 9);
          // Phase in (−180°, 180°] both sides; compare modulo 360 for a value at the cut.
          const difference = (cells[at + 1] as number) - row.sDeg[i][j];
          expect(Math.abs(difference - 360 * Math.round(difference / 360))).toBeLessThan(1e-9);
        }
        expect(cells[1 + 2 * n * n + i]).toBeCloseTo(row.mismatchLossDb[i], 9);
      }
    });
  });
});
