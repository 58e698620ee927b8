"use client";

import { useMemo, useState, useSyncExternalStore } from "react";
import { VegaEmbed } from "react-vega";
import { expressionInterpreter } from "vega-interpreter";
import type { Curve } from "@/lib/analysis/types";
import { buildCurveSpec, CHART_FONTS, type ChartFonts } from "@/lib/charts";

/** The page's own font stacks (next/font names them), so chart text matches the text around it. */
function readFonts(): ChartFonts {
  const root = getComputedStyle(document.documentElement);
  const text = root.getPropertyValue("--font-text").trim();
  const figures = root.getPropertyValue("--font-figures").trim();
  return { text: text ? `${text}, ${CHART_FONTS.text}, sans-serif` : CHART_FONTS.text, figures: figures ? `${figures}, ${CHART_FONTS.figures}, monospace` : CHART_FONTS.figures };
}

const noSubscribe = () => () => {};

export default function CurveChart({ curve, thermalFloorDbcHz }: { curve: Curve; thermalFloorDbcHz?: number }) {
  const fontsKey = useSyncExternalStore(noSubscribe, () => JSON.stringify(readFonts()), () => "");
  const [failed, setFailed] = useState<string | null>(null);
  const spec = useMemo(
    () => buildCurveSpec(curve, { width: "container", height: 260, fonts: fontsKey ? (JSON.parse(fontsKey) as ChartFonts) : CHART_FONTS, thermalFloorDbcHz }),
    [curve, fontsKey, thermalFloorDbcHz],
  );
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
      data-testid={`chart-${curve.id}`}
      />
    </>
  );
}

/** vega-tooltip's "custom" theme, in the page's paper and ink. */
const tooltipCss = `
#vg-tooltip-element.custom-theme { background: var(--color-paper-bright); color: var(--color-ink); border: 1px solid var(--color-rule-strong);
  border-radius: var(--radius); box-shadow: 0 2px 6px color-mix(in srgb, var(--color-ink) 12%, transparent);
  font-family: var(--font-text), sans-serif; font-size: 13px; padding: 6px 9px; }
#vg-tooltip-element.custom-theme td.key { color: var(--color-ink-muted); padding-right: 8px; }
#vg-tooltip-element.custom-theme td.value { font-family: var(--font-figures), monospace; font-variant-numeric: tabular-nums; }
`;
