/**
 * The demo scenario's bench work: instruments, measurement files and which of them a reviewer
 * approves. Invented data: extra units are the example files of fixtures/examples with a new
 * serial and small, seeded offsets. Read by scripts/seed-demo-measurements.ts (which uploads
 * them through the bench API of the running app) and by the sheet snapshot test.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { mulberry32 } from "../../lib/stats/seeded-random";
import { demoCharacterizationUploads } from "./demo-characterization";

const examples = path.resolve(__dirname, "../../fixtures/examples");

export interface DemoInstrument {
  key: string;
  kind: string;
  model: string;
  serial: string;
  calibratedOn: string;
  calibrationDueOn: string;
  uncertainty: { quantity: string; value: number; unit: string; coverageFactor: number }[];
}

export interface DemoUpload {
  org: string;
  part: string;
  file: string;
  /** Form fields as the upload form sends them (strings). */
  fields: Record<string, string>;
  /** Keys into demoInstruments[org]. */
  instruments: string[];
  approve: boolean;
  /** Approved only once the device's revision A is out (the demo's revision B adds the unit; see demo-releases.ts). */
  approveAfterRevisionA?: boolean;
  bytes: () => Buffer;
}

/** Invented instruments; calibration intervals cover the demo measurement dates. */
export const demoInstruments: Record<string, DemoInstrument[]> = {
  kestrine: [
    { key: "source", kind: "signal generator", model: "Halvard SG-20", serial: "HSG-1187", calibratedOn: "2026-03-09", calibrationDueOn: "2027-03-09", uncertainty: [{ quantity: "output level", value: 0.6, unit: "dB", coverageFactor: 2 }] },
    { key: "analyzer", kind: "spectrum analyzer", model: "Ostrava SA-9", serial: "OSA-0452", calibratedOn: "2026-05-18", calibrationDueOn: "2027-05-18", uncertainty: [{ quantity: "absolute level", value: 0.4, unit: "dB", coverageFactor: 2 }, { quantity: "relative level", value: 0.2, unit: "dB", coverageFactor: 2 }] },
    { key: "vna", kind: "vector network analyzer", model: "Meriden VN-4", serial: "MVN-2203", calibratedOn: "2026-04-02", calibrationDueOn: "2027-04-02", uncertainty: [{ quantity: "transmission magnitude", value: 0.1, unit: "dB", coverageFactor: 2 }, { quantity: "transmission phase", value: 1, unit: "°", coverageFactor: 2 }] },
    { key: "phaseNoise", kind: "phase-noise test set", model: "Lindqvist PN-3", serial: "LPN-0077", calibratedOn: "2026-02-20", calibrationDueOn: "2027-02-20", uncertainty: [{ quantity: "L(f)", value: 2, unit: "dB", coverageFactor: 2 }] },
  ],
  "wrenfield-lab": [
    { key: "source", kind: "signal generator", model: "Halvard SG-40", serial: "HSG-3310", calibratedOn: "2026-06-01", calibrationDueOn: "2027-06-01", uncertainty: [{ quantity: "output level", value: 0.5, unit: "dB", coverageFactor: 2 }] },
    { key: "analyzer", kind: "spectrum analyzer", model: "Ostrava SA-26", serial: "OSA-1290", calibratedOn: "2026-07-14", calibrationDueOn: "2027-07-14", uncertainty: [{ quantity: "absolute level", value: 0.3, unit: "dB", coverageFactor: 2 }] },
  ],
  pellacourt: [
    { key: "vna", kind: "vector network analyzer", model: "Meriden VN-8", serial: "MVN-4471", calibratedOn: "2026-01-12", calibrationDueOn: "2027-01-12", uncertainty: [{ quantity: "transmission magnitude", value: 0.08, unit: "dB", coverageFactor: 2 }] },
  ],
};

const example = (file: string) => () => readFileSync(path.join(examples, file));

