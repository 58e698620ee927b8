import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { buildSheetModel, type SheetModel } from "@/lib/sheet";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { loadDoublerInput } from "../sheet/fixture";

/** The PDF's text as poppler's pdftotext reads it, independently of the renderer that wrote it. */
function pdfText(pdf: Buffer): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), "benchfold-pdf-")), "sheet.pdf");
  writeFileSync(file, pdf);
  return execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
}

describe("minus signs in a PDF's text", () => {
  // Its own file: the renderer's fonts live once per process, and this is about what an earlier sheet leaves behind.
  it("survive a sheet printed before it that had none (a server prints many sheets in one process)", { timeout: 120_000 }, async () => {
    const doubler = buildSheetModel(loadDoublerInput());
    const negative = doubler.specifications.rows.flatMap((r) => [r.min, r.typ, r.max]).filter((c) => c.value !== null && c.value < 0);
    expect(negative.length).toBeGreaterThan(0);
    // The same sheet with every minus sign taken out: its figures still carry hyphens (dates), drawn in the
    // figure font, whose hyphen glyph is built from the minus glyph.
    const withoutMinus = JSON.parse(JSON.stringify(doubler).replaceAll("\u2212", "")) as SheetModel;
    expect(pdfText(await renderSheetPdf(withoutMinus))).not.toContain("\u2212");
    const text = pdfText(await renderSheetPdf(doubler));
    for (const cell of negative) expect(text, cell.text).toContain(cell.text);
  });
});
