import { describe, expect, it } from "vitest";
import { lowerFirst } from "@/lib/format/text";

describe("a label inside a sentence", () => {
  it.each([
    ["Input 1 dB compression", "input 1 dB compression"],
    ["Isolation LO–RF", "isolation LO–RF"],
    ["Conversion loss, highest in band", "conversion loss, highest in band"],
    ["LO drive", "LO drive"],
    ["RF frequency", "RF frequency"],
    ["VSWR, highest in band", "VSWR, highest in band"],
    ["", ""],
  ])("%s → %s", (label, expected) => expect(lowerFirst(label)).toBe(expected));
});
