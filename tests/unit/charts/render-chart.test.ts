import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { buildSheetModel } from "@/lib/sheet";
import { renderChartPng, renderChartSvg } from "@/lib/server/charts/render-chart";
import { loadDoublerInput } from "../sheet/fixture";

describe("render-chart", () => {
  it("draws the chart's text with the sheet's fonts", async () => {
    const chart = buildSheetModel(loadDoublerInput()).charts[0];
    const svg = await renderChartSvg(chart.vegaLite);
    expect(svg).toContain('font-family="Source Code Pro"');
    expect(svg).toContain("Per-port drive (dBm)");
    const png = await renderChartPng(chart.vegaLite, { scale: 1 });
    expect(png.subarray(1, 4).toString("latin1")).toBe("PNG");
    // IHDR colour type (PNG spec §11.2.2) at byte 25: 3 = indexed, no alpha channel, which
    // pdfkit embeds without decoding (types 4 and 6 carry alpha); no tRNS chunk either.
    expect(png[25]).toBe(3);
    expect(png.includes(Buffer.from("tRNS", "latin1"))).toBe(false);
  });
});
