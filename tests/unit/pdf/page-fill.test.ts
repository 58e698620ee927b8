import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { buildSheetModel, type SheetModel } from "@/lib/sheet";
import { chartSizes } from "@/lib/charts/styles";
import { renderChartSvg } from "@/lib/server/charts/render-chart";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { A4_HEIGHT_PT, printedTypeScale } from "@/lib/sheet/print-figure";
import { demoSheetInputs } from "../sheet/demo-inputs";

const dir = mkdtempSync(path.join(tmpdir(), "benchfold-fill-"));

/** The page body: below the running head (the page's top padding) and above the running foot (render-sheet-pdf.tsx). */
const BODY_TOP_PT = 56;
const BODY_BOTTOM_PT = A4_HEIGHT_PT - 50;

type Word = { yMin: number; yMax: number; xMin: number; text: string };

/** Every page's words as poppler's pdftotext -bbox places them (points from the top of the page). */
function pageWords(file: string): Word[][] {
  const html = execFileSync("pdftotext", ["-bbox", file, "-"], { encoding: "utf8" });
  return html
    .split("<page ")
    .slice(1)
    .map((page) =>
      [...page.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="[\d.]+" yMax="([\d.]+)">([^<]*)<\/word>/g)].map((m) => ({
        xMin: Number(m[1]),
        yMin: Number(m[2]),
        yMax: Number(m[3]),
        text: m[4],
      })),
    );
}

/** How far down the body a page's ink reaches (0 empty, 1 full): its lowest word; every figure and table ends in a caption, a rule's row or a note. */
function fill(words: Word[]): number {
  const body = words.filter((w) => w.yMin >= BODY_TOP_PT - 1 && w.yMax <= BODY_BOTTOM_PT + 1);
  if (!body.length) return 0;
  return (Math.max(...body.map((w) => w.yMax)) - BODY_TOP_PT) / (BODY_BOTTOM_PT - BODY_TOP_PT);
}

/** The first line of a page's body, letters only, lower case (headings are letter-spaced capitals). */
function firstLine(words: Word[]): string {
  const body = words.filter((w) => w.yMin >= BODY_TOP_PT - 1 && w.yMax <= BODY_BOTTOM_PT + 1);
  if (!body.length) return "";
  const top = Math.min(...body.map((w) => w.yMin));
  return body
    .filter((w) => w.yMin < top + 2)
    .sort((a, b) => a.xMin - b.xMin)
    .map((w) => w.text)
    .join("")
    .toLowerCase()
    .replace(/[^a-z]/g, "");
}

/** The headings that open the PDF's page sequences after the first (lib/server/pdf/render-sheet-pdf.tsx). */
function sequenceOpenings(model: SheetModel): string[] {
  const later = model.prose.filter((s) => s.id !== "description" && s.id !== "features");
  const letters = (s: string) => s.toLowerCase().replace(/[^a-z]/g, "");
  return [
    ...(model.charts.length ? ["absolutemaximumratings"] : []),
    letters(later[0]?.title ?? "Measurement traceability"),
    "statisticsannex",
  ];
}

const sheets = demoSheetInputs("2026-12-01").map(({ partNumber, input }) => ({
  partNumber,
  model: buildSheetModel({ ...input, revision: { ...input.revision, label: "A", state: "released" } }),
}));

