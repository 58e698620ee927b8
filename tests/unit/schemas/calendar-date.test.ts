import { describe, expect, it } from "vitest";
import { calendarDateProblem, calendarDateSchema, daysInMonth, isCalendarDate, optionalCalendarDateSchema } from "@/lib/schemas/calendar-date";
import { instrumentBodySchema, uploadFieldsSchema } from "@/lib/schemas/measurements";

describe("calendar dates", () => {
  it.each([
    ["2024-02-29", true], // 2024 is divisible by 4
    ["2000-02-29", true], // a century divisible by 400
    ["1900-02-29", false], // a century not divisible by 400
    ["2100-02-29", false],
    ["2025-02-29", false],
    ["2026-02-28", true],
    ["2026-02-30", false],
    ["2026-04-30", true],
    ["2026-04-31", false],
    ["2026-12-31", true],
    ["2026-13-01", false],
    ["2026-00-10", false],
    ["2026-01-00", false],
    ["0000-00-00", false],
    ["1899-12-31", false],
    ["1900-01-01", true],
    ["9999-12-31", true],
    ["2026-3-31", false],
    ["20260331", false],
    ["2026-03-31T00:00", false],
    ["31.03.2026", false],
    ["", false],
    ["２０２６-03-31", false], // full-width digits are not \d
  ])("%s → %s", (text, ok) => {
    expect(isCalendarDate(text)).toBe(ok);
  });

  // Outside reference: ECMAScript's own Gregorian day arithmetic (ECMA-262 §21.4.1: Date.UTC with
  // day 0 of the next month gives the last day of this one), over a whole 400-year cycle.
  it("agrees with ECMAScript's Date on the length of every month of 2000–2399", () => {
    for (let year = 2000; year < 2400; year++) {
      for (let month = 1; month <= 12; month++) {
        expect(daysInMonth(year, month)).toBe(new Date(Date.UTC(year, month, 0)).getUTCDate());
      }
    }
  });

  it("says what is wrong", () => {
    expect(calendarDateProblem("2026-02-30")).toBe("2026-02-30 is not a date: February 2026 has 28 days");
    expect(calendarDateProblem("2026-13-01")).toBe("2026-13-01 is not a date: there is no month 13");
    expect(calendarDateProblem("0000-00-00")).toBe("0000-00-00 is not a date: the year must be from 1900 to 9999");
    expect(calendarDateProblem("03/31/2026")).toBe('"03/31/2026" is not a date as YYYY-MM-DD (e.g. 2026-03-31)');
  });

  it("the required schema trims; the optional one takes blank as missing", () => {
    expect(calendarDateSchema.parse(" 2026-03-31 ")).toBe("2026-03-31");
    expect(calendarDateSchema.safeParse("").success).toBe(false);
    expect(optionalCalendarDateSchema.parse("")).toBeUndefined();
    expect(optionalCalendarDateSchema.parse("   ")).toBeUndefined();
    expect(optionalCalendarDateSchema.parse(undefined)).toBeUndefined();
    expect(optionalCalendarDateSchema.safeParse("2026-02-30").success).toBe(false);
  });

  it("is the rule of the upload fields and the instrument dates", () => {
    const upload = uploadFieldsSchema.safeParse({ measuredOn: "2026-02-30" });
    expect(upload.success).toBe(false);
    expect(upload.error?.issues[0].path).toEqual(["measuredOn"]);
    const instrument = instrumentBodySchema.safeParse({ kind: "power meter", model: "M", serial: "S", calibratedOn: "2026-13-01", calibrationDueOn: "2027-01-01" });
    expect(instrument.error?.issues[0].path).toEqual(["calibratedOn"]);
  });
});
