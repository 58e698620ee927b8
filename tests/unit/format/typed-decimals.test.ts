import { describe, expect, it } from "vitest";
import { countTypedDecimals, shortestDecimals } from "@/lib/format";

describe("countTypedDecimals: the decimals a figure was typed with", () => {
  it.each([
    ["9.5", 1],
    ["10.0", 1],
    ["10", 0],
    ["9.50", 2],
    ["\u22123.25", 2],
    ["-0.125", 3],
    ["+13", 0],
    [" 7.0 ", 1],
    [".5", 1],
    ["1.5e-3", 4],
    ["2.50E3", 0],
  ])("%s has %i", (text, decimals) => {
    expect(countTypedDecimals(text)).toBe(decimals);
  });

  it.each(["", "  ", "abc", "1.2.3", "0x10", "1,5", "-", "."])("says nothing for %j", (text) => {
    expect(countTypedDecimals(text)).toBeUndefined();
  });
});

describe("shortestDecimals: the fewest decimals that print a stored number back exactly", () => {
  it.each([
    [9.5, 1],
    [10, 0],
    [-155, 0],
    [0.125, 3],
    [1e-7, 7],
    [2.5e9, 0],
  ])("%d needs %i", (value, decimals) => {
    expect(shortestDecimals(value)).toBe(decimals);
  });
});
