import { describe, expect, it } from "vitest";
import { notationSegments } from "@/lib/sheet";

describe("notationSegments", () => {
  it("sets the letters after '_' as a subscript, word by word", () => {
    expect(notationSegments("T_A")).toEqual([{ text: "T", sub: "A" }]);
    expect(notationSegments("P_in − P_out of the wanted order")).toEqual([
      { text: "P", sub: "in" },
      { text: " − " },
      { text: "P", sub: "out" },
      { text: " of the wanted order" },
    ]);
    expect(notationSegments("NF_kT")).toEqual([{ text: "NF", sub: "kT" }]);
  });

  it("leaves text without the notation as it is", () => {
    expect(notationSegments("L(f)")).toEqual([{ text: "L(f)" }]);
    expect(notationSegments("")).toEqual([]);
    // Two underscores in one word are not the notation (no word boundary after the first).
    expect(notationSegments("snake_case_word")).toEqual([{ text: "snake_case_word" }]);
  });
});

describe("plainNotation", () => {
  it("sets subscripts on the line for plain-text issue messages, and leaves other text alone", async () => {
    const { plainNotation } = await import("@/lib/sheet/notation");
    expect(plainNotation("Conversion loss (Frequency 1 GHz in, T_A 25 °C): Nelson test 1")).toBe("Conversion loss (Frequency 1 GHz in, TA 25 °C): Nelson test 1");
    expect(plainNotation("snake_case_word")).toBe("snake_case_word");
  });
});
