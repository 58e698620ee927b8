import { describe, expect, it } from "vitest";
import {
  chooseScale,
  formatByteSize,
  formatNumber,
  formatQuantity,
  formatRange,
  formatScientific,
  quantityParts,
  rangeParts,
  splitPrefixedUnit,
  type QuantityStyle,
} from "@/lib/format";

// Written out so a test reads what a reader sees: U+2212 minus, U+2013 en dash, U+00A0 no-break space.
const M = "\u2212";
const N = "\u00a0";

describe("formatNumber", () => {
  it.each<[number, Parameters<typeof formatNumber>[1], string]>([
    [0, {}, "0"],
    [-0, {}, "0"],
    [2.5, {}, "2.5"],
    [2.4567, {}, "2.457"],
    [2500, {}, "2500"], // no digit grouping
    [1234567.25, { digits: { decimals: 1 } }, "1234567.3"],
    [-3.25, {}, `${M}3.25`], // a true minus, U+2212
    [-3.25, { plain: true }, "-3.25"], // the CLI's hyphen-minus, same digits
    [-0.0004, { digits: { decimals: 3 } }, "0.000"], // rounds to zero: no sign
    [-0.0004, { digits: { maxDecimals: 3 } }, "0"],
    [13, { signed: true }, "+13"],
    [0, { signed: true }, "0"], // zero is never signed
    [0.04, { signed: true, digits: { maxDecimals: 1 } }, "0"],
    [-7, { signed: true }, `${M}7`],
    [9.5, { digits: { decimals: 2 } }, "9.50"], // fixed decimals keep their zeros
    [9.5, { digits: { maxDecimals: 2 } }, "9.5"],
    [0.0042, { digits: { maxDecimals: 2 } }, "0"],
    [0.0042, { digits: { maxDecimals: 2, minSignificant: 3 } }, "0.0042"], // a small RMS error is not "0"
    [0.004217, { digits: { maxDecimals: 2, minSignificant: 3 } }, "0.00422"],
    [12.345, { digits: { maxDecimals: 2, minSignificant: 3 } }, "12.35"],
    [1234.5, { digits: { significant: 3 } }, "1230"],
    [0.012345, { digits: { significant: 3 } }, "0.0123"],
    [1, { digits: { significant: 4 } }, "1.000"],
    [999.96, { digits: { significant: 4 } }, "1000"],
    [12.5, { digits: { maxSignificant: 6 } }, "12.5"],
    [1e-7, { digits: { maxSignificant: 6 } }, "0.0000001"],
    [Number.NaN, {}, "\u2014"],
    [Number.POSITIVE_INFINITY, {}, "\u2014"],
  ])("%d %j → %s", (value, style, text) => {
    expect(formatNumber(value, style)).toBe(text);
  });
});

describe("formatQuantity", () => {
  it.each<[number, string, QuantityStyle, string]>([
    // Frequencies take the largest prefix that keeps the value at 1 or more.
    [2.45e9, "Hz", {}, `2.45${N}GHz`],
    [70e6, "Hz", {}, `70${N}MHz`],
    [1e3, "Hz", {}, `1${N}kHz`],
    [12.59, "Hz", {}, `12.59${N}Hz`],
    [0.5, "Hz", {}, `0.5${N}Hz`], // never millihertz
    [0, "Hz", {}, `0${N}Hz`],
    [-1.5e6, "Hz", {}, `${M}1.5${N}MHz`],
    // Rounding at a prefix boundary carries into the next prefix.
    [999.96e6, "Hz", { digits: { significant: 4 } }, `1.000${N}GHz`],
    [999.96e6, "Hz", { digits: { maxDecimals: 1 } }, `1${N}GHz`],
    [999.96e6, "Hz", { digits: { decimals: 1 } }, `1.0${N}GHz`],
    [999.96e6, "Hz", {}, `999.96${N}MHz`],
    [999.4e6, "Hz", { digits: { maxDecimals: 0 } }, `999${N}MHz`],
    // Logarithmic units, temperatures and ratios never take a prefix.
    [-1500, "dBm", {}, `${M}1500${N}dBm`],
    [-165.2, "dBc/Hz", { digits: { maxDecimals: 1 } }, `${M}165.2${N}dBc/Hz`],
    [12000, "dB", {}, `12000${N}dB`],
    [0, "dB", { digits: { decimals: 2 } }, `0.00${N}dB`],
    [13, "dBm", { signed: true }, `+13${N}dBm`],
    [-40, "°C", {}, `${M}40${N}°C`],
    [290, "K", {}, `290${N}K`],
    // The degree and a ratio follow the number; "deg" is printed "°".
    [90.25, "deg", {}, "90.25°"],
    [1.5, ":1", { digits: { decimals: 2 } }, "1.50:1"],
    [3, "", {}, "3"],
    // Other SI units take prefixes both ways.
    [0.0021, "W", {}, `2.1${N}mW`],
    [2.5e-9, "s", {}, `2.5${N}ns`],
    // The CLI's plain style: hyphen-minus, plain space, same digits.
    [-4, "dBm", { plain: true }, "-4 dBm"],
    [1e6, "Hz", { plain: true }, "1 MHz"],
    // prefix: false keeps the unit as given (an axis already scaled).
    [2450, "MHz", {}, `2450${N}MHz`],
    [2.45e9, "Hz", { prefix: false }, `2450000000${N}Hz`],
  ])("%d %s %j → %s", (value, unit, style, text) => {
    expect(formatQuantity(value, unit, style)).toBe(text);
  });

  it("gives the parts separately for renderers that set the unit apart", () => {
    expect(quantityParts(2.45e9, "Hz")).toEqual({ value: "2.45", unit: "GHz" });
    expect(quantityParts(-3, "dBm", { signed: true })).toEqual({ value: `${M}3`, unit: "dBm" });
  });
});

