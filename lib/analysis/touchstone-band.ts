import type { ParsedMeasurement, TouchstoneData } from "../ingest/types";

export type StatedBand = { startHz: number; stopHz: number };

/**
 * A network's data over the band an upload states (a hybrid's or splitter's band): the frequencies
 * from start to stop inclusive, so the band figures (worst insertion loss, balance, isolation, VSWR)
 * and their `startHz`/`stopHz` conditions are the stated band's. A band the file does not cover, or
 * one that holds fewer than two of its frequencies, is refused with the file's span in the words.
 */
export function restrictTouchstoneToBand(data: TouchstoneData, band: StatedBand): { data: TouchstoneData } | { problem: string; field: "bandStartHz" | "bandStopHz" } {
  const f = data.frequencyHz;
  const count = f.length;
  const span = `the file spans ${f[0]} to ${f[count - 1]} Hz`;
  if (band.startHz < f[0]) return { problem: `The band starts at ${band.startHz} Hz, below the file's lowest frequency: ${span}`, field: "bandStartHz" };
  if (band.stopHz > f[count - 1]) return { problem: `The band stops at ${band.stopHz} Hz, above the file's highest frequency: ${span}`, field: "bandStopHz" };
  let first = 0;
  while (first < count && f[first] < band.startHz) first++;
  let last = count - 1;
  while (last >= 0 && f[last] > band.stopHz) last--;
  const kept = last - first + 1;
  if (kept < 2) return { problem: `The band holds ${Math.max(kept, 0)} of the file's frequencies; state one that holds at least two (${span})`, field: "bandStopHz" };
  if (first === 0 && last === count - 1) return { data };
  const n = data.portCount;
  const sRe = new Float64Array(n * n * kept);
  const sIm = new Float64Array(n * n * kept);
  // Each Sij is a block of `count` frequencies (lib/analysis/tables.ts reads the same layout).
  for (let entry = 0; entry < n * n; entry++) {
    sRe.set(data.sRe.subarray(entry * count + first, entry * count + last + 1), entry * kept);
    sIm.set(data.sIm.subarray(entry * count + first, entry * count + last + 1), entry * kept);
  }
  return { data: { ...data, frequencyHz: f.slice(first, last + 1), sRe, sIm } };
}

/**
 * The parse an upload's figures are derived from: a network over the band the upload states (bandStartHz,
 * bandStopHz), anything else as parsed. One path for the server's upload and the demo snapshots.
 */
export function parsedInStatedBand(
  parsed: ParsedMeasurement,
  band: { bandStartHz?: number; bandStopHz?: number },
): { parsed: ParsedMeasurement } | { problem: string; field: "bandStartHz" | "bandStopHz" } {
  if (parsed.kind !== "touchstone" || band.bandStartHz === undefined || band.bandStopHz === undefined) return { parsed };
  const restricted = restrictTouchstoneToBand(parsed.data, { startHz: band.bandStartHz, stopHz: band.bandStopHz });
  return "problem" in restricted ? restricted : { parsed: { ...parsed, data: restricted.data } };
}
