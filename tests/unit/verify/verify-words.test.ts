import { describe, expect, it } from "vitest";
import { readVerifyInput, standingMarks, verifySentence, type VerifyAnswer } from "@/lib/domain/verify";

const hex = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

describe("readVerifyInput", () => {
  it.each([
    [hex, { sha256: hex }],
    [`  ${hex.toUpperCase()}  `, { sha256: hex }],
    [`${hex}  KDX-2G4-rev-B.pdf`, { sha256: hex }],
    ["7kq2m-xr4td", { reference: "7KQ2M-XR4TD" }],
    ["Verify: 7KQ2M-XR4TD at https://benchfold.example/r/7KQ2M-XR4TD", { reference: "7KQ2M-XR4TD" }],
    ["https://benchfold.example/r/7KQ2M-XR4TD", { reference: "7KQ2M-XR4TD" }],
  ])("%j → %j", (text, expected) => {
    expect(readVerifyInput(text)).toEqual(expected);
  });

  it.each(["", "   ", hex.slice(1), `${hex}0`, "7KQ2M-XR4T", "7KQ2M-XR4TDD", "IKQ2M-XR4TD", "OOOOO-UUUUU", "x".repeat(10_000), "<script>"])("refuses %j", (text) => {
    expect(readVerifyInput(text)).toBeNull();
  });
});

const base: VerifyAnswer = {
  organization: { name: "Kestrel Devices", slug: "kestrel" },
  partNumber: "KDX-2G4",
  title: "Doubler",
  letter: "B",
  releasedAt: "2026-12-02T09:14:05.000Z",
  signers: [{ name: "Joel Park", roleWord: "Reviewer", signedAt: "2026-12-02T09:10:00.000Z" }, { name: "Ana Ríos", roleWord: "Reviewer", signedAt: "2026-12-02T09:11:00.000Z" }],
  standing: "current",
  reference: "7KQ2M-XR4TD",
  pdfSha256: hex,
  publicPath: "/datasheets/kestrel/KDX-2G4/B",
  pdfPath: "/api/v1/sheets/kestrel/KDX-2G4/B/pdf",
  withdrawal: null,
  supersededBy: null,
  later: [],
};

describe("verifySentence", () => {
  it("current", () => {
    expect(verifySentence(base)).toBe("Revision B of KDX-2G4 (Kestrel Devices), released 2026-12-02, signed by Joel Park and Ana Ríos: current.");
  });
  it("superseded names the revision current now", () => {
    const c = { letter: "D", releasedAt: "2026-12-05T00:00:00.000Z", standing: "current" as const, notes: [], publicPath: "/datasheets/kestrel/KDX-2G4/D" };
    expect(verifySentence({ ...base, standing: "superseded", supersededBy: c, later: [c] })).toBe(
      "Revision B of KDX-2G4 (Kestrel Devices), released 2026-12-02, signed by Joel Park and Ana Ríos: superseded by revision D.",
    );
  });
  it("withdrawn gives the date and the reason", () => {
    expect(verifySentence({ ...base, signers: [base.signers[0]], standing: "withdrawn", withdrawal: { reason: "The conversion loss used a wrong cable loss. ", withdrawnAt: "2026-12-03T10:00:00.000Z" } })).toBe(
      "Revision B of KDX-2G4 (Kestrel Devices), released 2026-12-02, signed by Joel Park: withdrawn on 2026-12-03 (reason: The conversion loss used a wrong cable loss).",
    );
  });
  it("each standing has a word and a mark of its own", () => {
    const marks = Object.values(standingMarks);
    expect(new Set(marks.map((m) => m.mark)).size).toBe(3);
    expect(new Set(marks.map((m) => m.word)).size).toBe(3);
  });
});