/** Another unit of the example doubler: new serial, every output power moved by up to ±0.6 dB. */
function anotherDoublerUnit(serial: string, seed: number): () => Buffer {
  return () => {
    const rand = mulberry32(seed);
    const shift = (rand() - 0.5) * 1.2;
    const lines = readFileSync(path.join(examples, "drive-sweep-doubler.csv"), "utf8").split("\n");
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("# serial:")) return `# serial: ${serial}`;
          if (!/^-?\d/.test(line)) return line;
          const [input, ...outs] = line.split(",");
          return [input, ...outs.map((v) => (Number(v) + shift + (rand() - 0.5) * 0.3).toFixed(2))].join(",");
        })
        .join("\n"),
    );
  };
}

/** Another unit of the example mixer: new serial, conversion loss moved by up to ±0.3 dB, isolation by ±2 dB. */
function anotherMixerUnit(serial: string, seed: number): () => Buffer {
  return () => {
    const rand = mulberry32(seed);
    const lossShift = (rand() - 0.5) * 0.6;
    const isolationShift = (rand() - 0.5) * 4;
    const comma = (x: number) => x.toFixed(2).replace(".", ",");
    const lines = readFileSync(path.join(examples, "frequency-sweep-mixer.csv"), "utf8").split("\n");
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("# serial:")) return `# serial: ${serial}`;
          if (!/^\d/.test(line)) return line;
          const [frequency, loss, isolation] = line.split(";");
          const value = (v: string) => Number(v.replace(",", "."));
          return [frequency, comma(value(loss) + lossShift + (rand() - 0.5) * 0.1), comma(value(isolation) + isolationShift + (rand() - 0.5) * 0.6)].join(";");
        })
        .join("\n"),
    );
  };
}

/** Another unit of the example hybrid: every S-parameter scaled by (1 ± 1 %) and a little noise. */
function anotherHybridUnit(serial: string, seed: number): () => Buffer {
  return () => {
    const rand = mulberry32(seed);
    const scale = 1 + (rand() - 0.5) * 0.02;
    const lines = readFileSync(path.join(examples, "hybrid-4port.s4p"), "utf8").split("\n");
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("!") && line.includes("serial")) return line.replace(/serial \S+/, `serial ${serial}`);
          if (line.startsWith("!") || line.startsWith("#") || !line.trim()) return line;
          const leading = line.match(/^\s*/)![0];
          const values = line.trim().split(/\s+/);
          const first = leading.length === 0 ? 1 : 0; // a block's first line starts with its frequency
          return (
            leading +
            values.map((v, i) => (i < first ? v : (Number(v) * scale * (1 + (rand() - 0.5) * 0.004)).toFixed(6))).join(" ")
          );
        })
        .join("\n"),
    );
  };
}

const doubler = (serial: string, seed: number, measuredOn: string, approve: boolean, approveAfterRevisionA = false): DemoUpload => ({
  org: "kestrine",
  part: "KDX-2G4",
  file: `drive-sweep-${serial.toLowerCase()}.csv`,
  fields: { measuredOn },
  instruments: ["source", "analyzer"],
  approve,
  approveAfterRevisionA,
  bytes: anotherDoublerUnit(serial, seed),
});

const mixer = (serial: string, seed: number, measuredOn: string, approve: boolean): DemoUpload => ({
  org: "kestrine",
  part: "KM-7H",
  file: `frequency-sweep-${serial.toLowerCase()}.csv`,
  fields: { measuredOn },
  instruments: ["source", "analyzer"],
  approve,
  bytes: anotherMixerUnit(serial, seed),
});

/** KQH-2G is a 1.7–2.3 GHz part measured from 1.5 to 2.5 GHz: each upload states the band its figures hold over. */
const kqhBand = { bandStartHz: "1.7e9", bandStopHz: "2.3e9" };

const hybrid = (serial: string, seed: number, measuredOn: string): DemoUpload => ({
  org: "kestrine",
  part: "KQH-2G",
  file: `hybrid-${serial.toLowerCase()}.s4p`,
  fields: { serial, lot: "L2610", temperatureC: "25", measuredOn, ...kqhBand },
  instruments: ["vna"],
  approve: true,
  bytes: anotherHybridUnit(serial, seed),
});

