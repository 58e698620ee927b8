import { describe, expect, it } from "vitest";
import { decideConformity } from "@/lib/stats/decision";

// ILAC-G8:09/2019 §4.2.1 (simple acceptance, w = 0) and §4.2.2 (guard band w = U).
// Limits: conversion loss ≤ 8.0 dB, U = 0.435 dB (the GUM budget example).
const u = 0.435;

describe("conformity decisions", () => {
  it.each([
    { measuredValue: 7.0, rule: "simple-acceptance" as const, decision: "pass", conditional: false },
    { measuredValue: 7.8, rule: "simple-acceptance" as const, decision: "pass", conditional: true },
    { measuredValue: 8.0, rule: "simple-acceptance" as const, decision: "pass", conditional: true },
    { measuredValue: 8.2, rule: "simple-acceptance" as const, decision: "fail", conditional: true },
    { measuredValue: 9.0, rule: "simple-acceptance" as const, decision: "fail", conditional: false },
    { measuredValue: 7.0, rule: "guard-band" as const, decision: "pass", conditional: false },
    { measuredValue: 7.565, rule: "guard-band" as const, decision: "pass", conditional: false },
    { measuredValue: 7.8, rule: "guard-band" as const, decision: "fail", conditional: false },
  ])("$measuredValue dB under $rule", ({ measuredValue, rule, decision, conditional }) => {
    const result = decideConformity({ measuredValue, upperLimit: 8, expandedUncertainty: u, rule, unit: "dB" });
    expect(result.decision).toBe(decision);
    expect(result.conditional).toBe(conditional);
  });

  it("moves the acceptance limits inward by U under guard band", () => {
    const result = decideConformity({ measuredValue: 30, lowerLimit: 25, upperLimit: 40, expandedUncertainty: 1.2, rule: "guard-band" });
    expect(result.acceptanceLowerLimit).toBeCloseTo(26.2, 12);
    expect(result.acceptanceUpperLimit).toBeCloseTo(38.8, 12);
    expect(result.guardBand).toBe(1.2);
  });

  it("states the rule in words (ISO/IEC 17025:2017 §7.8.6)", () => {
    const simple = decideConformity({ measuredValue: 7, upperLimit: 8, expandedUncertainty: u, rule: "simple-acceptance", unit: "dB" });
    expect(simple.ruleStatement).toContain("ILAC-G8:09/2019 §4.2.1");
    expect(simple.ruleStatement).toContain("U = 0.435\u00a0dB (k = 2)");
    const guarded = decideConformity({ measuredValue: 7, upperLimit: 8, expandedUncertainty: u, rule: "guard-band", unit: "dB" });
    expect(guarded.ruleStatement).toContain("§4.2.2");
  });

  it("refuses guard bands that close the acceptance zone, and a decision with no limit", () => {
    expect(() =>
      decideConformity({ measuredValue: 1, lowerLimit: 0, upperLimit: 1, expandedUncertainty: 0.6, rule: "guard-band" }),
    ).toThrow(RangeError);
    expect(() => decideConformity({ measuredValue: 1, expandedUncertainty: 0.1, rule: "simple-acceptance" })).toThrow(RangeError);
  });
});
