/**
 * The demo story's characterization beyond room temperature, and the mixer's measurements beyond
 * conversion loss and LO–RF isolation. Invented data from the physical models of
 * demo-catalog-curves.ts (and their temperature coefficients, stated there with their basis), with
 * fixed seeds:
 *
 * - KDX-2G4 (doubler): −40, +25 and +85 °C drive sweeps at 1 GHz on two lots. Lot L2405's units
 *   BFD-0002 and BFD-0003 (their +25 °C sweeps are in demo-measurements.ts) are read again cold and
 *   hot: their own 25 °C response slid along the drive axis by the shift of the optimum drive (the
 *   diodes' turn-on voltage) and its loss raised by the temperature coefficient. Lot L2410's BFD-0011 and BFD-0012
 *   come from the doubler model at all three temperatures, swept over the same source powers as lot
 *   L2405 (−5 to +20 dBm), and at 0.6 and 1.2 GHz input as well (25 °C). Approved after revision A,
 *   with BFD-0004: revision B carries them.
 * - KM-7H (mixer): −40, +25 and +85 °C RF sweeps on two lots (L2409's BFD-0108 and BFD-0109 cold and
 *   hot from their 25 °C sweeps; L2412's BFD-0131 and BFD-0132 from the mixer model, with LO–IF and
 *   RF–IF isolation); LO–IF and RF–IF isolation sweeps of L2409's four units; two-tone sweeps (IIP3 and
 *   input P1dB) of five units; port match (VSWR) of four units as three-port Touchstone files. All
 *   approved before revision A.
 *
 * Uploaded after every file of demo-measurements.ts (they are the end of demoUploads), so the earlier
 * sets keep their ids.
 */
import {
  DIODE_CONVERSION_LOSS_DB_PER_C,
  ISOLATION_DB_PER_C,
  doublerDriveSweep,
  mixerFrequencySweep,
  mixerPortMatch,
  mixerTwoTone,
  optimumDriveShiftDb,
  type DoublerModel,
  type MixerModel,
  type MixerPortMatchModel,
  type MixerTwoToneModel,
} from "./demo-catalog-curves";
import type { DemoUpload } from "./demo-measurements";
import { mulberry32 } from "../../lib/stats/seeded-random";

/** The KDX-2G4 as the doubler model: about 9.6 dB at 1 GHz near +11 dBm per port, like lot L2405. */
const kdxModel: DoublerModel = {
  conversionLossDb: 9.4,
  optimumDriveDbm: 10.1,
  fundamentalRejectionDb: 34.4,
  thirdSuppressionDbc: 29.5,
  fourthSuppressionDbc: 23.5,
  inputBandHz: { min: 0.5e9, max: 1.2e9 },
  unitSpreadDb: 0.2,
};

/** The KM-7H as the mixer model: about 6 dB mid-band rising to 7.7 dB at 3 GHz, like the example unit BFD-0107. */
const kmModel: MixerModel = {
  conversionLossDb: 5.8,
  balunBandHz: { min: 0.15e9, max: 3.5e9 },
  loRfIsolationDb: 40,
  loIfIsolationDb: 35,
  rfIfIsolationDb: 28,
  loPowerDbm: 7,
  ifFrequencyHz: 70e6,
  sweepHz: { start: 500e6, stop: 3000e6, step: 100e6 },
  unitSpreadDb: 0.15,
};

const kmTwoTone: MixerTwoToneModel = {
  conversionGainDb: -6.4,
  iip3Dbm: 15.9,
  inputP1dbDbm: 1,
  loPowerDbm: 7,
  tone1Hz: 1000e6,
  toneSpacingHz: 1e6,
  sweepDbm: { start: -20, stop: 6, step: 2 },
};

const kmPortMatch: MixerPortMatchModel = {
  returnLossDb: { rf: 17, lo: 15, if: 19 },
  balunBandHz: kmModel.balunBandHz,
  isolationDb: { loRf: 40, loIf: 35, rfIf: 28 },
  sweepHz: { start: 500e6, stop: 3000e6, step: 50e6 },
};

const temperatureHeader = (temperatureC: number) => `# temperature: ${temperatureC} C`;

/** Linear interpolation of y(x) on ascending xs, extended linearly past either end. */
function interpolate(xs: number[], ys: number[], x: number): number {
  let i = 0;
  while (i < xs.length - 2 && x > xs[i + 1]) i++;
  return ys[i] + ((ys[i + 1] - ys[i]) * (x - xs[i])) / (xs[i + 1] - xs[i]);
}

