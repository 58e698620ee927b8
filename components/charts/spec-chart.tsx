"use client";

import { useMemo, useState, useSyncExternalStore } from "react";
import { VegaEmbed } from "react-vega";
import { expressionInterpreter } from "vega-interpreter";
import { CHART_FONTS, chartConfig, type ChartFonts, type ChartMedium } from "@/lib/charts";

/** The page's own font stacks (next/font names them), so chart text matches the text around it. */
function readFonts(): ChartFonts {
  const root = getComputedStyle(document.documentElement);
  const text = root.getPropertyValue("--font-text").trim();
  const figures = root.getPropertyValue("--font-figures").trim();
  return { text: text ? `${text}, ${CHART_FONTS.text}, sans-serif` : CHART_FONTS.text, figures: figures ? `${figures}, ${CHART_FONTS.figures}, monospace` : CHART_FONTS.figures };
}

const noSubscribe = () => () => {};

/** The page's chart fonts once in the browser; null while rendering on the server. */
export function usePageChartFonts(): ChartFonts | null {
  const key = useSyncExternalStore(noSubscribe, () => JSON.stringify(readFonts()), () => "");
  return useMemo(() => (key ? (JSON.parse(key) as ChartFonts) : null), [key]);
}

/** A Vega-Lite spec drawn as SVG, with the page's tooltip look; a spec Vega refuses says so in words. */
export function VegaView({ spec, testId }: { spec: Record<string, unknown>; testId: string }) {
  const [failed, setFailed] = useState<string | null>(null);
  if (failed) return <p className="text-sm text-signal-deep">The chart could not be drawn: {failed}</p>;
  return (
    <>
      <style>{tooltipCss}</style>
      <VegaEmbed
        spec={spec}
        // ast + interpreter: Vega evaluates its expressions without new Function, so the page's
        // Content-Security-Policy needs no 'unsafe-eval' (vega-embed README, options `ast` and `expr`).
        options={{ renderer: "svg", actions: false, tooltip: { theme: "custom" }, ast: true, expr: expressionInterpreter }}
        onError={(e) => setFailed(e instanceof Error ? e.message : String(e))}
        className="w-full"
        data-testid={testId}
      />
    </>
  );
}

/**
 * A chart already built by lib/charts (a review overlay, a sheet chart): drawn with the page's
 * fonts put into the spec's shared config, so it reads like the charts the page builds itself.
 */
export default function SpecChart({ spec, medium = "screen", testId }: { spec: Record<string, unknown>; medium?: ChartMedium; testId: string }) {
  const fonts = usePageChartFonts();
  const themed = useMemo(() => (fonts ? { ...spec, config: chartConfig(medium, fonts) } : spec), [spec, fonts, medium]);
  return <VegaView spec={themed} testId={testId} />;
}

/** vega-tooltip's "custom" theme, in the page's paper and ink. */
const tooltipCss = `
#vg-tooltip-element.custom-theme { background: var(--color-paper-bright); color: var(--color-ink); border: 1px solid var(--color-rule-strong);
  border-radius: var(--radius); box-shadow: 0 2px 6px color-mix(in srgb, var(--color-ink) 12%, transparent);
  font-family: var(--font-text), sans-serif; font-size: 13px; padding: 6px 9px; }
#vg-tooltip-element.custom-theme td.key { color: var(--color-ink-muted); padding-right: 8px; }
#vg-tooltip-element.custom-theme td.value { font-family: var(--font-figures), monospace; font-variant-numeric: tabular-nums; }
`;
