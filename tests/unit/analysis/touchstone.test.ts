import { describe, expect, it } from "vitest";
import { analyzeExample, log10, pick, valueOf } from "./helpers";

// Mismatch formulas (Pozar, Microwave Engineering §2.3): RL = −20·log10|Γ|, VSWR = (1+|Γ|)/(1−|Γ|).
const returnLoss = (gamma: number) => -20 * log10(gamma);
const vswr = (gamma: number) => (1 + gamma) / (1 - gamma);

describe("2-port attenuator (attenuator-2port.s2p, MA)", () => {
  const { parameters: p } = analyzeExample("attenuator-2port.s2p");

  it("gives worst-case and band-centre match", () => {
    // |S11| grows from 0.0201 to 0.0501 at 3010 MHz (last row): the worst case.
    expect(valueOf(p, "return-loss", { port: 1, statistic: "worst" })).toBeCloseTo(returnLoss(0.0501), 9);
    expect(valueOf(p, "vswr", { port: 1, statistic: "worst" })).toBeCloseTo(vswr(0.0501), 9);
    // Centre (10 + 3010)/2 = 1510 MHz, a row of the file: |S11| 0.0351, |S22| 0.03861.
    expect(valueOf(p, "return-loss", { port: 1, frequencyHz: 1.51e9 })).toBeCloseTo(returnLoss(0.0351), 9);
    expect(valueOf(p, "vswr", { port: 2, frequencyHz: 1.51e9 })).toBeCloseTo(vswr(0.03861), 9);
  });

  it("gives insertion loss −20·log10|S21|", () => {
    expect(valueOf(p, "insertion-loss", { path: "S21", frequencyHz: 1.51e9 })).toBeCloseTo(-20 * log10(0.495707), 9);
    expect(valueOf(p, "insertion-loss", { path: "S21", statistic: "worst" })).toBeCloseTo(-20 * log10(0.491445), 9);
    expect(pick(p, "insertion-loss", { path: "S21", statistic: "worst" }).conditions).toMatchObject({ startHz: 10e6, stopHz: 3.01e9 });
  });
});

describe("3-port splitter (splitter-3port.s3p, dB/angle)", () => {
  const { parameters: p, curves } = analyzeExample("splitter-3port.s3p");

  it("gives transmission, balance vs 0° and output isolation at 1.5 GHz", () => {
    // Row 1.500 GHz: S21 −3.35 dB ∠−93.0°, S31 −3.40 dB ∠−92.2°, S32 −22.0 dB.
    const at = { frequencyHz: 1.5e9 };
    expect(valueOf(p, "insertion-loss", { path: "S21", ...at })).toBeCloseTo(3.35, 9);
    expect(valueOf(p, "insertion-loss", { path: "S31", ...at })).toBeCloseTo(3.4, 9);
    expect(valueOf(p, "amplitude-balance", at)).toBeCloseTo(-3.35 - -3.4, 9);
    expect(valueOf(p, "phase-balance", at)).toBeCloseTo(-93.0 - -92.2, 9);
    expect(pick(p, "phase-balance", at).conditions.nominalDeg).toBe(0);
    expect(valueOf(p, "isolation", { path: "S32", ...at })).toBeCloseTo(22, 9);
    // Worst isolation over the band: S32 = −18.0 dB at 0.5 and 2.5 GHz.
    expect(valueOf(p, "isolation", { path: "S32", statistic: "worst" })).toBeCloseTo(18, 9);
  });

  it("gives VSWR from the dB reflection (port 1: −22 dB at 1.5 GHz)", () => {
    expect(valueOf(p, "vswr", { port: 1, frequencyHz: 1.5e9 })).toBeCloseTo(vswr(10 ** (-22 / 20)), 9);
    expect(valueOf(p, "return-loss", { port: 1, statistic: "worst" })).toBeCloseTo(19, 9);
    expect(curves.find((c) => c.id === "return-loss")!.series).toHaveLength(3);
  });
});

