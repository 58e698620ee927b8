import { deriveParameters } from "../lib/analysis";
import { parseMeasurementFile } from "../lib/ingest";
import { mulberry32 } from "../lib/stats/seeded-random";

/**
 * Engine throughput against a plain split-and-Number() reading of the same bytes,
 * in one process, on generated inputs (seeded, so every run measures the same data).
 * Run with `npm run bench`; option --reps <n> (default 7). Parse and derive are also timed apart,
 * since the plain reference only compares with the parse.
 */

function gaussian(random: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
}

interface Case {
  label: string;
  files: { fileName: string; bytes: Uint8Array }[];
  /** Data points in all files together (trace points, frequencies, sweep rows). */
  points: number;
  pointName: string;
  /** The plain reference for this input (readPlain unless the cells are quoted). */
  plain?: (bytes: Uint8Array) => number;
}

/** 100,000 offsets, 1 Hz … 10 MHz, a power-law trace with 0.3 dB noise and a spur every decade. */
function makePhaseNoiseCase(random: () => number): Case {
  const count = 100_000;
  const lines = [
    "# kind: phase-noise",
    "# serial: BENCH-0001",
    "# carrier_frequency: 2 GHz",
    "# carrier_power: 3 dBm",
    "# multiplication_factor: 2",
    "offset [Hz],L [dBc/Hz]",
  ];
  for (let i = 0; i < count; i++) {
    const offsetHz = 10 ** ((7 * i) / count);
    const floor = -112 - 10 * Math.log10(offsetHz) + 10 * Math.log10(1 + offsetHz / 1e5);
    const spur = i % 14_000 === 7_000 ? 25 : 0;
    lines.push(`${offsetHz.toPrecision(9)},${(Math.max(floor, -166) + 0.3 * gaussian(random) + spur).toFixed(3)}`);
  }
  return { label: "phase-noise CSV", files: [encode("bench-phase-noise.csv", lines)], points: count, pointName: "offsets" };
}

/** A 4-port quadrature hybrid, 10,001 frequencies, Touchstone v1, RI, four values pairs per line. */
function makeTouchstoneCase(random: () => number): Case {
  const count = 10_001;
  const lines = ["! generated 90-degree hybrid", "# Hz S RI R 50"];
  for (let k = 0; k < count; k++) {
    const frequencyHz = 1e9 + k * 1e5;
    const rows: string[] = [];
    for (let i = 0; i < 4; i++) {
      const cells: string[] = [];
      for (let j = 0; j < 4; j++) {
        const magnitude = i === j ? 0.05 + 0.02 * random() : (i ^ j) === 1 || (i ^ j) === 2 ? 0.7 + 0.01 * random() : 0.03 * random();
        const angle = 2 * Math.PI * random();
        cells.push(`${(magnitude * Math.cos(angle)).toFixed(9)} ${(magnitude * Math.sin(angle)).toFixed(9)}`);
      }
      rows.push((i === 0 ? `${frequencyHz}` : "     ") + " " + cells.join(" "));
    }
    lines.push(...rows);
  }
  return { label: "Touchstone s4p", files: [encode("bench-hybrid.s4p", lines)], points: count, pointName: "frequencies" };
}

/** 2,000 doubler drive sweeps of 26 steps each, as a bench would upload them. */
function makeDriveSweepCase(random: () => number): Case {
  const files: Case["files"] = [];
  const steps = 26;
  for (let u = 0; u < 2000; u++) {
    const lines = [
      "# kind: drive-sweep",
      `# serial: BENCH-${String(u).padStart(4, "0")}`,
      "# lot: L2501",
      "# input_frequency: 1 GHz",
      "# wanted_order: 2",
      "# splitter_excess_loss: 0.4 dB",
      "# cable_loss: 0.6 dB",
      "# temperature: 25 C",
      "input_power [dBm],p1_out [dBm],p2_out [dBm],p3_out [dBm],p4_out [dBm]",
    ];
    for (let s = 0; s < steps; s++) {
      const input = -5 + s;
      const wanted = input - 10 - 20 * Math.exp(-(input + 5) / 6) - 0.02 * Math.max(0, input - 14) ** 2;
      const row = [input, input - 50 + 1.5 * s, wanted, wanted - 30 + s * 0.2, wanted - 22];
      lines.push(row.map((v, c) => (c === 0 ? v.toFixed(2) : (v + 0.1 * gaussian(random)).toFixed(2))).join(","));
    }
    files.push(encode(`bench-drive-${u}.csv`, lines));
  }
  return { label: "2,000 drive sweeps", files, points: 2000 * steps, pointName: "rows" };
}

/**
 * A spreadsheet's export of a 100,000-point mixer frequency sweep (RFC 4180): CRLF line ends, every
 * cell quoted, a quoted header whose last cell holds the delimiter, remarks with doubled quotes, and
 * a line break inside a quoted remark every 1,000 rows. Read through csv-parse (lib/ingest/csv-tokens.ts).
 */
