import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const words = await import("@/lib/server/outbox/notice-mails");

const sheet = { partNumber: "FX-0917", title: "Frequency doubler, 4–9 GHz out", organizationName: "Tessaly Microwave", link: "https://benchfold.example/sheets/12" };

describe("notice words", () => {
  it.each([
    ["submitted", words.candidateSubmittedWords({ ...sheet, submitterName: "Ana Ríos" }), "FX-0917 submitted for review", ["Ana Ríos", "Tessaly Microwave"]],
    ["changes requested", words.changesRequestedWords({ ...sheet, reviewerName: "Joel Park", reason: "Row 3 lacks its condition.\nChart 2 has no units." }), "Changes requested on FX-0917", ["Joel Park", "  Row 3 lacks its condition.", "  Chart 2 has no units."]],
    ["approved", words.candidateApprovedWords({ ...sheet, reviewerName: "Joel Park" }), "FX-0917 approved for release", ["Joel Park", "approved for release"]],
    ["stale", words.candidateStaleWords({ ...sheet, why: "a measurement set was approved." }), "Review of FX-0917 starts over", ["a measurement set was approved."]],
    ["released", words.revisionReleasedWords({ ...sheet, revisionLetter: "B", releasedOn: "2026-12-02" }), "FX-0917 revision B released", ["revision B", "2026-12-02", "follow this part"]],
  ])("%s: subject, part, title, link and the event's own facts", (_event, notice, subject, facts) => {
    expect(notice.subject).toBe(subject);
    expect(notice.subject).not.toMatch(/[\r\n]/);
    expect(notice.text).toContain(sheet.partNumber);
    expect(notice.text).toContain(sheet.title);
    expect(notice.text).toContain(sheet.link);
    for (const fact of facts) expect(notice.text).toContain(fact);
  });
});
