/**
 * The demo scenario's reviews and releases: which sheets go out as which revision, what the
 * engineers and reviewers wrote on the way, and which sheets are left mid-review. Invented, like
 * the rest of the demo. Played through the app's API by scripts/seed-demo-releases.ts after the
 * demo measurements are in; the draft sheets end as demo-sheets.ts and demo-measurements.ts state
 * them, so the draft snapshots of the unit tests still hold.
 */
import { demoSheets, type DemoSheetContent } from "./demo-sheets";
import { demoDesignIn, type DemoDesignIn } from "./demo-design-in";

export type DemoRole = "engineer" | "reviewer";

/** One sheet released as its next revision: the engineer's note to the reviewer and the release note. */
export interface DemoRelease {
  org: string;
  part: string;
  submitNote: string;
  releaseNote: string;
  /** Why each open issue of the draft may stand, by issue code, in the engineer's words (lib/sheet/consistency-checks.ts raises most). */
  issueReasons: Readonly<Record<string, string>>;
}

/** The same words on every sheet measured at room temperature on one bench. */
const atRoomTemperature =
  "The limits are stated at +25 °C, as the table's T_A column says; the −40 °C and +85 °C runs are planned for the next revision.";
const sourceLevelledOnAnalyzer =
  "On this bench the generator is levelled against the analyzer at every step, so its own 0.6 dB level uncertainty does not enter the " +
  "conversion loss; the stated U is the bench budget for that method.";

/** The open issues each demo sheet is submitted with, and why the engineer lets each stand. */
const demoIssueReasons = {
  "KDX-2G4": {
    "stated-band-not-specified":
      "Production test screens every unit at 1 GHz in (2 GHz out), and every row states it; units at the band edges are on the bench for the next revision.",
    "uncertainty-below-instruments": sourceLevelledOnAnalyzer,
    "limit-from-one-lot": "All units are from the October build; the next build's units join the characterization before the next revision.",
    "limit-from-few-units":
      "The characterization limits rest on the units measured so far, the one over temperature on the four run in the chamber (two lots); more join as each lot is characterized.",
  },
  "KM-7H": {
    "uncertainty-below-instruments": sourceLevelledOnAnalyzer,
    "limit-from-few-units": "The over-temperature limit rests on the four units run in the chamber (two lots); the next lot's units join it before the next revision.",
  },
  "KQH-2G": {
    "specified-outside-stated-band":
      "The worst-in-band figures are taken over 1.5–2.5 GHz, wider than the 1.7–2.3 GHz the part is offered for, so they hold inside it as well.",
    "limit-from-one-lot": "Lot L2610 is the only lot built so far; VSWR is stated as characterization until the second lot is measured.",
    "limit-from-few-units": "Three units of lot L2610 are all the pilot build made; the VSWR limit is reviewed when the second lot is in.",
    "limit-at-one-temperature": atRoomTemperature,
  },
  "PS-2W": {
    "stated-band-not-specified": "Only typical values are given, from one unit measured to 2.5 GHz; the 2.5–3 GHz part of the band is by design until the production lot is measured.",
  },
  "WL-C2611-KDX": {
    "stated-band-not-specified": "The customer uses the part at 1 GHz in only; this lab report characterizes it there.",
    "uncertainty-below-instruments":
      "Our generator is levelled against the analyzer at every step, so its level uncertainty does not enter; the stated U is the lab's budget for that method.",
  },
} satisfies Record<string, Record<string, string>>;

const doubler1GHz = "drive=10;inputFrequencyHz=1000000000;temperatureC=25";

/**
 * The doubler's limits at revision A: the conversion-loss maximum still 11.5 dB, set before the fourth
 * unit was in, and none over temperature yet (the runs over temperature come after A).
 */
function limitsAtRevisionA(): DemoSheetContent["limits"] {
  return demoSheets["KDX-2G4"].limits
    .filter((limit) => !limit.conditionsKey.includes("temperatureMinC"))
    .map((limit) => (limit.parameter === "conversion-loss" && limit.conditionsKey === doubler1GHz ? { ...limit, max: 11.5 } : limit));
}

/** The doubler's words at revision A: the features line promised what the 11.5 dB limit guaranteed. */
function proseAtRevisionA(): DemoSheetContent["prose"] {
  const prose = demoSheets["KDX-2G4"].prose;
  return {
    ...prose,
    features: prose.features?.replace("Conversion loss below 11 dB at +10 dBm per port, tested on every unit at 25 °C; below 11.5 dB from −40 to +85 °C", "Conversion loss below 11.5 dB at +10 dBm per port, tested on every unit"),
  };
}

/** The doubler's design-in data at revision A: the evaluation board was not orderable yet (B adds it). */
function designInAtRevisionA(): DemoDesignIn {
  const designIn = demoDesignIn["KDX-2G4"];
  return { ...designIn, ordering: designIn.ordering.filter((entry) => !entry.partNumber.endsWith("-EB")) };
}

/**
 * The Kestrine doubler: revision A from three units (BFD-0004's drive sweep and the runs over
 * temperature wait for review, see demo-measurements.ts and demo-characterization.ts) with a
 * conversion-loss maximum of 11.5 dB (and a features line to match); then BFD-0004 and the −40, +25 and
 * +85 °C runs of lots L2405 and L2410 are approved, the reviewer sends the first resubmission back, the
 * engineer tightens the maximum to 11.0 dB, states 11.5 dB over the rated range and puts the feature
 * line right (the content of demo-sheets.ts), adds the evaluation board to the ordering information
 * (demo-design-in.ts) and revision B goes out.
 * Between A and B the demo customer follows the part, so B's release queues a change notice to them.
 */
