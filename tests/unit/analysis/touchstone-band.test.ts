import { describe, expect, it } from "vitest";
import { deriveParameters } from "@/lib/analysis";
import { restrictTouchstoneToBand } from "@/lib/analysis/touchstone-band";
import { parseTouchstone } from "@/lib/ingest";
import { fixtureText } from "../ingest/fixture-files";

// A hybrid's stated band (issue 13): the network is derived over the band's frequencies only. The
// reference is the file itself with the lines outside the band deleted by hand (text, not our slicing),
// parsed and derived the ordinary way: both must give the same data and the same figures.

const full = fixtureText("examples", "hybrid-4port-v2.s4p");

/** The example with only the frequency blocks from startGHz to stopGHz, and its frequency count to match. */
function keepBlocks(startGHz: number, stopGHz: number): string {
  const lines = full.split("\n");
  const out: string[] = [];
  let keep = true;
  let kept = 0;
  let inData = false;
  for (const line of lines) {
    if (line.startsWith("[Network Data]")) inData = true;
    if (inData && /^\d/.test(line)) {
      const f = Number(line.split(/\s+/)[0]);
      keep = f >= startGHz - 1e-9 && f <= stopGHz + 1e-9;
      if (keep) kept++;
    }
    if (line.startsWith("[End]")) keep = true;
    if (!inData || keep || !/^(\d|\s)/.test(line) || line.trim() === "") out.push(line);
  }
  return out.join("\n").replace(/\[Number of Frequencies\] \d+/, `[Number of Frequencies] ${kept}`);
}

describe("restrictTouchstoneToBand", () => {
  it("gives the same network and the same band figures as the file cut to the band by hand", () => {
    const whole = parseTouchstone("hybrid.s4p", full).data;
    const cut = parseTouchstone("hybrid-cut.s4p", keepBlocks(1.8, 2.2)).data;
    const restricted = restrictTouchstoneToBand(whole, { startHz: 1.8e9, stopHz: 2.2e9 });
    if (!("data" in restricted)) throw new Error(restricted.problem);
    expect(Array.from(restricted.data.frequencyHz)).toEqual(Array.from(cut.frequencyHz));
    expect(cut.frequencyHz.length).toBe(9);
    expect(Array.from(restricted.data.sRe)).toEqual(Array.from(cut.sRe));
    expect(Array.from(restricted.data.sIm)).toEqual(Array.from(cut.sIm));
    const figures = (data: typeof whole) => deriveParameters({ kind: "touchstone", data, warnings: [] }).parameters;
    expect(figures(restricted.data)).toEqual(figures(cut));
    expect(figures(restricted.data).find((p) => p.name === "insertion-loss")?.conditions).toMatchObject({ startHz: 1.8e9, stopHz: 2.2e9 });
  });

  it("keeps the data as it is when the band is the file's span", () => {
    const whole = parseTouchstone("hybrid.s4p", full).data;
    const same = restrictTouchstoneToBand(whole, { startHz: 1.5e9, stopHz: 2.5e9 });
    expect("data" in same && same.data).toBe(whole);
  });

  it.each([
    [{ startHz: 1.4e9, stopHz: 2e9 }, "bandStartHz", "below the file's lowest frequency: the file spans 1500000000 to 2500000000 Hz"],
    [{ startHz: 2e9, stopHz: 2.6e9 }, "bandStopHz", "above the file's highest frequency"],
    [{ startHz: 2.01e9, stopHz: 2.04e9 }, "bandStopHz", "holds 0 of the file's frequencies"],
    [{ startHz: 2e9, stopHz: 2.04e9 }, "bandStopHz", "holds 1 of the file's frequencies"],
  ])("%j is refused naming %s", (band, field, words) => {
    const result = restrictTouchstoneToBand(parseTouchstone("hybrid.s4p", full).data, band);
    expect(result).toMatchObject({ field });
    expect("problem" in result && result.problem).toContain(words);
  });
});
