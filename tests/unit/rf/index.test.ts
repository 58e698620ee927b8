import { describe, expect, it } from "vitest";
import * as rf from "@/lib/rf";
import * as stats from "@/lib/stats";

describe("barrel exports", () => {
  it("exposes each topic's entry points without name clashes", () => {
    for (const name of ["computeConversionLossDb", "findCompressionPoint", "fitInterceptPoint", "integratePhaseNoise", "findSpurs", "summarizePortMatch"]) {
      expect(typeof (rf as Record<string, unknown>)[name]).toBe("function");
    }
    for (const name of ["summarizeSample", "computeToleranceFactorExact", "computeCapability", "combineUncertainty", "decideConformity"]) {
      expect(typeof (stats as Record<string, unknown>)[name]).toBe("function");
    }
  });
});
