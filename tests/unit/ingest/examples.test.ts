import { describe, expect, it } from "vitest";
import { parseMeasurementFile, sParameter, type ParsedMeasurement } from "@/lib/ingest";
import { fixtureBytes } from "./fixture-files";

function parseExample(name: string): ParsedMeasurement {
  return parseMeasurementFile({ fileName: name, bytes: fixtureBytes("examples", name) });
}

describe("good examples parse with exact values", () => {
  it("drive sweep of a mixer used as a doubler", () => {
    const r = parseExample("drive-sweep-doubler.csv");
    if (r.kind !== "drive-sweep") throw new Error(r.kind);
    const d = r.data;
    expect(r.warnings).toEqual([]);
    expect(d.serial).toBe("BFD-0001");
    expect(d.lot).toBe("L2405");
    expect(d.temperatureC).toBe(25);
    expect(d.inputFrequencyHz).toBe(1e9);
    expect(d.wantedOrder).toBe(2);
    expect(d.splitterExcessLossDb).toBe(0.4);
    expect(d.cableLossDb).toBe(0.6);
    expect(d.inputPowerDbm).toHaveLength(26);
    expect(d.inputPowerDbm[0]).toBe(-5);
    expect(d.inputPowerDbm[25]).toBe(20);
    expect(d.harmonics.map((h) => h.order)).toEqual([1, 2, 3, 4]);
    // Row "15.00,-21.33,4.47,-25.08,-18.80" (line 31)
    expect(d.harmonics.map((h) => h.outputPowerDbm[20])).toEqual([-21.33, 4.47, -25.08, -18.8]);
    // Row "-5.00,-61.68,-37.53,-70.13,-59.03" (line 11)
    expect(d.harmonics[1].outputPowerDbm[0]).toBe(-37.53);
  });

  it("frequency sweep of a mixer, semicolon-delimited with decimal commas", () => {
    const r = parseExample("frequency-sweep-mixer.csv");
    if (r.kind !== "frequency-sweep") throw new Error(r.kind);
    const d = r.data;
    expect(d.serial).toBe("BFD-0107");
    expect(d.loPowerDbm).toBe(7);
    expect(d.ifFrequencyHz).toBe(70e6);
    expect(d.frequencyHz).toHaveLength(26);
    expect(d.frequencyHz[0]).toBe(500e6);
    expect(d.frequencyHz[25]).toBe(3000e6);
    // "500;6,03;37,29" and "3000;7,76;27,99"
    expect(d.conversionLossDb![0]).toBe(6.03);
    expect(d.isolationLoRfDb![0]).toBe(37.29);
    expect(d.conversionLossDb![25]).toBe(7.76);
    expect(d.isolationLoRfDb![25]).toBe(27.99);
    expect(d.outputPowerDbm).toBeUndefined();
  });

  it("two-tone test, tab-delimited", () => {
    const r = parseExample("two-tone-mixer.tsv");
    if (r.kind !== "two-tone") throw new Error(r.kind);
    const d = r.data;
    expect(d.tone1FrequencyHz).toBe(1000e6);
    expect(d.tone2FrequencyHz).toBe(1001e6);
    expect(d.toneSpacingHz).toBe(1e6);
    expect(d.inputPowerPerToneDbm).toEqual([-20, -18, -16, -14, -12, -10, -8, -6, -4, -2, 0]);
    expect([d.fundamentalOutputDbm[0], d.im3OutputDbm[0]]).toEqual([-26.4, -98.16]);
    expect([d.fundamentalOutputDbm[10], d.im3OutputDbm[10]]).toEqual([-7.12, -40.42]);
  });

  it("phase-noise trace of a doubler output from 1 Hz to 10 MHz", () => {
    const r = parseExample("phase-noise-doubler.csv");
    if (r.kind !== "phase-noise") throw new Error(r.kind);
    const d = r.data;
    expect(d.carrierFrequencyHz).toBe(2e9);
    expect(d.carrierPowerDbm).toBe(3.2);
    expect(d.multiplicationFactor).toBe(2);
    expect(d.offsetHz).toHaveLength(74);
    expect([d.offsetHz[0], d.lDbcHz[0]]).toEqual([1, -111.83]);
    expect([d.offsetHz[73], d.lDbcHz[73]]).toEqual([1e7, -165.85]);
    const spur = d.offsetHz.indexOf(50);
    expect(d.lDbcHz[spur]).toBe(-108.5);
  });

  it("2-port v1 (.s2p, MHz, MA): order N11 N21 N12 N22", () => {
    const r = parseExample("attenuator-2port.s2p");
    if (r.kind !== "touchstone") throw new Error(r.kind);
    const d = r.data;
    expect(d.version).toBe(1);
    expect(d.portCount).toBe(2);
    expect(d.referenceOhm).toEqual([50, 50]);
    expect(d.frequencyHz).toHaveLength(31);
    expect(d.frequencyHz[0]).toBe(10e6);
    // Line 4: "10.0 0.020100 39.500000 0.500006 -0.360000 0.499006 -0.060000 0.022110 34.500000"
    const s21 = sParameter(d, 2, 1);
    const s12 = sParameter(d, 1, 2);
    expect(Math.hypot(s21.re[0], s21.im[0])).toBeCloseTo(0.500006, 12);
    expect((Math.atan2(s21.im[0], s21.re[0]) * 180) / Math.PI).toBeCloseTo(-0.36, 10);
    expect(Math.hypot(s12.re[0], s12.im[0])).toBeCloseTo(0.499006, 12);
    expect((Math.atan2(s12.im[0], s12.re[0]) * 180) / Math.PI).toBeCloseTo(-0.06, 10);
  });

  it("3-port v1 power splitter (.s3p, DB)", () => {
    const r = parseExample("splitter-3port.s3p");
    if (r.kind !== "touchstone") throw new Error(r.kind);
    const d = r.data;
    expect(d.portCount).toBe(3);
    expect(d.sourceFormat).toBe("DB");
    expect(d.frequencyHz[0]).toBe(0.5e9);
    // Row 1 of the first record: "-19 30 | -3.2 -31 | -3.25 -30.2": S13 = -3.25 dB ∠ -30.2°
    const s13 = sParameter(d, 1, 3);
    expect(20 * Math.log10(Math.hypot(s13.re[0], s13.im[0]))).toBeCloseTo(-3.25, 12);
    expect((Math.atan2(s13.im[0], s13.re[0]) * 180) / Math.PI).toBeCloseTo(-30.2, 10);
    const s23 = sParameter(d, 2, 3);
    expect(20 * Math.log10(Math.hypot(s23.re[0], s23.im[0]))).toBeCloseTo(-18, 12);
  });

  it("4-port v1 quadrature hybrid (.s4p, RI) and the same network in v2 (MA) agree", () => {
    const v1 = parseExample("hybrid-4port.s4p");
    const v2 = parseExample("hybrid-4port-v2.s4p");
    if (v1.kind !== "touchstone" || v2.kind !== "touchstone") throw new Error("kind");
    expect(v1.data.portCount).toBe(4);
    expect(v2.data.version).toBe(2);
    expect(v2.data.referenceOhm).toEqual([50, 50, 50, 50]);
    // Line 4: S12 = 0.000000 - j0.698088, S13 = -0.676143 + j0.004946
    expect(sParameter(v1.data, 1, 2).im[0]).toBe(-0.698088);
    expect(sParameter(v1.data, 1, 3).re[0]).toBe(-0.676143);
    for (let e = 0; e < 16 * 21; e++) {
      expect(Math.abs(v1.data.sRe[e] - v2.data.sRe[e])).toBeLessThan(2e-6);
      expect(Math.abs(v1.data.sIm[e] - v2.data.sIm[e])).toBeLessThan(2e-6);
    }
    // A 90° hybrid: through and coupled arms about 90° apart, 3.1–3.4 dB each.
    const thru = sParameter(v1.data, 2, 1);
    const coupled = sParameter(v1.data, 3, 1);
    for (let k = 0; k < 21; k++) {
      const dphi = ((Math.atan2(thru.im[k], thru.re[k]) - Math.atan2(coupled.im[k], coupled.re[k])) * 180) / Math.PI;
      expect(Math.abs(((dphi + 540) % 360) - 180)).toBeGreaterThan(88);
      expect(Math.abs(((dphi + 540) % 360) - 180)).toBeLessThan(92);
      expect(-20 * Math.log10(Math.hypot(thru.re[k], thru.im[k]))).toBeGreaterThan(3.1);
      expect(-20 * Math.log10(Math.hypot(coupled.re[k], coupled.im[k]))).toBeLessThan(3.4);
    }
  });
});
