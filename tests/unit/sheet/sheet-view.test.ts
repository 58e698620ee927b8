import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SheetView } from "@/components/sheet/sheet-view";
import { buildSheetModel } from "@/lib/sheet";
import { loadDoublerInput } from "./fixture";
import { combGeneratorTemplate } from "@/templates";

describe("SheetView", () => {
  const input = loadDoublerInput();

  it("renders header, specifications, charts fallback, annex and the preliminary banner", () => {
    const html = renderToStaticMarkup(createElement(SheetView, { model: buildSheetModel(input), chartSvgs: { "phase-noise": "<svg></svg>" } }));
    expect(html).toContain("OCX-2D40");
    expect(html).toContain("PRELIMINARY — NOT RELEASED");
    expect(html).toContain("Electrical specifications");
    expect(html).toContain("\u2212155");
    expect(html).toContain("T<sub>A</sub>");
    expect(html).toContain("Statistics annex");
    expect(html).toContain("@media print");
    expect(html).toContain('role="img"');
    expect(html).not.toContain("<script");
  });

  it("drops the banner once released", () => {
    const html = renderToStaticMarkup(
      createElement(SheetView, { model: buildSheetModel({ ...input, revision: { ...input.revision, label: "C", state: "released" } }) }),
    );
    expect(html).not.toContain("PRELIMINARY");
    expect(html).toContain("Rev. C");
  });

  it("renders a fourth, test-only class without any change to the view", () => {
    const model = buildSheetModel(
      { ...input, device: { ...input.device, partNumber: "TST-CMB9", deviceClass: combGeneratorTemplate.deviceClass }, limits: [], prose: {} },
      { template: combGeneratorTemplate },
    );
    const html = renderToStaticMarkup(createElement(SheetView, { model }));
    expect(html).toContain("TST-CMB9");
    expect(html).toMatch(/<th[^>]*>Conversion loss</);
    expect(html).toContain("±1 dB flat comb");
  });
});
