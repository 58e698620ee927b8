import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import sharp from "sharp";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
vi.mock("@/models", () => ({ db: () => ({}) }));

import { SheetView } from "@/components/sheet/sheet-view";
import { AppError } from "@/lib/errors";
import { buildSheetModel } from "@/lib/sheet";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { outlinePng } from "@/lib/server/sheets/save-package-outline";
import { loadDoublerInput } from "../fixture";
import { makePng, outlineSvg } from "./outline-fixture";

const dir = mkdtempSync(path.join(tmpdir(), "benchfold-outline-"));

function codeOf(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    return error instanceof AppError ? error.code : String(error);
  }
  return "none";
}

describe("outlinePng", () => {
  it("rasterises a plain SVG to a 1200-pixel-wide PNG whose size sharp (libvips) reads back", async () => {
    const { png, widthPx, heightPx } = outlinePng({ name: "outline.svg", bytes: Buffer.from(outlineSvg) });
    const meta = await sharp(png).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(["png", widthPx, heightPx]);
    expect(widthPx).toBe(1200);
    expect(heightPx).toBe(800); // the drawing's 3:2 viewBox
  });

  it("keeps a PNG as it is and answers 415, 422 and 413 in words for the rest", async () => {
    const png = await makePng(64, 32);
    expect(outlinePng({ name: "o.png", bytes: png }).png.equals(png)).toBe(true);
    expect(codeOf(() => outlinePng({ name: "o.pdf", bytes: Buffer.from("%PDF-1.7") }))).toBe("unsupported-media-type");
    expect(codeOf(() => outlinePng({ name: "o.svg", bytes: Buffer.from(`<svg><script>alert(1)</script></svg>`) }))).toBe("invalid");
    expect(codeOf(() => outlinePng({ name: "o.svg", bytes: Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect`) }))).toBe("invalid");
    expect(codeOf(() => outlinePng({ name: "o.png", bytes: Buffer.concat([png, Buffer.alloc(600 * 1024)]) }))).toBe("payload-too-large");
    // 1 × 10 000 units would be 1200 × 12 000 000 pixels at the raster width: refused before any drawing.
    expect(codeOf(() => outlinePng({ name: "tall.svg", bytes: Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="1" height="10000"><rect width="1" height="10000"/></svg>`) }))).toBe("invalid");
  });
});

describe("the design-in sections on the web sheet and in the PDF", () => {
  it("prints the tables and the drawing in both renderers", async () => {
    const { png, widthPx, heightPx } = outlinePng({ name: "outline.svg", bytes: Buffer.from(outlineSvg) });
    const model = buildSheetModel({
      ...loadDoublerInput(),
      designData: {
        pinFunctions: [{ pin: "2", name: "OUT", function: "Doubled output, DC-blocked" }],
        ordering: [{ partNumber: "OCX-2D40-TR", options: "Screened −40 to +85 °C", packing: "Tape and reel, 500 pieces" }],
        recommendedOperatingConditions: [{ parameter: "Input drive", min: "-3", typ: "13.0", max: "16", unit: "dBm" }],
        packageOutline: { caption: "Dimensions in mm", sha256: "b".repeat(64), widthPx, heightPx, pngBase64: png.toString("base64") },
      },
    });
    const html = renderToStaticMarkup(createElement(SheetView, { model }));
    for (const words of ["Recommended operating conditions", "Pin functions", "Ordering information", "Package outline", "Doubled output, DC-blocked", "\u22123", "13.0"]) {
      expect(html).toContain(words);
    }
    expect(html).toMatch(/<img src="data:image\/png;base64,[^"]+" width="1200" height="800" alt="Package outline: Dimensions in mm"/);

    const file = path.join(dir, "design-in.pdf");
    writeFileSync(file, await renderSheetPdf(model));
    // Headings are set in letter-spaced capitals: compare without spaces and case.
    const text = execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, "").toLowerCase();
    for (const words of ["Recommended operating conditions", "Pin functions", "Ordering information", "Package outline", "OCX-2D40-TR", "Tape and reel, 500 pieces", "\u22123", "13.0", "Doubled output, DC-blocked"]) {
      expect(text).toContain(words.replace(/\s+/g, "").toLowerCase());
    }
    // poppler lists the drawing among the page images at its own pixel size.
    const images = execFileSync("pdfimages", ["-list", file], { encoding: "utf8" });
    expect(images).toMatch(new RegExp(`\\b${widthPx}\\s+${heightPx}\\b`));
  }, 120_000);
});