function makeQuotedSweepCase(random: () => number): Case {
  const count = 100_000;
  const lines = [
    "# kind: frequency-sweep",
    "# serial: BENCH-Q001",
    "# lo_power: 7 dBm",
    "# if_frequency: 70 MHz",
    '"frequency [MHz]","conversion_loss [dB]","isolation_lo_rf [dB]","remark, operator"',
  ];
  for (let i = 0; i < count; i++) {
    const frequencyMhz = 500 + i * 0.1;
    const lossDb = 6 + 0.4 * Math.sin(i / 5000) + 0.05 * gaussian(random);
    const isolationDb = 37 - 5 * (i / count) + 0.2 * gaussian(random);
    const remark = i % 1000 === 0 ? '"recal, then ""warm"" start\r\nsecond line"' : i % 7 === 0 ? '"ok, checked"' : '""';
    lines.push(`"${frequencyMhz.toFixed(1)}","${lossDb.toFixed(3)}","${isolationDb.toFixed(2)}",${remark}`);
  }
  return {
    label: "quoted CSV",
    files: [{ fileName: "bench-quoted-sweep.csv", bytes: new TextEncoder().encode(`${lines.join("\r\n")}\r\n`) }],
    points: count,
    pointName: "frequencies",
    plain: readPlainQuoted,
  };
}

function encode(fileName: string, lines: string[]): { fileName: string; bytes: Uint8Array } {
  return { fileName, bytes: new TextEncoder().encode(`${lines.join("\n")}\n`) };
}

/** The reference: decode, split lines and cells, Number() every numeric-looking cell. Nothing else. */
function readPlain(bytes: Uint8Array): number {
  const text = new TextDecoder().decode(bytes);
  let sum = 0;
  for (const line of text.split("\n")) {
    const first = line.charCodeAt(0);
    if (line.length === 0 || first === 35 || first === 33 || (first >= 97 && first <= 122)) continue;
    for (const cell of line.trim().split(/[\s,;]+/)) sum += Number(cell);
  }
  return sum;
}

/** The quoted reference: decode, split lines and commas, strip the quotes, Number() each cell, keep the numbers. */
function readPlainQuoted(bytes: Uint8Array): number {
  const text = new TextDecoder().decode(bytes);
  let sum = 0;
  for (const line of text.split("\n")) {
    if (line.length === 0 || line.charCodeAt(0) === 35) continue;
    for (const cell of line.split(",")) {
      const v = Number(cell.charCodeAt(0) === 34 ? cell.slice(1, cell.lastIndexOf('"')) : cell);
      if (v === v) sum += v;
    }
  }
  return sum;
}

let peakHeapBytes = 0;
function notePeakHeap(): void {
  peakHeapBytes = Math.max(peakHeapBytes, process.memoryUsage().heapUsed);
}

function timeMedianMs(reps: number, run: () => void): number {
  run();
  run();
  const times: number[] = [];
  for (let r = 0; r < reps; r++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
    notePeakHeap();
  }
  times.sort((a, b) => a - b);
  return times[times.length >> 1];
}

function main(): void {
  const args = process.argv.slice(2);
  const repsIndex = args.indexOf("--reps");
  const reps = repsIndex >= 0 ? Number(args[repsIndex + 1]) : 7;
  if (!(reps >= 1)) throw new RangeError("--reps needs a positive number");

  const random = mulberry32(20261201);
  const cases = [makePhaseNoiseCase(random), makeTouchstoneCase(random), makeDriveSweepCase(random), makeQuotedSweepCase(random)];
  console.log(`Benchfold engine benchmark: median of ${reps} runs after 2 warm-ups, node ${process.version}\n`);
  const header = ["input", "MB", "engine ms", "parse ms", "derive ms", "plain ms", "engine Mpts/s", "engine MB/s", "plain MB/s", "parse/plain", "engine/plain"];
  const rows: string[][] = [];
  for (const c of cases) {
    const megabytes = c.files.reduce((sum, f) => sum + f.bytes.length, 0) / 1e6;
    let sink = 0;
    const engineMs = timeMedianMs(reps, () => {
      for (const f of c.files) sink += deriveParameters(parseMeasurementFile(f)).parameters.length;
    });
    const plainMs = timeMedianMs(reps, () => {
      for (const f of c.files) sink += (c.plain ?? readPlain)(f.bytes);
    });
    const parsed = c.files.map((f) => parseMeasurementFile(f));
    const parseMs = timeMedianMs(reps, () => {
      for (const f of c.files) sink += parseMeasurementFile(f).warnings.length;
    });
    const deriveMs = timeMedianMs(reps, () => {
      for (const p of parsed) sink += deriveParameters(p).parameters.length;
    });
    if (Number.isNaN(sink)) console.log("(unexpected NaN in the reference sum)");
    rows.push([
      `${c.label} (${c.points.toLocaleString("en")} ${c.pointName})`,
      megabytes.toFixed(2),
      engineMs.toFixed(1),
      parseMs.toFixed(1),
      deriveMs.toFixed(1),
      plainMs.toFixed(1),
      (c.points / engineMs / 1e3).toFixed(2),
      (megabytes / (engineMs / 1e3)).toFixed(1),
      (megabytes / (plainMs / 1e3)).toFixed(1),
      (plainMs / parseMs).toFixed(2),
      (plainMs / engineMs).toFixed(2),
    ]);
  }
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const format = (r: string[]) => r.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]) : cell.padStart(widths[i]))).join("  ");
  console.log(format(header));
  for (const r of rows) console.log(format(r));
  const maxRssMb = process.resourceUsage().maxRSS / 1024;
  console.log(`\npeak RSS ${maxRssMb.toFixed(0)} MB, peak heap used ${(peakHeapBytes / 1e6).toFixed(0)} MB`);
  console.log("Ratios are plain time ÷ engine (or parse) time: 1 means as fast as a bare split, 0.5 half as fast.");
}

main();
