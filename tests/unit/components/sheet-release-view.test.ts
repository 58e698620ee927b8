import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SheetView, type SheetViewProps } from "@/components/sheet/sheet-view";
import { doublerCandidateAndRelease, doublerSignatures, doublerVerification } from "../sheet/released-fixture";

function render(props: SheetViewProps): string {
  return renderToStaticMarkup(createElement(SheetView, props));
}

/** The page's words without markup, with entities a test looks for decoded and spaces collapsed. */
function textOf(html: string): string {
  return html
    .replace(/<style>[\s\S]*?<\/style>/g, "")
    .replace(/<[^>]+>/g, " ")
    .replaceAll("&#x27;", "'")
    .replaceAll("&quot;", '"')
    .replaceAll("&amp;", "&")
    .replace(/\s+/g, " ")
    .replace(/ ([.,:])/g, "$1")
    .trim();
}

/** The markup of the element carrying data-testid="id", up to its closing tag (no nesting of the same tag inside). */
function part(html: string, id: string): string {
  const start = html.indexOf(`data-testid="${id}"`);
  if (start < 0) return "";
  const open = html.lastIndexOf("<", start);
  const tag = /^<(\w+)/.exec(html.slice(open))![1];
  return html.slice(open, html.indexOf(`</${tag}>`, start) + tag.length + 3);
}

describe("the web sheet of a released revision", () => {
  const { candidate, released } = doublerCandidateAndRelease();
  const html = render({ model: released });
  const text = textOf(html);

  it("sets the sheet's notation in the release notes and the history (T_A as T with a subscript A)", () => {
    expect(html).not.toContain("T_A");
    expect(html).toContain('<span class="whitespace-nowrap">T<sub>A</sub></span> 25 °C): max 11.50');
    expect(html).toContain('tightened fundamental suppression at <span class="whitespace-nowrap">T<sub>A</sub></span> 25 °C');
  });

  it("names the revision and carries no preliminary banner", () => {
    expect(html).not.toMatch(/PRELIMINARY/i);
    expect(text).not.toContain("Unreleased");
    expect(text).toContain("Brightwater Microwave Works · Rev. C · Released · 2026-12-02");
  });

  // 21 CFR Part 11 §11.50(a)–(b): every human-readable form of a signed electronic record shows the
  // signer's printed name, the date and time of signing and the signature's meaning. §11.70: the
  // signature is linked to its record, here by the full SHA-256 of the candidate it signs.
  it("prints each signature: printed name, role, organization, UTC date and time, meaning and the full digest", () => {
    const entries = html.split('data-testid="sheet-signature"').slice(1).map(textOf);
    expect(entries).toHaveLength(doublerSignatures.length);
    const times = ["2026-12-02 09:14:05 UTC", "2026-12-02 10:02:47 UTC"];
    doublerSignatures.forEach((signature, i) => {
      const entry = entries[i];
      expect(entry).toContain(signature.name);
      expect(entry).toContain(`${signature.role}, ${signature.organizationName}`);
      expect(entry).toContain(`Signed (UTC) ${times[i]}`);
      expect(entry).toContain(`Meaning: ${signature.meaning}`);
      expect(signature.candidateDigest).toMatch(/^[0-9a-f]{64}$/);
      expect(entry).toContain(`Signs the candidate with SHA-256: ${signature.candidateDigest}`);
    });
    expect(html).toContain(`<time dateTime="${doublerSignatures[0].signedAt}"`);
  });

  it("states the release date, where to verify it, and the release notes", () => {
    const record = textOf(part(html, "sheet-release"));
    expect(record).toContain(
      `Rev. C of OCX-2D40, released 2026-12-02. Its public record: ${doublerVerification.verificationReference} at ${doublerVerification.verificationUrl}.`,
    );
    expect(html).toContain(`href="${doublerVerification.verificationUrl}"`);
    expect(record).toContain("Release notes, Rev. C");
    // A note in the sheet's notation ("T_A") is set with a subscript: its words around the symbol are compared.
    for (const note of released.release!.notes) for (const piece of note.split("T_A")) expect(record).toContain(piece.trim());
  });

  it("ends with the foot the PDF prints on every page: part, revision and the verification reference", () => {
    expect(textOf(part(html, "sheet-foot"))).toBe(
      `Brightwater Microwave Works · OCX-2D40 Rev. C Verify: ${doublerVerification.verificationReference} at ${doublerVerification.verificationUrl}`,
    );
  });

  it("leaves a draft as it was: the preliminary banner, no release record and no verification reference", () => {
    const draft = render({ model: candidate });
    expect(draft).toContain("PRELIMINARY — NOT RELEASED");
    expect(draft).not.toContain('data-testid="sheet-release"');
    expect(draft).not.toContain('data-testid="sheet-signature"');
    expect(draft).not.toContain("Verify:");
    expect(textOf(part(draft, "sheet-foot"))).toBe("Brightwater Microwave Works · OCX-2D40 Unreleased");
  });
});

describe("a withdrawn revision on the web", () => {
  const { released } = doublerCandidateAndRelease();
  const withdrawn = { reason: "Conversion loss at 85 °C was measured with a <mis-set> cable loss.", withdrawnOn: "2026-12-09" };

  it("opens with a withdrawn notice: the word, a mark that is not colour, the date and the reason", () => {
    const html = render({ model: released, withdrawn });
    const notice = part(html, "sheet-withdrawn");
    // The reason is the withdrawer's text: escaped, never markup.
    expect(notice).not.toContain("<mis-set>");
    expect(textOf(notice)).toBe(
      "Withdrawn Rev. C was withdrawn on 2026-12-09. Do not design in from it; it stays here as it was released. Reason: Conversion loss at 85 °C was measured with a &lt;mis-set&gt; cable loss.",
    );
    expect(notice).toMatch(/<svg[^>]*aria-hidden="true"/);
    expect(notice).toContain("<circle");
    // Above the title, so nobody reads the figures first.
    expect(html.indexOf('data-testid="sheet-withdrawn"')).toBeLessThan(html.indexOf('id="sheet-title"'));
  });

  it("keeps the frozen release record unchanged beneath it", () => {
    const plain = render({ model: released });
    const html = render({ model: released, withdrawn });
    expect(part(html, "sheet-release")).toBe(part(plain, "sheet-release"));
    expect(plain).not.toContain('data-testid="sheet-withdrawn"');
  });

  it("prints the day of a withdrawal given as a UTC time", () => {
    const html = render({ model: released, withdrawn: { ...withdrawn, withdrawnOn: "2026-12-09T23:40:00Z" } });
    expect(textOf(part(html, "sheet-withdrawn"))).toContain("was withdrawn on 2026-12-09.");
  });
});