/**
 * A doubler unit's 25 °C sweep read at `temperatureC`: the ring at T behaves as at 25 °C with the drive
 * moved by the optimum drive's shift, its loss raised by the coefficient (the wanted and higher orders
 * come through the ring; the fundamental leaks through the balance and stays), plus reading noise.
 */
function doublerAtTemperature(at25: () => Buffer, temperatureC: number, seed: number): () => Buffer {
  return () => {
    const noise = mulberry32(seed);
    const lines = at25().toString("utf8").split("\n");
    const rows = lines.filter((l) => /^-?\d/.test(l)).map((l) => l.split(",").map(Number));
    const drive = rows.map((r) => r[0]);
    const shiftDb = optimumDriveShiftDb(kdxModel.optimumDriveDbm, temperatureC);
    const lossDb = DIODE_CONVERSION_LOSS_DB_PER_C * (temperatureC - 25);
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("# temperature:")) return temperatureHeader(temperatureC);
          if (!/^-?\d/.test(line)) return line;
          const [p, p1] = line.split(",").map(Number);
          // The whole response against drive slides by the shift: out_T(p) = out_25(p − shift) + shift − Δloss.
          const moved = [2, 3, 4].map((k) => interpolate(drive, rows.map((r) => r[k]), p - shiftDb) + shiftDb - lossDb + (noise() - 0.5) * 0.1);
          return [p, p1 + (noise() - 0.5) * 0.3, ...moved].map((v) => v.toFixed(2)).join(",");
        })
        .join("\n"),
    );
  };
}

/** A mixer unit's 25 °C sweep (semicolons, decimal commas) read at `temperatureC`: loss and isolation moved by their coefficients. */
function mixerAtTemperature(at25: () => Buffer, temperatureC: number, seed: number): () => Buffer {
  return () => {
    const noise = mulberry32(seed);
    const dT = temperatureC - 25;
    const comma = (x: number) => x.toFixed(2).replace(".", ",");
    const value = (v: string) => Number(v.replace(",", "."));
    return Buffer.from(
      at25()
        .toString("utf8")
        .split("\n")
        .map((line) => {
          if (line.startsWith("# temperature:")) return temperatureHeader(temperatureC);
          if (!/^\d/.test(line)) return line;
          const [frequency, loss, isolation] = line.split(";");
          return [
            frequency,
            comma(value(loss) + DIODE_CONVERSION_LOSS_DB_PER_C * dT + (noise() - 0.5) * 0.06),
            comma(value(isolation) + ISOLATION_DB_PER_C * dT + (noise() - 0.5) * 0.4),
          ].join(";");
        })
        .join("\n"),
    );
  };
}

/** LO–IF and RF–IF isolation of a unit whose conversion-loss sweep had only LO–RF: the mixer model's two columns. */
function isolationSweep(serial: string, lot: string, seed: number): () => Buffer {
  return () => {
    const lines = mixerFrequencySweep(kmModel, { serial, lot }, seed).split("\n");
    return Buffer.from(
      lines
        .map((line) => {
          if (line.startsWith("frequency [MHz]")) return "frequency [MHz],isolation_lo_if [dB],isolation_rf_if [dB]";
          if (!/^\d/.test(line)) return line;
          const [frequency, , , loIf, rfIf] = line.split(",");
          return [frequency, loIf, rfIf].join(",");
        })
        .join("\n"),
    );
  };
}

const TEMPERATURES = [-40, 25, 85] as const;
const temperatureWord = (t: number) => (t < 0 ? `m${-t}c` : `${t}c`);

