import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";
import { buildSheetModel } from "@/lib/sheet";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { demoSheetInputs } from "../sheet/demo-inputs";

vi.mock("server-only", () => ({}));

// The demo doubler KDX-2G4's draft: its phase-noise set derives rms jitter and phase over the multiplier
// class's default band (10 Hz – 1 MHz), which the sheet prints in the Offset column of those rows.
describe("the integration band beside rms jitter and rms phase", () => {
  const { input } = demoSheetInputs("2026-12-02").find((d) => d.partNumber === "KDX-2G4")!;
  const model = buildSheetModel(input);

  it("in the sheet model the web sheet draws", () => {
    const rows = model.specifications.rows.filter((r) => r.parameter === "rms-jitter" || r.parameter === "rms-phase-error");
    expect(rows.map((r) => r.label)).toEqual(["RMS jitter", "RMS phase error"]);
    // No-break spaces inside each quantity, and a zero-width space after the dash where a narrow column may wrap.
    for (const row of rows) expect(row.conditions).toContain("10\u00a0Hz – 1\u00a0MHz");
  });

  it("in the PDF, on the same line as the figure", async () => {
    const pdf = await renderSheetPdf(model);
    const dir = mkdtempSync(path.join(tmpdir(), "benchfold-band-"));
    const file = path.join(dir, "kdx-2g4.pdf");
    writeFileSync(file, pdf);
    if (process.env.BENCHFOLD_KEEP_PDF) writeFileSync(process.env.BENCHFOLD_KEEP_PDF, pdf);
    const text = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
    // The Offset column is narrow: the band wraps after its dash, onto the figure's next text line.
    const lines = text.split("\n");
    const at = (label: string) => lines.findIndex((line) => line.includes(label));
    for (const [label, figure] of [["RMS jitter", /10 Hz –\s+25 °C\s+1\.4\s+fs/], ["RMS phase error", /10 Hz –\s+25 °C\s+0\.0010\s+°/]] as const) {
      const i = at(label);
      expect(lines[i]).toMatch(figure);
      // The next text line, past blank lines and letters of the draft's diagonal mark that pdftotext interleaves.
      const next = lines.slice(i + 1).find((line) => line.trim() !== "" && !/^[A-Z]{1,3}$/.test(line.trim()));
      expect(next?.trim()).toBe("1 MHz");
    }
  }, 120_000);
});
