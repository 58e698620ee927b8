import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { buildSheetModel, type SheetModel } from "@/lib/sheet";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { combGeneratorTemplate } from "@/templates";
import { loadDoublerInput } from "../sheet/fixture";

const dir = mkdtempSync(path.join(tmpdir(), "benchfold-pdf-"));

function poppler(tool: "pdftotext" | "pdffonts" | "pdfinfo", pdf: Buffer, name: string): string {
  const file = path.join(dir, `${name}.pdf`);
  writeFileSync(file, pdf);
  return execFileSync(tool, tool === "pdftotext" ? [file, "-"] : [file], { encoding: "utf8" });
}

function pageCount(pdf: Buffer, name: string): number {
  return Number(/Pages:\s+(\d+)/.exec(poppler("pdfinfo", pdf, name))?.[1]);
}

describe("renderSheetPdf", () => {
  const input = loadDoublerInput();
  let draft: Buffer;
  let released: Buffer;
  let draftModel: SheetModel;

  beforeAll(async () => {
    draftModel = buildSheetModel(input);
    draft = await renderSheetPdf(draftModel);
    released = await renderSheetPdf(buildSheetModel({ ...input, revision: { ...input.revision, label: "C", state: "released" } }));
  }, 120_000);

  it("writes a multi-page PDF", () => {
    expect(draft.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pageCount(draft, "draft")).toBeGreaterThanOrEqual(2);
  });

  it("prints a limit as typed and, below the organization's minimum of units, the annex's word on a blank Cpk", async () => {
    const text = poppler("pdftotext", draft, "draft").replace(/\s+/g, " ");
    const pn = draftModel.specifications.rows.find((r) => r.rowId === "residual-phase-noise" && r.max.text)!;
    expect(pn.max.text).toBe("\u2212155"); // the fixture states max −155 with no typed digits: never an invented ".0"
    expect(text).not.toContain("\u2212155.0");
    expect(text).not.toContain("Cpk not stated"); // every limited group of the fixture has 10 units
    const strict = buildSheetModel({ ...input, settings: { ...input.settings, cpkMinUnits: 11 } });
    const blank = strict.statistics.groups.filter((g) => g.cpkAbsentReason).length;
    expect(blank).toBeGreaterThan(0);
    const strictText = poppler("pdftotext", await renderSheetPdf(strict), "strict").replace(/\s+/g, " ");
    expect(strictText).toContain("Cpk not stated");
    expect(strictText).toContain(`Cpk is left blank for ${blank} limits: fewer than the 11 units`);
  }, 120_000);

  it("numbers every page k of the real page count, across its page sequences", () => {
    const pages = pageCount(draft, "draft");
    // pdftotext separates pages with a form feed.
    const texts = poppler("pdftotext", draft, "draft").split("\f").slice(0, pages);
    texts.forEach((text, k) => {
      expect(text).toContain(`Page ${k + 1} of ${pages}`);
      expect(text).toContain("OCX-2D40");
    });
  });

  it("stamps the page number on the running foot's line, flush with its right margin", () => {
    const file = path.join(dir, "bbox.pdf");
    writeFileSync(file, draft);
    const words = [...execFileSync("pdftotext", ["-bbox", "-f", "2", "-l", "2", file, "-"], { encoding: "utf8" }).matchAll(
      /xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]+)</g,
    )].map((m) => ({ xMin: Number(m[1]), yMin: Number(m[2]), xMax: Number(m[3]), word: m[5] }));
    const page = words.find((w) => w.word === "Page")!;
    const organization = words.filter((w) => w.word === "Brightwater").at(-1)!; // the foot's first word
    expect(Math.abs(page.yMin - organization.yMin)).toBeLessThan(0.2);
    // A4 is 595.28 pt wide (ISO 216); the sheet's margins are 42 pt.
    const last = words.filter((w) => Math.abs(w.yMin - page.yMin) < 0.2).sort((a, b) => b.xMax - a.xMax)[0];
    expect(last.xMax).toBeCloseTo(595.28 - 42, 1);

    // The glyphs drawn are the right ones, not only the text layer: poppler rasterises the foot
    // (2 px per pt) and the ink spans "Page … of N" from its first letter to its last figure.
    const [x0, y0, w, h] = [Math.floor(page.xMin * 2) - 60, Math.floor(page.yMin * 2) - 4, Math.ceil((last.xMax - page.xMin) * 2) + 120, 30];
    const pgm = execFileSync("pdftoppm", ["-r", "144", "-gray", "-f", "2", "-l", "2", "-x", String(x0), "-y", String(y0), "-W", String(w), "-H", String(h), file]);
    const header = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(pgm.subarray(0, 40).toString("latin1"))!;
    const [width, height] = [Number(header[1]), Number(header[2])];
    const pixels = pgm.subarray(header[0].length);
    const inked: number[] = [];
    for (let x = 0; x < width; x++) {
      for (let y = 0; y < height; y++) if (pixels[y * width + x] < 160) { inked.push(x); break; }
    }
    expect(inked.length).toBeGreaterThan(20);
    expect(Math.abs(x0 + inked[0] - page.xMin * 2)).toBeLessThan(4);
    expect(Math.abs(x0 + inked[inked.length - 1] - last.xMax * 2)).toBeLessThan(4);
  });

  it("carries the part number, Ω, µ and ± as text", () => {
    const text = poppler("pdftotext", draft, "draft");
    expect(text).toContain("OCX-2D40");
    expect(text).toContain("50 Ω");
    expect(text).toContain("25 µm");
    expect(text).toContain("±0.5 dB");
    expect(text).toContain("−155");
    expect(text).toMatch(/Page 1 of \d+/);
  });

  it("sets no ligatures, so words and part numbers copy as their letters", () => {
    const text = poppler("pdftotext", draft, "draft");
    // U+FB00–FB06 are the Latin ligatures (ff, fi, fl, ffi, ffl, ſt, st) of the Unicode Standard's
    // Alphabetic Presentation Forms block; Source Sans 3 would set "offset" with U+FB00.
    expect(text).not.toMatch(/[\uFB00-\uFB06]/u);
    expect(text).toMatch(/offset/);
  });

  it("marks a sheet that is not released, and only that one", () => {
    expect(poppler("pdftotext", draft, "draft")).toContain("PRELIMINARY");
    const text = poppler("pdftotext", released, "released");
    expect(text).not.toContain("PRELIMINARY");
    expect(text).toContain("Rev. C");
  });

  it("embeds only Source Sans 3 and Source Code Pro (no Helvetica fallback)", () => {
    for (const [name, pdf] of [["draft", draft], ["released", released]] as const) {
      const rows = poppler("pdffonts", pdf, name).trim().split("\n").slice(2);
      expect(rows.length).toBeGreaterThan(0);
      for (const row of rows) {
        expect(row).toMatch(/^[A-Z]{6}\+(SourceSans3|SourceCodePro)-\S+\s/);
        expect(row).toMatch(/\syes\s+yes\s+yes\s/);
      }
    }
  });
});

describe("a fourth device class", () => {
  it("renders through both renderers with a template alone", async () => {
    const input = loadDoublerInput();
    const model = buildSheetModel(
      {
        ...input,
        device: { ...input.device, partNumber: "TST-CMB9", deviceClass: combGeneratorTemplate.deviceClass },
        limits: [],
        prose: {},
        absoluteMaximumRatings: [{ label: "Input power", value: "+27", unit: "dBm" }],
      },
      { template: combGeneratorTemplate },
    );
    expect(model.template.label).toBe("Comb generator");
    expect(model.specifications.rows.map((r) => r.conditions[0])).toEqual(["1\u00a0GHz", "2\u00a0GHz", "3\u00a0GHz", "4\u00a0GHz"]);
    const pdf = await renderSheetPdf(model);
    const text = poppler("pdftotext", pdf, "comb");
    expect(text).toContain("TST-CMB9");
    expect(text).toContain("Conversion loss");
    expect(text).toContain("±1 dB flat comb");
  }, 60_000);
});
