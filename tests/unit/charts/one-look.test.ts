import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { deriveParameters } from "@/lib/analysis";
import { buildCurveSpec, chartConfig, SERIES_STYLES } from "@/lib/charts";
import { tokens } from "@/lib/design/tokens";
import { parseMeasurementFile } from "@/lib/ingest";
import { buildSheetModel } from "@/lib/sheet";
import { colors as pdfColours } from "@/lib/server/pdf/pdf-parts";
import { demoSheetInputs } from "../sheet/demo-inputs";

const ROOT = path.resolve(__dirname, "../../..");

type Look = { colour: string; dash: string; shape?: string };

/** Series label → colour, dash and point shape, read back out of a built Vega-Lite spec. */
function looksOf(spec: Record<string, unknown>): Map<string, Look> {
  const layers = spec.layer as { mark: { type: string }; encoding?: Record<string, { scale?: { domain: string[]; range: unknown[] } }> }[];
  const line = layers.find((l) => l.mark.type === "line")!.encoding!;
  const point = layers.find((l) => l.mark.type === "point" && l.encoding?.shape)?.encoding;
  const looks = new Map<string, Look>();
  line.color.scale!.domain.forEach((label, i) => {
    looks.set(label, {
      colour: String(line.color.scale!.range[i]),
      dash: JSON.stringify(line.strokeDash.scale!.range[i]),
      ...(point ? { shape: String(point.shape.scale!.range[i]) } : {}),
    });
  });
  return looks;
}

function workspaceCurve(file: string, curveId: string) {
  const parsed = parseMeasurementFile({ fileName: file, bytes: readFileSync(path.join(ROOT, "fixtures/examples", file)) });
  const curve = deriveParameters(parsed).curves.find((c) => c.id === curveId);
  if (!curve) throw new Error(`${file} has no curve ${curveId}`);
  return buildCurveSpec(curve, { width: 600 });
}

function sheetChart(partNumber: string, chartId: string) {
  const demo = demoSheetInputs("2026-11-20").find((d) => d.partNumber === partNumber)!;
  const chart = buildSheetModel(demo.input).charts.find((c) => c.id === chartId);
  if (!chart) throw new Error(`${partNumber} has no chart ${chartId}`);
  return chart.vegaLite;
}

describe("the sheet and the workspace draw a series kind alike", () => {
  it.each([
    // A doubler's unwanted orders: the sheet's chart of four units, the workspace's chart of one set.
    ["KDX-2G4", "harmonic-suppression-vs-drive", "drive-sweep-doubler.csv", "harmonic-suppression-vs-drive"],
    ["KDX-2G4", "output-spectrum-vs-drive", "drive-sweep-doubler.csv", "output-spectrum-vs-drive"],
    // A hybrid's transmission paths: insertion loss and isolation.
    ["KQH-2G", "transmission", "hybrid-4port.s4p", "transmission"],
  ])("%s %s against %s %s", (part, chartId, file, curveId) => {
    const sheet = looksOf(sheetChart(part, chartId));
    const workspace = looksOf(workspaceCurve(file, curveId));
    const shared = [...sheet.keys()].filter((label) => workspace.has(label));
    expect(shared.length).toBeGreaterThanOrEqual(2);
    for (const label of shared) {
      const { shape: _shape, ...sheetLook } = sheet.get(label)!; // the sheet draws no points on a dense curve
      const { shape: _other, ...workspaceLook } = workspace.get(label)!;
      expect(sheetLook, label).toEqual(workspaceLook);
    }
    // Traces are never told apart by colour alone: every series of a chart has its own dash.
    for (const looks of [sheet, workspace]) {
      const dashes = [...looks.values()].map((l) => l.dash);
      expect(new Set(dashes).size).toBe(dashes.length);
    }
  });

  it("every style is a token colour with its own dash and shape", () => {
    const tokenColours = new Set<string>(Object.values(tokens.colors));
    for (const style of SERIES_STYLES) expect(tokenColours.has(style.colour), style.colour).toBe(true);
    expect(new Set(SERIES_STYLES.map((s) => JSON.stringify(s.dash))).size).toBe(SERIES_STYLES.length);
    expect(new Set(SERIES_STYLES.map((s) => s.shape)).size).toBe(SERIES_STYLES.length);
  });

  it("the charts and the PDF read the same tokens", () => {
    expect(pdfColours).toBe(tokens.colors);
    const sheetConfig = sheetChart("KDX-2G4", "harmonic-suppression-vs-drive").config as typeof printConfig;
    const printConfig = chartConfig("print");
    expect(sheetConfig).toEqual(printConfig);
    expect((printConfig.axis as Record<string, string>).gridColor).toBe(tokens.colors.rule);
    expect((chartConfig("screen").axis as Record<string, string>).labelColor).toBe(tokens.colors.ink);
  });
});
