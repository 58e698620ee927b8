import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import type { SheetModel } from "@/lib/sheet";
import { sheetPdfFileName } from "@/lib/sheet/file-name";
import { renderSheetPdf } from "@/lib/server/pdf/render-sheet-pdf";
import { doublerCandidateAndRelease, doublerSignatures, doublerVerification } from "../sheet/released-fixture";

const dir = mkdtempSync(path.join(tmpdir(), "benchfold-released-pdf-"));

function pdfFile(pdf: Buffer, name: string): string {
  const file = path.join(dir, `${name}.pdf`);
  writeFileSync(file, pdf);
  return file;
}

/** The whole text as poppler reads it (independently of the renderer that wrote it), one entry per page. */
function pageTexts(file: string): string[] {
  return execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).split("\f").slice(0, -1);
}

/** A4 is 841.89 pt tall (ISO 216); the running head sits above 50 pt, the foot below 785 pt (the body ends above both). */
const A4_HEIGHT_PT = 841.89;
type Band = "head" | "foot";

/** Each page's running head and foot as text, from pdftotext's word boxes (y measured from the page's top). */
function bands(file: string): Record<Band, string>[] {
  const xml = execFileSync("pdftotext", ["-bbox", file, "-"], { encoding: "utf8" });
  return xml
    .split("<page ")
    .slice(1)
    .map((page) => {
      const words = [...page.matchAll(/yMin="([\d.]+)" xMax="[\d.]+" yMax="[\d.]+">([^<]+)</g)].map((m) => ({ y: Number(m[1]), word: m[2] }));
      const join = (keep: (y: number) => boolean) =>
        words
          .filter((w) => keep(w.y))
          .map((w) => w.word)
          .join(" ")
          .replaceAll("&amp;", "&");
      return { head: join((y) => y < 50), foot: join((y) => y > A4_HEIGHT_PT - 57) };
    });
}

