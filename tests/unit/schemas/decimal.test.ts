import { describe, expect, it } from "vitest";
import { z } from "zod";
import { parseDecimalText } from "@/lib/ingest/number";
import { minNotAboveMax, optionalDecimal, parseRecordId, requiredDecimal } from "@/lib/schemas/decimal";
import { deviceBodySchema, uploadFieldsSchema } from "@/lib/schemas/measurements";
import { specLimitsBodySchema } from "@/lib/schemas/sheets";

describe("parseDecimalText: the one strict reader for numbers typed or sent as text", () => {
  it.each([
    ["12", 12],
    ["-3.5", -3.5],
    ["+7", 7],
    [".5", 0.5],
    ["5.", 5],
    ["2.4e9", 2.4e9],
    ["2.4E+9", 2.4e9],
    ["-1e-3", -1e-3],
    ["  42  ", 42],
    ["\u22125", -5], // U+2212 MINUS SIGN, as pasted from typeset documents
    ["0", 0],
    ["-0", -0],
    ["007", 7], // leading zeros are decimal, not octal
  ])("%j → %s", (text, value) => {
    expect(parseDecimalText(text)).toBe(value);
  });

  it.each(["", " ", "\t\n"])("blank %j is missing, never 0", (text) => {
    expect(parseDecimalText(text)).toBeUndefined();
  });

  it.each(["0x10", "0X1f", "0b101", "0o17", "Infinity", "-Infinity", "NaN", "inf", "1,5", "1_000", "1 000", "12abc", "e5", "1e", "--1", "+-1", "1.2.3", "1e400", "-1e400", "٣", "１２"])(
    "%j is refused (NaN)",
    (text) => {
      expect(parseDecimalText(text)).toBeNaN();
    },
  );
});

describe("the zod helpers", () => {
  const schema = z.object({ x: optionalDecimal({ label: "x", min: -10, max: 10 }), n: optionalDecimal({ label: "n", integer: true, min: 1 }) });

  it.each([
    [{}, {}],
    [{ x: "" }, { x: undefined }],
    [{ x: "  " }, { x: undefined }],
    [{ x: null }, { x: undefined }],
    [{ x: "-2.5" }, { x: -2.5 }],
    [{ x: 3 }, { x: 3 }],
    [{ n: "12" }, { n: 12 }],
  ])("%j → %j", (input, output) => {
    expect(schema.parse(input)).toEqual(output);
  });

  it.each([
    [{ x: "0x1" }, 'x must be a decimal number such as 12.5 or -3e9, found "0x1"'],
    [{ x: "11" }, "x must be at most 10"],
    [{ x: -11 }, "x must be at least -10"],
    [{ x: true }, "x must be a number"],
    [{ n: "1.5" }, 'n must be a whole number, found "1.5"'],
    [{ n: "1e400" }, 'n must be a decimal number such as 12.5 or -3e9, found "1e400"'],
  ])("%j → %s", (input, message) => {
    const result = schema.safeParse(input);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toBe(message);
  });

  it("a required number refuses blank", () => {
    const r = requiredDecimal({ label: "id" }).safeParse("");
    expect(r.error?.issues[0].message).toBe("id is missing");
  });

  it("min above max is refused on the max field, naming both; equal ends are allowed", () => {
    const band = z.object({ min: z.number(), max: z.number() }).superRefine(minNotAboveMax("band"));
    expect(band.safeParse({ min: 2, max: 2 }).success).toBe(true);
    const r = band.safeParse({ min: 3, max: 2 });
    expect(r.error?.issues[0]).toMatchObject({ path: ["max"], message: "band: the minimum 3 is above the maximum 2" });
  });
});

describe("where the helpers are used", () => {
  it("upload fields: hexadecimal refused, blank missing, instrument ids decimal", () => {
    expect(uploadFieldsSchema.safeParse({ temperatureC: "0x10" }).error?.issues[0].path).toEqual(["temperatureC"]);
    expect(uploadFieldsSchema.parse({ temperatureC: " ", cableLossDb: "" })).toEqual({ instrumentIds: [] });
    expect(uploadFieldsSchema.parse({ instrumentIds: ["3", "12"] }).instrumentIds).toEqual([3, 12]);
    expect(uploadFieldsSchema.safeParse({ instrumentIds: ["0x3"] }).error?.issues[0].path).toEqual(["instrumentIds", 0]);
    expect(uploadFieldsSchema.safeParse({ supersedesId: "1e2" }).success).toBe(true);
    expect(uploadFieldsSchema.safeParse({ supersedesId: "0b11" }).success).toBe(false);
  });

  it("a device's frequency bands", () => {
    const device = (inputFrequencyHz: { min: number; max: number }) => ({ partNumber: "P-1", deviceClass: "frequency-multiplier", title: "A part", keyConditions: { inputFrequencyHz } });
    expect(deviceBodySchema.safeParse(device({ min: 1e9, max: 2e9 })).success).toBe(true);
    expect(deviceBodySchema.safeParse(device({ min: 2e9, max: 1e9 })).error?.issues[0].path).toEqual(["keyConditions", "inputFrequencyHz", "max"]);
  });

  it("spec limits", () => {
    const limits = (min: number, max: number) => ({ limits: [{ parameter: "conversion-loss", conditionsKey: "", min, max, unit: "dB", basis: "test" }] });
    expect(specLimitsBodySchema.safeParse(limits(8, 12)).success).toBe(true);
    expect(specLimitsBodySchema.safeParse(limits(12, 8)).error?.issues[0].message).toBe("limits: the minimum 12 is above the maximum 8");
  });
});

describe("parseRecordId: ids in paths and query strings", () => {
  it.each([
    ["1", 1],
    ["42", 42],
    ["4294967296", 2 ** 32],
    ["007", 7],
  ])("%j → %s", (text, id) => {
    expect(parseRecordId(text)).toBe(id);
  });
  it.each([undefined, "", "0", "-1", "0x10", "1e2", "1.0", " 16", "16 ", "+16", "4294967297", "99999999999", "١٦"])("%j is not an id", (text) => {
    expect(parseRecordId(text)).toBeUndefined();
  });
});

describe("an instrument's uncertainty row", () => {
  it("says a blank value (sent as NaN by the form) is not a number, rather than zod's wording", async () => {
    const { instrumentBodySchema } = await import("@/lib/schemas/measurements");
    const body = { kind: "power meter", model: "M", serial: "S", calibratedOn: "2026-01-05", calibrationDueOn: "2027-01-05" };
    const row = (value: number) => ({ ...body, uncertainty: [{ quantity: "power", value, unit: "dB" }] });
    expect(instrumentBodySchema.safeParse(row(Number.NaN)).error?.issues[0].message).toBe("Enter the uncertainty as a number.");
    expect(instrumentBodySchema.safeParse(row(0)).error?.issues[0].message).toBe("The uncertainty must be above 0.");
    expect(instrumentBodySchema.safeParse(row(0.3)).success).toBe(true);
  });
});
