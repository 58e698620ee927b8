/**
 * What a designer needs beside the specifications: the package outline, pin functions, ordering
 * information and the recommended operating conditions, as the engineer stated them. Pure: the
 * drawing arrives as checked PNG bytes (lib/sheet/package-outline.ts; an SVG is rasterised on the
 * server first) and leaves as a data URI, so the frozen model of a release carries it whole.
 */

import { parseDecimalText } from "../ingest/number";
import { countTypedDecimals } from "../format/typed-decimals";
import { emptyValue, formatLimitValue } from "./format";
import type { DesignData, DesignDataInput, FormattedValue } from "./types";

export const emptyDesignData: DesignData = { packageOutline: null, pinFunctions: [], ordering: [], recommendedOperatingConditions: [] };

/** A figure as typed: "9.5" prints "9.5", "-40" prints "−40", blank is empty. */
export function typedFigure(text: string): FormattedValue {
  const value = parseDecimalText(text);
  if (value === undefined || !Number.isFinite(value)) return emptyValue;
  return formatLimitValue(value, countTypedDecimals(text));
}

export function buildDesignData(input: DesignDataInput | undefined): DesignData {
  if (!input) return { ...emptyDesignData };
  const outline = input.packageOutline;
  return {
    packageOutline: outline
      ? { caption: outline.caption, sha256: outline.sha256, widthPx: outline.widthPx, heightPx: outline.heightPx, dataUri: `data:image/png;base64,${outline.pngBase64}` }
      : null,
    pinFunctions: input.pinFunctions.map(({ pin, name, function: role }) => ({ pin, name, function: role })),
    ordering: input.ordering.map(({ partNumber, options, packing }) => ({ partNumber, options, packing })),
    recommendedOperatingConditions: input.recommendedOperatingConditions.map((c) => ({
      parameter: c.parameter,
      min: typedFigure(c.min),
      typ: typedFigure(c.typ),
      max: typedFigure(c.max),
      unit: c.unit,
    })),
  };
}

/** True when the sheet has anything to print in its design-in section. */
export function hasDesignData(data: DesignData | undefined): data is DesignData {
  return !!data && (data.packageOutline !== null || data.pinFunctions.length > 0 || data.ordering.length > 0 || data.recommendedOperatingConditions.length > 0);
}