describe("a released sheet's PDF", () => {
  let released: SheetModel;
  let candidate: SheetModel;
  let releasedFile: string;
  let draftFile: string;

  beforeAll(async () => {
    ({ candidate, released } = doublerCandidateAndRelease());
    releasedFile = pdfFile(await renderSheetPdf(released), "released");
    draftFile = pdfFile(await renderSheetPdf(candidate), "draft");
  }, 120_000);

  it("prints the revision letter in the running head and the running foot of every page", () => {
    const pages = bands(releasedFile);
    expect(pages.length).toBeGreaterThanOrEqual(2);
    pages.forEach(({ head, foot }, k) => {
      expect(head, `head of page ${k + 1}`).toContain("Rev. C · released 2026-12-02");
      expect(foot, `foot of page ${k + 1}`).toContain("OCX-2D40 Rev. C");
      expect(foot, `foot of page ${k + 1}`).toContain(`Page ${k + 1} of ${pages.length}`);
    });
  });

  it("stamps the page number on the foot's first line, which rose by one line to make room for the reference", () => {
    const xml = execFileSync("pdftotext", ["-bbox", "-f", "1", "-l", "1", releasedFile, "-"], { encoding: "utf8" });
    const words = [...xml.matchAll(/yMin="([\d.]+)" xMax="[\d.]+" yMax="([\d.]+)">([^<]+)</g)].map((m) => ({ yMin: Number(m[1]), yMax: Number(m[2]), word: m[3] }));
    const page = words.find((w) => w.word === "Page")!;
    const org = words.filter((w) => w.word === "Brightwater").at(-1)!; // the foot's first word
    const verify = words.find((w) => w.word === "Verify:")!;
    expect(Math.abs(page.yMin - org.yMin)).toBeLessThan(0.2);
    expect(verify.yMin).toBeGreaterThan(page.yMax - 0.5);
    // The reference line stays clear of the paper's last 20 pt (about 7 mm), where printers may not print.
    expect(verify.yMax).toBeLessThan(A4_HEIGHT_PT - 20);
  });

  it("prints the verification reference in the foot of every page", () => {
    const pages = bands(releasedFile);
    pages.forEach(({ foot }, k) => {
      expect(foot, `foot of page ${k + 1}`).toContain(`Verify: ${doublerVerification.verificationReference} at ${doublerVerification.verificationUrl}`);
    });
  });

  it("carries no preliminary mark, no 'Unreleased' and no review notes", () => {
    const text = pageTexts(releasedFile).join("\n");
    expect(text).not.toMatch(/PRELIMINARY/i);
    expect(text).not.toContain("Unreleased");
    expect(text).not.toContain("Review notes");
  });

  // 21 CFR Part 11 §11.50(a)–(b): a signed electronic record shows, in every human-readable form of it,
  // the signer's printed name, the date and time of signing, and the meaning of the signature.
  // §11.70: the signature is linked to its record, here by the full SHA-256 of the signed candidate.
  it("prints every signature: printed name, role, organization, UTC date and time, meaning and the full candidate digest", () => {
    const text = pageTexts(releasedFile).join("\n");
    // (Section headings are letter-spaced capitals, which pdftotext reads as single letters: not asserted.)
    expect(text.split("Signed (UTC)").length - 1).toBe(doublerSignatures.length);
    for (const signature of doublerSignatures) {
      expect(text).toContain(signature.name);
      expect(text).toContain(`${signature.role}, ${signature.organizationName}`);
      expect(text).toContain(signature.meaning);
    }
    expect(text).toContain("2026-12-02 09:14:05 UTC");
    expect(text).toContain("2026-12-02 10:02:47 UTC");
    // All 64 hex digits, unbroken, once per signature (both signed the same candidate).
    const digest = doublerSignatures[0].candidateDigest;
    expect(digest).toMatch(/^[0-9a-f]{64}$/);
    expect(text.split(digest).length - 1).toBe(2);
  });

  it("prints the release date and the release notes", () => {
    const text = pageTexts(releasedFile).join("\n").replace(/\s+/g, " ");
    expect(text).toContain("Rev. C of OCX-2D40, released 2026-12-02");
    expect(text).toContain("Release notes, Rev. C");
    // A note in the sheet's notation ("T_A") is set with a subscript: its words around the symbol are compared.
    for (const note of released.release!.notes) for (const piece of note.split("T_A")) expect(text).toContain(piece.trim());
    // The revision history gains this revision's line.
    expect(text).toContain("C 2026-12-02 Guaranteed 85 °C conversion loss");
  });

  it("sets the sheet's notation in the release notes and the history: T_A as T with a subscript A, never the raw underscore", () => {
    const text = pageTexts(releasedFile).join("\n");
    expect(text).not.toContain("T_A");
    expect(text).toContain("max 11.50 dB → 11.00 dB (tightened)");
  });

  it("names the revision in the document title and sets no ligatures", () => {
    const info = execFileSync("pdfinfo", [releasedFile], { encoding: "utf8" });
    expect(info).toMatch(/^Title:\s+OCX-2D40 .*\(Rev\. C\)$/m);
    // U+FB00–FB06: the Latin ligatures of Unicode's Alphabetic Presentation Forms block.
    expect(pageTexts(releasedFile).join("\n")).not.toMatch(/[\uFB00-\uFB06]/u);
  });

  it("is offered for download as <part>-rev-<letter>.pdf", () => {
    expect(sheetPdfFileName(released.header.partNumber, released.header.revisionLabel)).toBe("OCX-2D40-rev-C.pdf");
    expect(sheetPdfFileName(candidate.header.partNumber, candidate.header.revisionLabel)).toBe("OCX-2D40-draft.pdf");
  });

  it("leaves a draft as it was: the preliminary mark, and no signature block or verification reference", () => {
    const text = pageTexts(draftFile).join("\n");
    expect(text).toContain("PRELIMINARY — NOT RELEASED");
    expect(text).not.toContain("Signed (UTC)");
    expect(text).not.toContain("Signs the candidate");
    expect(text).not.toContain("Verify:");
    expect(text).not.toContain(doublerSignatures[0].candidateDigest);
    bands(draftFile).forEach(({ head, foot }, k) => {
      expect(head, `head of page ${k + 1}`).toContain("Unreleased · 2026-02-03 · In review");
      expect(foot, `foot of page ${k + 1}`).toContain("OCX-2D40 Unreleased");
    });
  });
});
