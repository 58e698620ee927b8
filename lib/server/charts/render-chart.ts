import "server-only";
import { createHash } from "node:crypto";
import { Resvg } from "@resvg/resvg-js";
import sharp from "sharp";
import * as vega from "vega";
import { compile, type TopLevelSpec } from "vega-lite";
import type { SheetModel } from "../../sheet/types";
import { fontFiles, SANS_FAMILY } from "../pdf/fonts";
import { KeptResults } from "../kept-results";

/**
 * Vega-Lite spec → SVG with Vega's headless view (renderer "none", no canvas):
 * the same spec the sheet model carries, so web and PDF charts cannot differ.
 */
export async function renderChartSvg(vegaLite: Record<string, unknown>): Promise<string> {
  const { spec } = compile(vegaLite as unknown as TopLevelSpec);
  const view = new vega.View(vega.parse(spec), { renderer: "none" });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

/**
 * SVG → PNG with resvg, given the sheet's own TTFs and no system fonts: resvg
 * draws no text at all for a family it cannot find (resvg-js font options: fontFiles, loadSystemFonts, defaultFontFamily).
 *
 * The PDF gets an opaque, palette PNG: pdfkit copies such a PNG's compressed data into the
 * PDF as it is, while one with an alpha channel is decoded, split and compressed again on
 * every render (that was a fifth of a warm PDF). A chart's few inks and their anti-aliasing
 * fit 256 colours without visible loss at the 3× scale used here.
 */
export async function renderChartPng(vegaLite: Record<string, unknown>, options: { scale?: number } = {}): Promise<Buffer> {
  return svgToPng(await renderChartSvg(vegaLite), options.scale ?? 3);
}

async function svgToPng(svg: string, scale: number): Promise<Buffer> {
  const resvg = new Resvg(svg, {
    font: {
      fontFiles: [fontFiles.sansRegular, fontFiles.sansSemiBold, fontFiles.monoRegular],
      loadSystemFonts: false,
      defaultFontFamily: SANS_FAMILY,
    },
    fitTo: { mode: "zoom", value: scale },
  });
  const rgba = resvg.render().asPng();
  return sharp(rgba).flatten({ background: "#ffffff" }).png({ palette: true, colours: 256, dither: 0, compressionLevel: 9 }).toBuffer();
}

// A spec's picture never changes, and previews render the same sheet again and again: SVGs (web)
// and PNGs (PDF) are kept in a small content-addressed cache, oldest entry out first, as values
// (never a request's promise: lib/server/kept-results.ts).
const CACHE_ENTRIES = 64;
const svgCache = new KeptResults<string>(CACHE_ENTRIES);
const pngCache = new KeptResults<Buffer>(CACHE_ENTRIES);

function specKey(vegaLite: Record<string, unknown>): string {
  return createHash("sha256").update(JSON.stringify(vegaLite)).digest("hex");
}

function cachedChartSvg(key: string, vegaLite: Record<string, unknown>): Promise<string> {
  return svgCache.get(key, () => renderChartSvg(vegaLite));
}

/** Charts built for one page (the design-in calculator's) as SVG markup, keyed by id, through the same cache. */
export async function renderChartSvgsById(charts: { id: string; vegaLite: Record<string, unknown> }[]): Promise<Record<string, string>> {
  const entries = await Promise.all(charts.map(async (chart) => [chart.id, await cachedChartSvg(specKey(chart.vegaLite), chart.vegaLite)] as const));
  return Object.fromEntries(entries);
}

/** Every chart of a sheet as SVG markup, keyed by chart id, for the web view. */
export function renderSheetChartSvgs(model: SheetModel): Promise<Record<string, string>> {
  return renderChartSvgs(model.charts);
}

/** Charts (an id and a Vega-Lite spec with a width in pixels) as SVG markup, keyed by id: the sheet's, or the compare page's overlays. */
export async function renderChartSvgs(charts: readonly { id: string; vegaLite: Record<string, unknown> }[]): Promise<Record<string, string>> {
  const entries = await Promise.all(charts.map(async (chart) => [chart.id, await cachedChartSvg(specKey(chart.vegaLite), chart.vegaLite)] as const));
  return Object.fromEntries(entries);
}

/** Every chart of a sheet as PNG, keyed by chart id, for the PDF. */
/** Pixels a point of a sheet chart's PNG: printed at its drawn size, 4 px a point is 288 dpi. */
export const CHART_PNG_SCALE = 4;

export async function renderSheetChartPngs(model: SheetModel): Promise<Record<string, Buffer>> {
  const entries = await Promise.all(
    model.charts.map(async (chart) => {
      const key = specKey(chart.vegaLite);
      return [chart.id, await pngCache.get(key, async () => svgToPng(await cachedChartSvg(key, chart.vegaLite), CHART_PNG_SCALE))] as const;
    }),
  );
  return Object.fromEntries(entries);
}