describe("a 3-port read as port match only (a mixer's RF, LO and IF with the LO off)", () => {
  const full = analyzeExample("splitter-3port.s3p");
  const { parameters: p, curves } = analyzeExample("splitter-3port.s3p", { touchstone: { portMatchOnly: true } });

  it("gives each port's return loss and VSWR, the same as the full reading, and nothing by a splitter's roles", () => {
    // Port 1 at 1.5 GHz: −22 dB reflection (the file's row), as above.
    expect(valueOf(p, "vswr", { port: 1, frequencyHz: 1.5e9 })).toBeCloseTo(vswr(10 ** (-22 / 20)), 9);
    const matchOf = (ps: typeof p) => ps.filter((x) => x.name === "return-loss" || x.name === "vswr" || x.name === "mismatch-loss");
    expect(matchOf(p)).toEqual(matchOf(full.parameters));
    expect(p.filter((x) => ["insertion-loss", "isolation", "amplitude-balance", "phase-balance"].includes(x.name))).toEqual([]);
    expect(curves.map((c) => c.id)).toEqual(["return-loss"]);
    expect(full.curves.map((c) => c.id)).toContain("amplitude-balance");
  });
});

describe("4-port quadrature hybrid (ports 1 in, 2 through, 3 coupled, 4 isolated)", () => {
  const v2 = analyzeExample("hybrid-4port-v2.s4p");
  const v1 = analyzeExample("hybrid-4port.s4p");

  it("gives insertion loss, amplitude and phase balance vs 90° at 2 GHz (v2, MA)", () => {
    // Row 2.000 GHz: S21 0.693614 ∠−114°, S31 0.678784 ∠157.484037°, S41 0.070795.
    const p = v2.parameters;
    const at = { frequencyHz: 2e9 };
    expect(valueOf(p, "insertion-loss", { path: "S21", ...at })).toBeCloseTo(-20 * log10(0.693614), 9);
    expect(valueOf(p, "insertion-loss", { path: "S31", ...at })).toBeCloseTo(-20 * log10(0.678784), 9);
    expect(valueOf(p, "amplitude-balance", at)).toBeCloseTo(20 * log10(0.693614 / 0.678784), 9);
    // −114 − 157.484037 = −271.484037 ≡ 88.515963°; minus the nominal 90°.
    expect(valueOf(p, "phase-balance", at)).toBeCloseTo(-271.484037 + 360 - 90, 6);
    expect(valueOf(p, "isolation", { path: "S41", ...at })).toBeCloseTo(-20 * log10(0.070795), 9);
  });

  it("reads the RI file to the same figures at 2 GHz", () => {
    // Row 2.000 GHz of hybrid-4port.s4p: S21 = −0.282118 − j0.633648.
    const p = v1.parameters;
    expect(valueOf(p, "insertion-loss", { path: "S21", frequencyHz: 2e9 })).toBeCloseTo(-10 * log10(0.282118 ** 2 + 0.633648 ** 2), 9);
    expect(valueOf(p, "phase-balance", { frequencyHz: 2e9 })).toBeCloseTo(valueOf(v2.parameters, "phase-balance", { frequencyHz: 2e9 }), 3);
  });

  it("follows a different port convention given as an option", () => {
    const swapped = analyzeExample("hybrid-4port-v2.s4p", {
      touchstone: { hybridPorts: { input: 1, through: 3, coupled: 2, isolated: 4 } },
    });
    const at = { frequencyHz: 2e9 };
    expect(valueOf(swapped.parameters, "amplitude-balance", at)).toBeCloseTo(-valueOf(v2.parameters, "amplitude-balance", at), 9);
    expect(pick(swapped.parameters, "phase-balance", at).conditions.nominalDeg).toBe(-90);
    expect(() =>
      analyzeExample("hybrid-4port-v2.s4p", { touchstone: { hybridPorts: { input: 1, through: 1, coupled: 2, isolated: 4 } } }),
    ).not.toThrow();
    const bad = analyzeExample("hybrid-4port-v2.s4p", { touchstone: { hybridPorts: { input: 1, through: 1, coupled: 2, isolated: 4 } } });
    expect(bad.warnings.join("\n")).toContain("not distinct");
  });
});
