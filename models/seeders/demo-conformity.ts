/**
 * The demo's conformity watch: one unit of each of two released Kestrine parts, measured after the
 * release. Uploaded through the bench API and approved by scripts/seed-demo-conformity.ts once the
 * demo's releases are out, so the approval runs the watch against the current revision.
 *
 * - KDX-2G4 (Rev. B, conversion loss ≤ 11 dB at 1 GHz, +10 dBm per port, 25 °C): unit BFD-0021 of a new
 *   lot reads 2.5 dB more conversion loss than the first unit: outside the guaranteed limit and far
 *   beyond 3σ of the release, so its approval raises a conformity alert.
 * - KM-7H (Rev. A): unit BFD-0121 reads within 0.04 dB (conversion loss) and 0.3 dB (isolation) of the
 *   first unit: in control, no alert.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import type { DemoUpload } from "./demo-measurements";

const examples = path.resolve(__dirname, "../../fixtures/examples");

/** The example doubler as another unit: every output `dropDb` lower, so its conversion loss is that much higher. */
function doublerUnit(serial: string, lot: string, dropDb: number): () => Buffer {
  return () => {
    const lines = readFileSync(path.join(examples, "drive-sweep-doubler.csv"), "utf8").split("\n");
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("# serial:")) return `# serial: ${serial}`;
          if (line.startsWith("# lot:")) return `# lot: ${lot}`;
          if (!/^-?\d/.test(line)) return line;
          const [input, ...outs] = line.split(",");
          return [input, ...outs.map((v) => (Number(v) - dropDb).toFixed(2))].join(",");
        })
        .join("\n"),
    );
  };
}

/** The example mixer as another unit: conversion loss and LO–RF isolation moved by the given amounts (decimal comma kept). */
function mixerUnit(serial: string, lossShiftDb: number, isolationShiftDb: number): () => Buffer {
  return () => {
    const lines = readFileSync(path.join(examples, "frequency-sweep-mixer.csv"), "utf8").split("\n");
    const comma = (v: number) => v.toFixed(2).replace(".", ",");
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("# serial:")) return `# serial: ${serial}`;
          if (!/^\d/.test(line)) return line;
          const [frequency, loss, isolation] = line.split(";");
          return [frequency, comma(Number(loss.replace(",", ".")) + lossShiftDb), comma(Number(isolation.replace(",", ".")) + isolationShiftDb)].join(";");
        })
        .join("\n"),
    );
  };
}

export type DemoConformityUnit = DemoUpload & { serial: string; expect: "alert" | "in control" };

/** In upload order, after every upload of demo-measurements.ts. */
export const demoConformityUnits: DemoConformityUnit[] = [
  {
    org: "kestrine",
    part: "KDX-2G4",
    serial: "BFD-0021",
    file: "drive-sweep-bfd-0021.csv",
    fields: { measuredOn: "2026-11-24" },
    instruments: ["source", "analyzer"],
    approve: true,
    bytes: doublerUnit("BFD-0021", "L2611", 2.5),
    expect: "alert",
  },
  {
    org: "kestrine",
    part: "KM-7H",
    serial: "BFD-0121",
    file: "frequency-sweep-bfd-0121.csv",
    fields: { measuredOn: "2026-11-25" },
    instruments: ["source", "analyzer"],
    approve: true,
    bytes: mixerUnit("BFD-0121", 0.04, -0.3),
    expect: "in control",
  },
];

/**
 * Revision A of KDX-2G4 rests on three units, so its control charts are narrow: BFD-0004, approved
 * after A, signals Nelson's test 1 on a suppression figure. Before resubmitting, the engineer closes
 * that alert with this reason (scripts/seed-demo-releases.ts, through closeDemoAlerts).
 */
export const demoRevisionAAlertReason =
  "BFD-0004 is from the same October build as the first three units, and lot L2410 was measured in the same temperature characterization; revision A's spread rests on three units alone. Revision B adds them to the population, which widens the chart rather than the limits.";