describe("the printed demo sheets", () => {
  const pages = new Map<string, Word[][]>();

  beforeAll(async () => {
    for (const { partNumber, model } of sheets) {
      const file = path.join(dir, `${partNumber}.pdf`);
      writeFileSync(file, await renderSheetPdf(model));
      pages.set(partNumber, pageWords(file));
    }
  }, 600_000);

  it.each(sheets.map((s) => [s.partNumber, s.model] as const))("%s leaves no page more than half empty but the last of a sequence", (partNumber, model) => {
    const words = pages.get(partNumber)!;
    const openings = sequenceOpenings(model);
    const opens = words.map((w, i) => i === 0 || openings.some((o) => firstLine(w).startsWith(o)));
    // Each opening heading is found on exactly one page: the test reads the sequences it means to.
    expect(opens.filter(Boolean).length).toBe(1 + openings.length);
    const fills = words.map(fill);
    console.log(`[page fill] ${partNumber}: ${fills.map((f, i) => `${Math.round(f * 100)}%${opens[i + 1] || i === words.length - 1 ? "|" : ""}`).join(" ")}`);
    const short = fills
      .map((f, i) => ({ page: i + 1, fill: Math.round(f * 100) / 100, lastOfSequence: i === words.length - 1 || opens[i + 1] }))
      .filter((p) => p.fill < 0.5 && !p.lastOfSequence);
    expect(short, `${partNumber}: pages ${fills.map((f) => Math.round(f * 100)).join(" / ")} % full`).toEqual([]);
  });

  it.each(sheets.filter((s) => s.model.specifications.rows.length > 0).map((s) => [s.partNumber, s.model] as const))(
    "%s prints each condition of its specifications table unbroken",
    (partNumber, model) => {
      // A condition cell too narrow for its value makes react-pdf break a value with a hyphen ("70 -" over "MHz"):
      // poppler then reads the halves on two lines. The table's text runs from its head ("PARAMETER") to the basis
      // legend under it; in it, each value and its unit (one word, joined by a no-break space) is read on one line.
      const text = execFileSync("pdftotext", ["-layout", path.join(dir, `${partNumber}.pdf`), "-"], { encoding: "utf8" });
      const table = text.slice(text.indexOf("PARAMETER"), text.indexOf("Basis: T"));
      const lines = table.split("\n").map((line) => line.replace(/\s+/g, " "));
      const words = new Set(model.specifications.rows.flatMap((row) => row.conditions.flatMap((cell) => cell.split(" ").filter((word) => word.includes("\u00a0")))));
      expect(words.size).toBeGreaterThan(0);
      for (const word of words) expect(lines.some((line) => line.includes(word.replace(/\u00a0/g, " "))), `${partNumber}: "${word}"`).toBe(true);
    },
  );

  it("measures what pdftoppm draws: the lowest dark row of a rendered page lies where the lowest word ends", () => {
    const { partNumber } = sheets.find((s) => s.model.charts.length > 0)!;
    const words = pages.get(partNumber)!;
    for (const page of [1, 2]) {
      // 72 dpi grey: one pixel a point. A PGM (P5) is a header of three numbers, then one byte a pixel.
      const pgm = execFileSync("pdftoppm", ["-gray", "-r", "72", "-f", String(page), "-l", String(page), path.join(dir, `${partNumber}.pdf`)]);
      const header = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(pgm.subarray(0, 40).toString("latin1"))!;
      const [width, height] = [Number(header[1]), Number(header[2])];
      const pixels = pgm.subarray(header[0].length);
      let lowest = 0;
      for (let y = BODY_TOP_PT; y < Math.min(height, BODY_BOTTOM_PT); y++) {
        for (let x = 0; x < width; x++) if (pixels[y * width + x] < 160) lowest = y;
      }
      const drawn = (lowest + 1 - BODY_TOP_PT) / (BODY_BOTTOM_PT - BODY_TOP_PT);
      expect(Math.abs(drawn - fill(words[page - 1])), `page ${page}`).toBeLessThan(0.03);
    }
  });

  it.each(sheets.map((s) => [s.partNumber, s.model] as const))("%s prints no chart type smaller than 7 pt", async (_partNumber, model) => {
    const smallest = Math.min(...Object.values(chartSizes("print")).filter((v, i) => Object.keys(chartSizes("print"))[i] !== "strokeWidth" && Object.keys(chartSizes("print"))[i] !== "viewStroke"));
    for (const chart of model.charts) {
      const svg = await renderChartSvg(chart.vegaLite as Record<string, unknown>);
      const width = Number(/<svg[^>]* width="([\d.]+)"/.exec(svg)![1]);
      // Every font-size Vega wrote into the drawing, at the scale the PDF prints it.
      const sizes = [...svg.matchAll(/font-size(?:="|:\s*)([\d.]+)/g)].map((m) => Number(m[1]));
      expect(sizes.length, chart.id).toBeGreaterThan(0);
      expect(Math.min(...sizes) * printedTypeScale(width), `${chart.id}: ${width} wide`).toBeGreaterThanOrEqual(7);
      expect(smallest * printedTypeScale(width)).toBeGreaterThanOrEqual(7);
    }
  }, 120_000);
});
