import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { deriveParameters } from "@/lib/analysis";
import { buildCurveSpec, chartConfig, SERIES_STYLES, seriesStyleIndex } from "@/lib/charts";
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
    // A hybrid's transmission paths: insertion loss and isolation, each a chart of its own on the sheet.
    ["KQH-2G", "insertion-loss", "hybrid-4port.s4p", "transmission"],
    ["KQH-2G", "isolation", "hybrid-4port.s4p", "transmission"],
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

describe("a series' style", () => {
  it.each<[string, string[], number]>([
    ["order 1", ["order 1", "order 3", "order 4"], 0],
    ["order 3", ["order 1", "order 3", "order 4"], 2], // by its order, not its place in the list
    ["order 2", ["order 2"], 1],
    ["port 4", ["port 1", "port 4"], 3],
    ["isolation S41", ["insertion loss S21", "insertion loss S31", "isolation S41"], 2],
    ["IM3", ["tone", "IM3"], 1],
  ])("%s among %j is style %d", (name, names, index) => {
    expect(seriesStyleIndex(name, names)).toBe(index);
  });

  it("a lone series is drawn in ink, leaving the accent to the markers", () => {
    const spec = buildCurveSpec({
      id: "c",
      title: "Conversion loss",
      x: { label: "Drive", unit: "dBm", scale: "linear" },
      y: { label: "Loss", unit: "dB", scale: "linear" },
      series: [{ name: "order 2", points: [[0, 10], [1, 9]] }],
      markers: [{ x: 1, y: 9, label: "optimum drive" }],
    });
    expect(looksOf(spec).get("2nd harmonic (×2)")).toMatchObject({ colour: tokens.colors.ink, dash: "[]" });
    const markerLayer = (spec.layer as { mark: { type: string; filled?: boolean; color?: string } }[]).find((l) => l.mark.type === "point" && l.mark.filled === false);
    expect(markerLayer?.mark.color).toBe(tokens.colors.signal);
  });
});
