import { describe, expect, it } from "vitest";
import { revisionLetter, revisionSequence } from "@/lib/sheet";

describe("revision letters", () => {
  // Bijective base 26, the way spreadsheet columns are lettered (common practice; the pairs below
  // are the column letters of any spreadsheet program, written from memory: 27 AA, 52 AZ, 53 BA,
  // 702 ZZ, 703 AAA).
  it.each([
    [1, "A"],
    [2, "B"],
    [26, "Z"],
    [27, "AA"],
    [28, "AB"],
    [52, "AZ"],
    [53, "BA"],
    [702, "ZZ"],
    [703, "AAA"],
  ])("release %i is %s, and back", (sequence, letter) => {
    expect(revisionLetter(sequence)).toBe(letter);
    expect(revisionSequence(letter)).toBe(sequence);
  });

  it("runs through every number without a gap or a repeat", () => {
    const seen = new Set<string>();
    for (let n = 1; n <= 2000; n++) {
      const letter = revisionLetter(n);
      expect(seen.has(letter)).toBe(false);
      seen.add(letter);
      expect(revisionSequence(letter)).toBe(n);
    }
  });

  it("refuses a sequence that is not a positive integer, and reads nothing that is not capitals", () => {
    expect(() => revisionLetter(0)).toThrow(RangeError);
    expect(() => revisionLetter(1.5)).toThrow(RangeError);
    expect(revisionSequence("a")).toBeNull();
    expect(revisionSequence("A1")).toBeNull();
    expect(revisionSequence("")).toBeNull();
  });
});