/**
 * In upload order: on a fresh database the measurement sets get ids 1, 2, 3… in this order.
 * phase-noise-doubler.csv states the analyzer's resolution bandwidth at each offset and carries the
 * 1 GHz source's own L(f) (scripts/fixtures/make-examples.ts): its three spurs reach the sheet in dBc
 * (worst −108.2 dBc at 50 Hz) and the doubler's excess over an ideal ×2 is about 1.5 dB close in.
 * Invented values, as every demo file.
 */
const storyUploads: DemoUpload[] = [
  { org: "kestrine", part: "KDX-2G4", file: "drive-sweep-doubler.csv", fields: { measuredOn: "2026-10-05" }, instruments: ["source", "analyzer"], approve: true, bytes: example("drive-sweep-doubler.csv") },
  doubler("BFD-0002", 11, "2026-10-05", true),
  doubler("BFD-0003", 12, "2026-10-06", true),
  doubler("BFD-0004", 13, "2026-10-06", true, true),
  doubler("BFD-0005", 14, "2026-10-07", false),
  { org: "kestrine", part: "KDX-2G4", file: "phase-noise-doubler.csv", fields: { measuredOn: "2026-10-09" }, instruments: ["source", "phaseNoise"], approve: true, bytes: example("phase-noise-doubler.csv") },
  { org: "kestrine", part: "KM-7H", file: "frequency-sweep-mixer.csv", fields: { measuredOn: "2026-09-22" }, instruments: ["source", "analyzer"], approve: true, bytes: example("frequency-sweep-mixer.csv") },
  mixer("BFD-0108", 21, "2026-09-22", true),
  mixer("BFD-0109", 22, "2026-09-23", true),
  mixer("BFD-0110", 23, "2026-09-23", true),
  { org: "kestrine", part: "KM-7H", file: "two-tone-mixer.tsv", fields: { measuredOn: "2026-09-24" }, instruments: ["source", "analyzer"], approve: false, bytes: example("two-tone-mixer.tsv") },
  { org: "kestrine", part: "KQH-2G", file: "hybrid-4port.s4p", fields: { serial: "BFD-0401", lot: "L2610", temperatureC: "25", measuredOn: "2026-11-03", ...kqhBand }, instruments: ["vna"], approve: true, bytes: example("hybrid-4port.s4p") },
  hybrid("BFD-0402", 31, "2026-11-03"),
  hybrid("BFD-0403", 32, "2026-11-04"),
  { org: "pellacourt", part: "PS-2W", file: "splitter-3port.s3p", fields: { serial: "PS-0007", temperatureC: "25", measuredOn: "2026-08-17" }, instruments: ["vna"], approve: true, bytes: example("splitter-3port.s3p") },
  { org: "wrenfield-lab", part: "WL-C2611-KDX", file: "drive-sweep-doubler.csv", fields: { measuredOn: "2026-11-12" }, instruments: ["source", "analyzer"], approve: true, bytes: example("drive-sweep-doubler.csv") },
  { org: "wrenfield-lab", part: "WL-C2611-KDX", file: "phase-noise-doubler.csv", fields: { measuredOn: "2026-11-13" }, instruments: ["source"], approve: false, bytes: example("phase-noise-doubler.csv") },
];

/**
 * The story's files, then the runs over temperature and the mixer's other measurements
 * (demo-characterization.ts), which read some units' 25 °C sweeps above.
 */
export const demoUploads: DemoUpload[] = [
  ...storyUploads,
  ...demoCharacterizationUploads(
    Object.fromEntries(
      storyUploads.filter((u) => u.org === "kestrine" && (u.part === "KDX-2G4" || u.part === "KM-7H")).map((u) => [serialOf(u), u.bytes]),
    ),
  ),
];

function serialOf(upload: DemoUpload): string {
  return /^# serial: (\S+)/m.exec(upload.bytes().toString("utf8"))?.[1] ?? "";
}