describe("formatRange", () => {
  it.each<[number, number, string, QuantityStyle, string]>([
    // One prefix, from the larger end, for both ends; the unit once.
    [200e6, 2e9, "Hz", {}, `0.2\u20132${N}GHz`],
    [0.5e9, 1.5e9, "Hz", {}, `0.5\u20131.5${N}GHz`],
    [1.7e9, 2.3e9, "Hz", {}, `1.7\u20132.3${N}GHz`],
    [100e6, 1e9, "Hz", {}, `0.1\u20131${N}GHz`], // 0.1 is still read in GHz
    // Unless the smaller end would read below 0.1: then the smaller end's prefix.
    [99e6, 1e9, "Hz", {}, `99\u20131000${N}MHz`],
    [10e6, 3e9, "Hz", {}, `10\u20133000${N}MHz`],
    [5e6, 2.5e9, "Hz", {}, `5\u20132500${N}MHz`],
    [0, 2e9, "Hz", {}, `0\u20132${N}GHz`], // a zero end never forces a smaller prefix
    [500, 2e3, "Hz", {}, `0.5\u20132${N}kHz`],
    // Rounding carries the larger end across the prefix boundary.
    [500e6, 999.96e6, "Hz", { digits: { maxDecimals: 1 } }, `0.5\u20131${N}GHz`],
    [1e6, 999.96e6, "Hz", { digits: { maxDecimals: 1 } }, `1\u20131000${N}MHz`],
    // dB quantities never take a prefix; a signed end is joined by "to", not a dash.
    [-10, 5, "dBm", { signed: true }, `${M}10 to +5${N}dBm`],
    [-30, -10, "dBm", {}, `${M}30 to ${M}10${N}dBm`],
    [10, 20, "dB", {}, `10\u201320${N}dB`],
    [-40, 85, "°C", {}, `${M}40 to 85${N}°C`],
    [2e9, 2e9, "Hz", {}, `2${N}GHz`],
    [10e6, 3e9, "Hz", { plain: true }, "10\u20133000 MHz"],
  ])("%d–%d %s %j → %s", (min, max, unit, style, text) => {
    expect(formatRange(min, max, unit, style)).toBe(text);
  });

  it("gives the parts separately", () => {
    expect(rangeParts(200e6, 2e9, "Hz")).toEqual({ value: "0.2\u20132", unit: "GHz" });
  });
});

describe("chooseScale", () => {
  it.each<[number, string, { unit: string; factor: number }]>([
    [2.4e9, "Hz", { unit: "GHz", factor: 1e-9 }],
    [70e6, "Hz", { unit: "MHz", factor: 1e-6 }],
    [0, "Hz", { unit: "Hz", factor: 1 }],
    [20, "dB", { unit: "dB", factor: 1 }],
  ])("%d %s", (magnitude, unit, scale) => {
    expect(chooseScale(magnitude, unit)).toEqual(scale);
  });
});

describe("splitPrefixedUnit", () => {
  // SI Brochure, 9th ed., Table 7: G = 10^9, M = 10^6, k = 10^3, m = 10^-3, µ = 10^-6, p = 10^-12.
  it.each([
    ["GHz", { base: "Hz", factor: 1e9 }],
    ["MHz", { base: "Hz", factor: 1e6 }],
    ["Hz", { base: "Hz", factor: 1 }],
    ["mW", { base: "W", factor: 1e-3 }],
    ["µs", { base: "s", factor: 1e-6 }],
    ["pA", { base: "A", factor: 1e-12 }],
    ["k\u03a9", { base: "\u03a9", factor: 1e3 }],
  ] as const)("%s", (unit, split) => {
    expect(splitPrefixedUnit(unit)).toEqual(split);
  });

  it.each(["dB", "dBm", "dBc/Hz", "mdB", "°C", "mHz", "THz!", ""])("%s takes no prefix here", (unit) => {
    expect(splitPrefixedUnit(unit)).toBeNull();
  });
});

describe("formatScientific and formatByteSize", () => {
  it.each<[string, string]>([
    [formatScientific(-1.23456e-5, 3, { plain: true }), "-1.235e-5"],
    [formatScientific(-1.23456e-5, 3), `${M}1.235e${M}5`],
    [formatScientific(2.5e7, 3, { plain: true }), "2.500e+7"],
    [formatByteSize(95), `95${N}bytes`],
    [formatByteSize(2048), `2.0${N}kB`],
    [formatByteSize(1.5 * 1024 * 1024, { plain: true }), "1.5 MB"],
  ])("%s", (actual, expected) => {
    expect(actual).toBe(expected);
  });
});