/** The doubler's runs over temperature, in upload order. */
function doublerUploads(at25: Record<string, () => Buffer>): DemoUpload[] {
  const uploads: DemoUpload[] = [];
  const base = { org: "kestrine", part: "KDX-2G4", instruments: ["source", "analyzer"], approve: true, approveAfterRevisionA: true };
  ["BFD-0002", "BFD-0003"].forEach((serial, u) => {
    for (const t of [-40, 85]) {
      uploads.push({ ...base, file: `drive-sweep-${serial.toLowerCase()}-${temperatureWord(t)}.csv`, fields: { measuredOn: t < 0 ? "2026-10-20" : "2026-10-21" }, bytes: doublerAtTemperature(at25[serial], t, 401 + 10 * u + (t < 0 ? 0 : 1)) });
    }
  });
  ["BFD-0011", "BFD-0012"].forEach((serial, u) => {
    for (const t of TEMPERATURES) {
      const text = doublerDriveSweep(kdxModel, { serial, lot: "L2410", inputFrequencyHz: 1e9, temperatureC: t, sourceSweepDbm: { start: -5, stop: 20 } }, 4100 + u);
      uploads.push({ ...base, file: `drive-sweep-${serial.toLowerCase()}-${temperatureWord(t)}.csv`, fields: { measuredOn: t < 0 ? "2026-10-20" : t > 25 ? "2026-10-21" : "2026-10-22" }, bytes: () => Buffer.from(text) });
    }
  });
  // Lot L2410 across the input band at 25 °C as well: conversion loss against input frequency.
  ["BFD-0011", "BFD-0012"].forEach((serial, u) => {
    for (const inputFrequencyHz of [0.6e9, 1.2e9]) {
      const text = doublerDriveSweep(kdxModel, { serial, lot: "L2410", inputFrequencyHz, sourceSweepDbm: { start: -5, stop: 20 } }, 4100 + u);
      uploads.push({ ...base, file: `drive-sweep-${serial.toLowerCase()}-${inputFrequencyHz / 1e6}mhz.csv`, fields: { measuredOn: "2026-10-23" }, bytes: () => Buffer.from(text) });
    }
  });
  return uploads;
}

/** The mixer's runs over temperature, isolation, two-tone and port match, in upload order. */
function mixerUploads(at25: Record<string, () => Buffer>): DemoUpload[] {
  const base = { org: "kestrine", part: "KM-7H", instruments: ["source", "analyzer"], approve: true };
  const uploads: DemoUpload[] = [];
  ["BFD-0108", "BFD-0109"].forEach((serial, u) => {
    for (const t of [-40, 85]) {
      uploads.push({ ...base, file: `frequency-sweep-${serial.toLowerCase()}-${temperatureWord(t)}.csv`, fields: { measuredOn: t < 0 ? "2026-09-28" : "2026-09-29" }, bytes: mixerAtTemperature(at25[serial], t, 501 + 10 * u + (t < 0 ? 0 : 1)) });
    }
  });
  ["BFD-0131", "BFD-0132"].forEach((serial, u) => {
    for (const t of TEMPERATURES) {
      const text = mixerFrequencySweep(kmModel, { serial, lot: "L2412", temperatureC: t }, 5100 + u);
      uploads.push({ ...base, file: `frequency-sweep-${serial.toLowerCase()}-${temperatureWord(t)}.csv`, fields: { measuredOn: t < 0 ? "2026-09-28" : t > 25 ? "2026-09-29" : "2026-09-30" }, bytes: () => Buffer.from(text) });
    }
  });
  ["BFD-0107", "BFD-0108", "BFD-0109", "BFD-0110"].forEach((serial, u) => {
    uploads.push({ ...base, file: `isolation-sweep-${serial.toLowerCase()}.csv`, fields: { measuredOn: "2026-09-30" }, bytes: isolationSweep(serial, "L2409", 5200 + u) });
  });
  [["BFD-0108", "L2409"], ["BFD-0109", "L2409"], ["BFD-0110", "L2409"], ["BFD-0131", "L2412"], ["BFD-0132", "L2412"]].forEach(([serial, lot], u) => {
    const text = mixerTwoTone(kmTwoTone, { serial, lot }, 5300 + u);
    // The file names the tones and the LO drive; the upload states the IF the runs were made at, as the sweeps' files do.
    uploads.push({ ...base, file: `two-tone-${serial.toLowerCase()}.tsv`, fields: { measuredOn: "2026-10-01", ifFrequencyHz: String(kmModel.ifFrequencyHz) }, bytes: () => Buffer.from(text) });
  });
  [["BFD-0107", "L2409"], ["BFD-0108", "L2409"], ["BFD-0131", "L2412"], ["BFD-0132", "L2412"]].forEach(([serial, lot], u) => {
    const text = mixerPortMatch(kmPortMatch, { serial }, 5400 + u);
    uploads.push({ ...base, file: `port-match-${serial.toLowerCase()}.s3p`, fields: { serial, lot, temperatureC: "25", measuredOn: "2026-10-02" }, instruments: ["vna"], bytes: () => Buffer.from(text) });
  });
  return uploads;
}

/** Every run of this file, given the 25 °C sweeps of demo-measurements.ts by serial. */
export function demoCharacterizationUploads(at25: Record<string, () => Buffer>): DemoUpload[] {
  return [...doublerUploads(at25), ...mixerUploads(at25)];
}
