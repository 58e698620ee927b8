import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { buildSheetModel } from "@/lib/sheet";
import { buildDesignData, hasDesignData, typedFigure } from "@/lib/sheet/design-data";
import { checkPng, refuseSvg, sniffOutlineKind } from "@/lib/sheet/package-outline";
import { sheetModelSchema } from "@/lib/schemas/sheet-model";
import { designDataBodySchema } from "@/lib/schemas/sheets";
import { loadDoublerInput } from "../fixture";
import { makePng, outlineSvg } from "./outline-fixture";

describe("checkPng", () => {
  it("reads the size sharp (libvips) wrote into the IHDR chunk", async () => {
    const png = await makePng(321, 123);
    const meta = await sharp(png).metadata();
    expect(checkPng(png)).toEqual({ ok: true, widthPx: meta.width, heightPx: meta.height });
  });

  it.each([
    ["not a PNG", Buffer.from("GIF89a".padEnd(64, "\0")), /PNG signature/],
    ["a PNG signature without IHDR", Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(40)]), /IHDR/],
  ])("refuses %s", (_name, bytes, message) => {
    const check = checkPng(bytes);
    expect(check.ok).toBe(false);
    expect(!check.ok && check.message).toMatch(message);
  });

  it("refuses a PNG wider than 4000 pixels and one over 512 KiB", async () => {
    const wide = await makePng(4001, 2);
    expect(checkPng(wide)).toMatchObject({ ok: false, message: expect.stringContaining("4001 × 2 pixels") });
    const heavy = Buffer.concat([await makePng(10, 10), Buffer.alloc(512 * 1024)]);
    expect(checkPng(heavy)).toMatchObject({ ok: false, message: expect.stringContaining("at most 524288 bytes") });
  });
});

describe("refuseSvg", () => {
  it("lets a plain drawing through", () => {
    expect(refuseSvg(outlineSvg)).toBeNull();
    expect(refuseSvg(`<svg xmlns="http://www.w3.org/2000/svg"><defs><linearGradient id="g"/></defs><rect fill="url(#g)" width="1" height="1"/><use href="#g"/></svg>`)).toBeNull();
  });

  it.each([
    ["a script", `<svg><script>alert(1)</script></svg>`, /script element/],
    ["an event handler", `<svg onload="alert(1)"></svg>`, /event-handler/],
    ["a foreignObject", `<svg><foreignObject><div/></foreignObject></svg>`, /foreignObject/],
    ["an external image", `<svg><image href="file:///etc/passwd"/></svg>`, /another file/],
    ["an embedded image", `<svg><image href="data:image/png;base64,AAAA"/></svg>`, /another file|embedded image/],
    ["a use of another file", `<svg><use xlink:href="other.svg#a"/></svg>`, /another file/],
    ["an entity declaration", `<!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]><svg>&x;</svg>`, /DOCTYPE/],
    ["a remote url()", `<svg><rect style="fill:url(http://example.invalid/a)"/></svg>`, /url\(\)/],
    ["a stylesheet import", `<svg><style>@import "x.css";</style></svg>`, /@import/],
    ["no svg element", `<html></html>`, /no <svg> element/],
  ])("refuses %s", (_name, text, message) => {
    expect(refuseSvg(text)).toMatch(message);
  });
});

describe("sniffOutlineKind", () => {
  it("tells a PNG, an SVG (with or without an XML declaration and BOM) and anything else apart by content", async () => {
    expect(sniffOutlineKind(await makePng(2, 2))).toBe("png");
    expect(sniffOutlineKind(Buffer.from(outlineSvg))).toBe("svg");
    expect(sniffOutlineKind(Buffer.from(`\uFEFF<!-- CAD export --><svg viewBox="0 0 1 1"/>`))).toBe("svg");
    expect(sniffOutlineKind(Buffer.from("%PDF-1.7"))).toBeNull();
  });
});

describe("design-in data in the sheet model", () => {
  it("prints figures with the digits typed, a true minus, blank as blank", () => {
    expect(typedFigure("9.50").text).toBe("9.50");
    expect(typedFigure("-40").text).toBe("\u221240");
    expect(typedFigure("\u22125").value).toBe(-5);
    expect(typedFigure("")).toEqual({ value: null, text: "" });
  });

  it("is carried by the model, valid against the published schema, and absent data prints nothing", async () => {
    const png = await makePng(40, 20);
    const input = {
      ...loadDoublerInput(),
      designData: {
        pinFunctions: [{ pin: "1", name: "IN", function: "Input" }],
        ordering: [{ partNumber: "OCX-2D40-TR", options: "", packing: "Tape and reel, 500" }],
        recommendedOperatingConditions: [{ parameter: "Input drive", min: "10", typ: "13.0", max: "16", unit: "dBm" }],
        packageOutline: { caption: "Dimensions in mm", sha256: "a".repeat(64), widthPx: 40, heightPx: 20, pngBase64: png.toString("base64") },
      },
    };
    const model = buildSheetModel(input);
    expect(model.designData?.recommendedOperatingConditions[0].typ.text).toBe("13.0");
    expect(model.designData?.packageOutline?.dataUri.startsWith("data:image/png;base64,iVBORw0KGgo")).toBe(true);
    expect(sheetModelSchema.safeParse(model).success).toBe(true);
    expect(hasDesignData(buildSheetModel(loadDoublerInput()).designData)).toBe(false);
    expect(hasDesignData(buildDesignData(undefined))).toBe(false);
  });

  it("refuses a figure that is not a decimal number and min above max, naming the field", () => {
    const body = { pinFunctions: [], ordering: [], recommendedOperatingConditions: [{ parameter: "Drive", min: "0x10", typ: "", max: "", unit: "dBm" }] };
    const bad = designDataBodySchema.safeParse(body);
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(["recommendedOperatingConditions", 0, "min"]);
    const swapped = designDataBodySchema.safeParse({ ...body, recommendedOperatingConditions: [{ parameter: "Drive", min: "16", typ: "", max: "10", unit: "dBm" }] });
    expect(swapped.error?.issues[0].path).toEqual(["recommendedOperatingConditions", 0, "max"]);
    expect(designDataBodySchema.safeParse({ ...body, recommendedOperatingConditions: [{ parameter: "Drive", min: "−5", typ: "", max: "10", unit: "dBm" }] }).success).toBe(true);
  });
});
