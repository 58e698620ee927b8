import { describe, expect, it } from "vitest";
import { signedAtText } from "@/lib/sheet/release-text";

describe("signedAtText", () => {
  // RFC 3339 §4.2: a local time with offset +01:00 is one hour ahead of UTC, so 10:14:05+01:00 is 09:14:05Z;
  // -05:00 on 1 December at 23:30 is 04:30 UTC the next day.
  it.each([
    ["2026-12-02T09:14:05Z", "2026-12-02 09:14:05 UTC"],
    ["2026-12-02T09:14:05.987Z", "2026-12-02 09:14:05 UTC"],
    ["2026-12-02T10:14:05+01:00", "2026-12-02 09:14:05 UTC"],
    ["2026-12-01T23:30:00-05:00", "2026-12-02 04:30:00 UTC"],
  ])("%s → %s", (iso, text) => {
    expect(signedAtText(iso)).toBe(text);
  });

  it("refuses a time it cannot read rather than printing a wrong one", () => {
    expect(() => signedAtText("2 December 2026, morning")).toThrow(RangeError);
  });
});
