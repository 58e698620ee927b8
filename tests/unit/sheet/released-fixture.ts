import { buildSheetModel, releaseSheetModel, type SheetModel, type SheetSignature } from "@/lib/sheet";
import { loadDoublerInput } from "./fixture";

/** Two invented signers of the invented doubler's revision C: engineering review and quality. */
export const doublerSignatures: SheetSignature[] = [
  {
    name: "Ilse Marwood",
    role: "Reviewer",
    organizationName: "Brightwater Microwave Works",
    signedAt: "2026-12-02T09:14:05Z",
    meaning: "Reviewed and approved for release",
    candidateDigest: "3f9a0c41d27be8856e1f0a93c4d5b7e2a8196f0c3d4e5b6a7f8e9d0c1b2a3948",
  },
  {
    name: "Tomasz Oyelaran-Beckford",
    role: "Quality reviewer",
    organizationName: "Brightwater Microwave Works",
    signedAt: "2026-12-02T10:02:47Z",
    meaning: "Reviewed and approved for release",
    candidateDigest: "3f9a0c41d27be8856e1f0a93c4d5b7e2a8196f0c3d4e5b6a7f8e9d0c1b2a3948",
  },
];

export const doublerVerification = {
  verificationReference: "BF-OCX2D40-C-7K3Q",
  verificationUrl: "https://sheets.benchfold.example/verify/BF-OCX2D40-C-7K3Q",
};

/** The fixture doubler as its candidate (in review), and released as revision C through releaseSheetModel. */
export function doublerCandidateAndRelease(): { candidate: SheetModel; released: SheetModel } {
  const candidate = buildSheetModel(loadDoublerInput());
  const released = releaseSheetModel(candidate, {
    revisionLabel: "C",
    releasedOn: "2026-12-02",
    signatures: doublerSignatures,
    ...doublerVerification,
    notes: [
      "Conversion loss at 85 °C now guaranteed from ten units over two lots.",
      "Fundamental suppression limit tightened from 18 dBc to 20 dBc.",
      "Conversion loss (Frequency 1 GHz in, T_A 25 °C): max 11.50 dB → 11.00 dB (tightened)",
      "Engineer's note: phase-noise figures re-measured after the test-set calibration.",
    ],
    earlierRevisions: loadDoublerInput().revision.history,
    summary: "Guaranteed 85 °C conversion loss; tightened fundamental suppression at T_A 25 °C.",
  });
  return { candidate, released };
}
