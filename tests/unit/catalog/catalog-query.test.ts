import { describe, expect, it } from "vitest";
import { catalogParameters, emptyCatalogQuery, parseCatalogQuery, readQuantity, serializeCatalogQuery, type CatalogQuery } from "@/lib/catalog/catalog-query";

const parse = (qs: string) => parseCatalogQuery(new URLSearchParams(qs));
function ok(qs: string): CatalogQuery {
  const result = parse(qs);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.query;
}
function issues(qs: string) {
  const result = parse(qs);
  if (result.ok) throw new Error(`accepted: ${qs}`);
  return result.issues;
}

describe("parseCatalogQuery", () => {
  it("reads nothing as the default query: current revisions by part number, first page", () => {
    expect(ok("")).toEqual(emptyCatalogQuery);
  });

  it("reads class, organization, text, covers and paging", () => {
    const q = ok("q=doubler+KDX&class=frequency-multiplier&org=kestrel-rf&covers=2.4%20GHz&page=3&limit=10&rev=all&sort=released&dir=desc");
    expect(q).toMatchObject({ text: "doubler KDX", deviceClass: "frequency-multiplier", organization: "kestrel-rf", revisions: "all", sort: "released", dir: "desc", page: 3, pageSize: 10 });
    // 2.4 GHz = 2.4 × 10⁹ Hz (SI prefix giga, BIPM SI Brochure 9th ed., Table 7).
    expect(q.coversHz).toBe(2.4e9);
  });

  it.each([
    ["conversion-loss.max<=10 dB", { key: "conversion-loss", field: "max", op: "le", value: 10 }],
    ["conversion-loss<=10dB", { key: "conversion-loss", field: "max", op: "le", value: 10 }],
    ["conversion-loss ≤ 10", { key: "conversion-loss", field: "max", op: "le", value: 10 }],
    ["fundamental-suppression.min>=25 dBc", { key: "fundamental-suppression", field: "min", op: "ge", value: 25 }],
    ["fundamental-suppression>=25", { key: "fundamental-suppression", field: "min", op: "ge", value: 25 }],
    ["drive<=+13 dBm", { key: "drive", field: null, op: "le", value: 13 }],
    ["drive>=−3 dBm", { key: "drive", field: null, op: "ge", value: -3 }],
    ["vswr.max<=1.5", { key: "vswr", field: "max", op: "le", value: 1.5 }],
    ["vswr.max<=1.5:1", { key: "vswr", field: "max", op: "le", value: 1.5 }],
    ["conversion-loss.typ<=7.5 dB", { key: "conversion-loss", field: "typ", op: "le", value: 7.5 }],
  ])("reads the condition %s", (f, expected) => {
    expect(ok(new URLSearchParams({ f }).toString()).conditions[0]).toMatchObject(expected);
  });

  it.each([
    ["covers=2400 MHz", 2.4e9],
    ["covers=2.4GHz", 2.4e9],
    ["covers=500 kHz", 5e5],
    ["covers=10e9 Hz", 1e10],
  ])("converts %s to hertz", (qs, hz) => {
    expect(ok(qs).coversHz).toBeCloseTo(hz, 3);
  });

  it.each([
    ["f=conversion-loss.max<=ten dB", "f[0]", /not a decimal number/],
    ["f=conversion-loss.max<=0x10 dB", "f[0]", /not a decimal number/],
    ["f=conversion-loss.max<=10 dBm", "f[0]", /unknown unit "dBm"/],
    ["f=drive<=13 GHz", "f[0]", /unknown unit "GHz"/],
    ["f=warp-factor.max<=9", "f[0]", /Unknown parameter "warp-factor"/],
    ["f=conversion-loss.avg<=9", "f[0]", /not min, typ or max/],
    ["f=drive.max<=9 dBm", "f[0]", /one figure per sheet/],
    ["f=conversion-loss=9", "f[0]", /no <= or >=/],
    ["f=conversion-loss<=", "f[0]", /value is missing/],
    ["covers=2.4", "covers", /needs a unit/],
    ["covers=2.4 dB", "covers", /unknown unit "dB"/],
    ["covers=-1 GHz", "covers", /above zero/],
    ["class=toaster", "class", /Unknown device class/],
    ["org=Not%20A%20Slug", "org", /short name/],
    ["page=0", "page", /whole number/],
    ["page=1.5", "page", /whole number/],
    ["limit=1000", "limit", /whole number from 1 to 100/],
    ["sort=title", "sort", /Cannot sort/],
    ["sort=conversion-loss", "sort", /Cannot sort/],
    ["dir=up", "dir", /asc/],
    ["rev=B", "rev", /current/],
    ["q=a&q=b", "q", /once/],
  ])("refuses %s naming %s", (qs, field, message) => {
    const found = issues(qs);
    expect(found[0].field).toBe(field);
    expect(found[0].message).toMatch(message);
  });

  it("refuses ten thousand characters of text, naming the field and without echoing it", () => {
    const found = issues(`q=${"x".repeat(10_000)}`);
    expect(found).toEqual([{ field: "q", message: "q is 10000 characters long; at most 200 are read." }]);
  });

  it("refuses an inverted range on the same figure, and accepts a proper one", () => {
    const found = issues(new URLSearchParams([["f", "conversion-loss.max>=12 dB"], ["f", "conversion-loss.max<=10 dB"]]).toString());
    expect(found[0]).toMatchObject({ field: "f[1]", message: expect.stringMatching(/lower bound is above the upper one/) });
    expect(ok(new URLSearchParams([["f", "drive>=7 dBm"], ["f", "drive<=13 dBm"]]).toString()).conditions).toHaveLength(2);
  });

  it("refuses more than eight conditions", () => {
    const many = new URLSearchParams(Array.from({ length: 9 }, () => ["f", "drive<=13 dBm"]));
    expect(issues(many.toString())[0].field).toBe("f");
  });

  it("reads a page's searchParams object as well as URLSearchParams", () => {
    const result = parseCatalogQuery({ class: "double-balanced-mixer", f: ["conversion-loss<=8 dB", "drive<=10 dBm"] });
    expect(result.ok && result.query.conditions.map((c) => c.key)).toEqual(["conversion-loss", "drive"]);
  });
});

