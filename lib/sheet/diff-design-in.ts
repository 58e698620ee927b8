/**
 * The design-in sections of two sheet models, row by row: pins, ordering information, recommended
 * operating conditions, and the package outline (the drawing by its SHA-256, the caption by text).
 * A model frozen before these sections existed has no designData: it compares as empty.
 */
import { joinUnit } from "../format/quantity";
import type { DesignInChange, DesignInSection } from "./diff-types";
import type { DesignData } from "./types";

type Row = { key: string; line: string; fields: Record<string, string> };

const pinRows = (data: DesignData): Row[] =>
  data.pinFunctions.map((p) => ({
    key: p.pin ? `Pin ${p.pin}` : p.name,
    line: [p.name, p.function].filter(Boolean).join(" · "),
    fields: { pin: p.pin, name: p.name, function: p.function },
  }));

const orderingRows = (data: DesignData): Row[] =>
  data.ordering.map((o) => ({ key: o.partNumber, line: [o.options, o.packing].filter(Boolean).join(" · "), fields: { options: o.options, packing: o.packing } }));

const conditionRows = (data: DesignData): Row[] =>
  data.recommendedOperatingConditions.map((c) => {
    const stated = (["min", "typ", "max"] as const).filter((f) => c[f].text !== "").map((f) => `${f} ${c[f].text}`);
    const line = stated.length ? joinUnit(stated.join(", "), c.unit) : "";
    return { key: c.parameter, line, fields: { min: c.min.text, typ: c.typ.text, max: c.max.text, unit: c.unit } };
  });

/** Rows matched by key; a key given twice is told apart by its occurrence ("GND", "GND"). */
function keyed(rows: Row[]): Map<string, Row> {
  const seen = new Map<string, number>();
  const out = new Map<string, Row>();
  for (const row of rows) {
    const n = (seen.get(row.key) ?? 0) + 1;
    seen.set(row.key, n);
    out.set(n === 1 ? row.key : `${row.key} (${n})`, { ...row, key: n === 1 ? row.key : `${row.key} (${n})` });
  }
  return out;
}

function diffRows(section: DesignInSection, previous: Row[], next: Row[]): DesignInChange[] {
  const before = keyed(previous);
  const after = keyed(next);
  const changes: DesignInChange[] = [];
  for (const [key, row] of after) {
    const old = before.get(key);
    if (!old) {
      changes.push({ section, kind: "added", key, previous: null, next: row.line, fields: [] });
      continue;
    }
    const fields = Object.keys(row.fields).filter((f) => row.fields[f] !== old.fields[f]);
    if (fields.length > 0) changes.push({ section, kind: "changed", key, previous: old.line, next: row.line, fields });
  }
  for (const [key, old] of before) if (!after.has(key)) changes.push({ section, kind: "removed", key, previous: old.line, next: null, fields: [] });
  return changes;
}

/** The outline section's one row: the drawing (compared by digest) and its caption (by text), named apart from the section it is in. */
const OUTLINE = "Drawing and caption";

function diffOutline(previous: DesignData["packageOutline"], next: DesignData["packageOutline"]): DesignInChange[] {
  // The outline's line is its caption ("" when it has none); the drawing itself is compared by digest.
  const line = (o: NonNullable<DesignData["packageOutline"]>) => o.caption;
  if (!previous && !next) return [];
  if (!previous) return [{ section: "outline", kind: "added", key: OUTLINE, previous: null, next: line(next!), fields: [] }];
  if (!next) return [{ section: "outline", kind: "removed", key: OUTLINE, previous: line(previous), next: null, fields: [] }];
  const fields = [...(previous.sha256 !== next.sha256 ? ["drawing"] : []), ...(previous.caption !== next.caption ? ["caption"] : [])];
  return fields.length ? [{ section: "outline", kind: "changed", key: OUTLINE, previous: line(previous), next: line(next), fields }] : [];
}

const none: DesignData = { packageOutline: null, pinFunctions: [], ordering: [], recommendedOperatingConditions: [] };

export function diffDesignIn(previous: DesignData | undefined, next: DesignData | undefined): DesignInChange[] {
  const a = previous ?? none;
  const b = next ?? none;
  // In the order the sheet prints the sections.
  return [
    ...diffRows("conditions", conditionRows(a), conditionRows(b)),
    ...diffOutline(a.packageOutline, b.packageOutline),
    ...diffRows("pins", pinRows(a), pinRows(b)),
    ...diffRows("ordering", orderingRows(a), orderingRows(b)),
  ];
}

/** The section's name as the sheet heads it (components/sheet/sheet-design-in.tsx). */
export const designInSectionTitles: Record<DesignInSection, string> = {
  conditions: "Recommended operating conditions",
  outline: "Package outline",
  pins: "Pin functions",
  ordering: "Ordering information",
};