export const demoDoublerStory = {
  org: "kestrine",
  part: "KDX-2G4",
  limitsAtRevisionA: limitsAtRevisionA(),
  proseAtRevisionA: proseAtRevisionA(),
  designInAtRevisionA: designInAtRevisionA(),
  /** The demo customer (Tarnby Radio Systems), who follows the part once A is out and so is sent the change notice of B. */
  followerBeforeRevisionB: "anneli.vos@tarnby-radio.example",
  issueReasons: demoIssueReasons["KDX-2G4"],
  revisionA: {
    // Revision A has no runs over temperature yet (they are approved after it).
    issueReasons: { ...demoIssueReasons["KDX-2G4"], "limit-at-one-temperature": atRoomTemperature },
    submitNote:
      "First release of the KDX-2G4: units BFD-0001 to BFD-0003 from the October build, plus the residual phase-noise run. BFD-0004's sweep is still in review, so conversion loss is guaranteed at 11.5 dB for now.",
    releaseNote: "Initial release from three production units; the conversion-loss maximum keeps a margin until the fourth unit is reviewed.",
  },
  /** The first submission after BFD-0004 was approved, with the old limit; the reviewer sends it back. */
  firstResubmission: {
    note: "BFD-0004 and the −40, +25 and +85 °C runs of lots L2405 and L2410 added to the sheet; limits unchanged from revision A.",
    changeRequest:
      "With BFD-0004 and lot L2410 in, all six units sit well inside 11.5 dB at +10 dBm per port at 25 °C, and the temperature runs of both lots stay near 10 dB from −40 to +85 °C. Tighten the conversion-loss maximum to 11.0 dB as we agreed at revision A, so the sheet states what production test actually screens, and state what holds over the rated range: 11.5 dB keeps the six units' spread capable there.",
  },
  revisionB: {
    issueReasons: demoIssueReasons["KDX-2G4"],
    submitNote:
      "Conversion-loss maximum tightened from 11.5 to 11.0 dB on the six-unit spread at 25 °C, and 11.5 dB stated over −40 to +85 °C from the runs of two lots, as requested; the features line says so. The evaluation board is now orderable.",
    releaseNote:
      "Fourth unit (BFD-0004) and lot L2410 added to the test population; conversion-loss maximum tightened from 11.5 dB to 11.0 dB at 25 °C, 11.5 dB from −40 to +85 °C characterized on two lots; evaluation board KDX-2G4-EB added to the ordering information.",
  },
} as const;

/** Sheets released once, as revision A. */
export const demoFirstReleases: DemoRelease[] = [
  {
    org: "kestrine",
    part: "KM-7H",
    issueReasons: demoIssueReasons["KM-7H"],
    submitNote:
      "Six units of lots L2409 and L2412 at +7 dBm LO across 500–3000 MHz, four of them also at −40 and +85 °C; isolation on all three paths, two-tone intercept and compression of five units, port match of four. BFD-0107's first two-tone run stopped short of compression and stays in review; its sweep is not part of this sheet.",
    releaseNote: "First release: six units of two lots, conversion loss over −40 to +85 °C, isolation, IIP3, input P1dB and port VSWR.",
  },
  {
    org: "kestrine",
    part: "KQH-2G",
    issueReasons: demoIssueReasons["KQH-2G"],
    submitNote: "Three units of lot L2610 on the four-port board, TRL-corrected. VSWR is stated as characterization only.",
    releaseNote: "First release: three units of lot L2610, 1.5–2.5 GHz.",
  },
  {
    org: "pellacourt",
    part: "PS-2W",
    issueReasons: demoIssueReasons["PS-2W"],
    submitNote: "One unit (PS-0007) measured from 0.5 to 2.5 GHz. Typical values only: no limit is guaranteed until a production lot is measured.",
    releaseNote: "First release, from one characterized unit: typical values, no guaranteed limits.",
  },
];

/** A sheet left in review with a comment thread: the reviewer on a spec-table row, the engineer's reply. */
export const demoOpenReview = {
  org: "wrenfield-lab",
  part: "WL-C2611-KDX",
  issueReasons: demoIssueReasons["WL-C2611-KDX"],
  submitNote: "Characterization of one unit of the customer's lot 2611, used as a doubler. Phase noise is not included yet.",
  comment: {
    parameter: "conversion-loss",
    body: "The typical conversion loss rests on a single unit of lot 2611. Say in the row's footnote how far the stated +10 dBm per port lies from that unit's optimum, so the customer knows the margin on their own bench.",
  },
  reply:
    "Agreed. Its optimum is +10.5 dBm per port, as in the optimum-drive row, half a decibel above the stated drive; I'll say so in the footnote and resubmit together with the phase-noise set of 13 November once that has passed review.",
};

/** A sheet the reviewer sent back, with the reason. */
export const demoChangesRequested = {
  org: "pellacourt",
  part: "PX-40",
  submitNote: "Words, features and absolute maximum ratings for review ahead of the first lot.",
  /** Why each open issue may stand, by issue code, in the engineer's words. */
  issueReasons: {
    "no-approved-data":
      "Submitted early on purpose: the ratings, features and wording are to be agreed before lot 1 goes on the bench. The figures follow from the drive sweeps.",
  } as Record<string, string>,
  reason:
    "A sheet without one approved measurement set cannot be released: the features promise low near-carrier noise with nothing behind it. Keep the wording, and resubmit once lot 1's drive sweeps and one phase-noise run have passed review.",
};