describe("serializeCatalogQuery", () => {
  it.each([
    "",
    "q=doubler&class=frequency-multiplier&org=kestrel-rf&covers=2.4+GHz&f=conversion-loss.max%3C%3D10+dB&f=drive%3C%3D%2B13+dBm&rev=all&sort=conversion-loss.max&dir=desc&page=2&limit=50",
    "f=fundamental-suppression.min%3E%3D25+dBc&sort=drive",
  ])("writes back what it read: %s", (qs) => {
    expect(serializeCatalogQuery(ok(qs))).toBe(qs);
    expect(ok(serializeCatalogQuery(ok(qs)))).toEqual(ok(qs));
  });

  it("leaves the defaults out", () => {
    expect(serializeCatalogQuery({ ...emptyCatalogQuery, text: "mixer" })).toBe("q=mixer");
  });
});

describe("catalogParameters", () => {
  it("offers each parameter the templates define, rows that split a parameter, and the drive fact", () => {
    const p = catalogParameters();
    expect(p.get("conversion-loss")).toMatchObject({ unit: "dB", column: "parameter" });
    expect(p.get("conversion-loss")!.deviceClasses).toEqual(expect.arrayContaining(["frequency-multiplier", "double-balanced-mixer"]));
    expect(p.get("fundamental-suppression")).toMatchObject({ unit: "dBc", column: "row_id", deviceClasses: ["frequency-multiplier"] });
    expect(p.get("vswr")).toMatchObject({ unit: ":1", column: "parameter" });
    expect(p.get("drive")).toMatchObject({ unit: "dBm", column: "fact" });
    // A row whose id is a parameter's name is that parameter, not a second entry.
    expect(p.get("input-p1db")!.column).toBe("parameter");
  });
});

describe("readQuantity", () => {
  it("keeps a value without a unit in the parameter's own unit where a unit is optional", () => {
    expect(readQuantity("10", "dB", { unitRequired: false })).toEqual({ ok: true, value: 10 });
    expect(readQuantity("+13", "dBm", { unitRequired: false })).toEqual({ ok: true, value: 13 });
  });
});
