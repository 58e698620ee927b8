import { describe, expect, it } from "vitest";
import { releasedPageDescription, releasedPageTitle } from "@/lib/sheet/released-page-words";

// The released page's title and description for each standing: a superseded or withdrawn revision
// never reads like the one to design in from.

const base = { letter: "A", releasedAt: "2026-11-30T22:15:00.000Z", withdrawal: null };

describe("released page words", () => {
  it.each([
    ["current", { ...base, standing: "current" as const }, "KDX-2G4 Rev. A"],
    ["superseded", { ...base, standing: "superseded" as const }, "KDX-2G4 Rev. A (superseded)"],
    ["withdrawn", { ...base, standing: "withdrawn" as const }, "KDX-2G4 Rev. A (withdrawn)"],
  ])("title of a %s revision", (_, revision, title) => {
    expect(releasedPageTitle("KDX-2G4", revision)).toBe(title);
  });

  it("the current revision: who released it, on which UTC day", () => {
    expect(releasedPageDescription({ title: "Passive ×2 multiplier", organizationName: "Kestrine Microwave", revision: { ...base, standing: "current" }, currentLetter: "A" })).toBe(
      "Passive ×2 multiplier. Revision A of the datasheet, released by Kestrine Microwave on 2026-11-30; the current revision.",
    );
  });

  it("a superseded revision names the current one", () => {
    expect(releasedPageDescription({ title: "T", organizationName: "O", revision: { ...base, standing: "superseded" }, currentLetter: "C" })).toBe(
      "T. Revision A of the datasheet, released by O on 2026-11-30; superseded by revision C.",
    );
  });

  it("a withdrawn revision gives the day and the reason, and the current revision when there is one", () => {
    const withdrawal = { reason: "Wrong lot on the fixture", withdrawnAt: "2026-12-01T08:00:00.000Z", by: "P" };
    expect(releasedPageDescription({ title: "T", organizationName: "O", revision: { ...base, standing: "withdrawn", withdrawal }, currentLetter: "B" })).toBe(
      "T. Revision A of the datasheet, released by O on 2026-11-30; withdrawn on 2026-12-01: Wrong lot on the fixture. Revision B is current.",
    );
    expect(
      releasedPageDescription({ title: "T", organizationName: "O", revision: { ...base, standing: "withdrawn", withdrawal: { ...withdrawal, reason: "Do not use." } }, currentLetter: null }),
    ).toBe("T. Revision A of the datasheet, released by O on 2026-11-30; withdrawn on 2026-12-01: Do not use.");
  });
});
