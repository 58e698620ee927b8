import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SheetDiffView, type DiffAnchor } from "@/components/review/sheet-diff";
import { buildSheetModel, diffSheetModels, rowMovedWithDataOnly, type SheetInput, type SpecLimitInput } from "@/lib/sheet";
import { loadDoublerInput } from "../sheet/fixture";

const CL_2GHZ = "drive=10;inputFrequencyHz=2000000000;temperatureC=25";
const CL_3GHZ = "drive=10;inputFrequencyHz=3000000000;temperatureC=25";
const HS1_2GHZ = "drive=10;inputFrequencyHz=2000000000;order=1;temperatureC=25";

const base = loadDoublerInput();
const revA = buildSheetModel({ ...base, revision: { ...base.revision, label: "A", state: "released" } });

/** A candidate with one of every kind of change: a limit tightened, one loosened, a row added, a typ changed, a basis, prose, a rating, a set dropped. */
function busyCandidate(): SheetInput {
  const input = structuredClone(base);
  input.limits = input.limits.map((limit: SpecLimitInput) => {
    if (limit.parameter === "conversion-loss" && limit.conditionsKey === CL_2GHZ) return { ...limit, max: 11.5 };
    if (limit.parameter === "conversion-loss" && limit.conditionsKey === CL_3GHZ) return { ...limit, max: 12, basis: "characterization" };
    if (limit.parameter === "harmonic-suppression" && limit.conditionsKey === HS1_2GHZ) return { ...limit, typ: 32 };
    return limit;
  });
  input.limits.push({ parameter: "conversion-loss", conditionsKey: "drive=10;inputFrequencyHz=5000000000;temperatureC=25", max: 13, unit: "dB", basis: "test" });
  input.prose.description = base.prose.description!.replace("passive frequency doubler", "rugged passive frequency multiplier");
  input.absoluteMaximumRatings = input.absoluteMaximumRatings.map((r) => (r.label === "RF input power, per port" ? { ...r, value: "+23" } : r));
  input.approvedSets = input.approvedSets.filter((s) => s.serial !== "HX-0101");
  return input;
}

const busyDiff = diffSheetModels(revA, buildSheetModel(busyCandidate()));

function render(props: Parameters<typeof SheetDiffView>[0]): string {
  return renderToStaticMarkup(createElement(SheetDiffView, props));
}

/** The opening tags of the change list's bodies, in order. */
const rowBodies = (html: string) => [...html.matchAll(/<tbody id="([^"]+)" data-testid="diff-spec-row" data-kind="([^"]+)"/g)].map((m) => ({ id: m[1], kind: m[2] }));

describe("SheetDiffView", () => {
  const html = render({ diff: busyDiff });

  it("lists row changes in review order, each body with the row's anchor id", () => {
    const bodies = rowBodies(html);
    const decided = busyDiff.rows.filter((r) => !rowMovedWithDataOnly(r));
    const moved = busyDiff.rows.filter(rowMovedWithDataOnly);
    expect(moved.length).toBeGreaterThan(0);
    expect(bodies.map((b) => b.id)).toEqual([...decided, ...moved].map((r) => r.anchorId));
    expect(bodies.map((b) => b.kind).slice(0, decided.length)).toEqual(["tightened", "loosened", "added", "changed"]);
    expect(new Set(bodies.map((b) => b.id)).size).toBe(bodies.length);
  });

  it("counts the changes at the top, each with its word", () => {
    const counts = html.split('data-testid="diff-counts"')[1].split("</ul>")[0];
    const moved = busyDiff.rows.filter(rowMovedWithDataOnly).length;
    for (const words of ["1</span> tightened", "1</span> loosened", "1</span> added", "1</span> changed", `${moved}</span> measured means moved`, "1</span> basis", "1</span> prose section", "1</span> rating"]) {
      expect(counts).toContain(words);
    }
  });

  it("folds the measured means that only moved with the data below the decided changes", () => {
    const folded = html.split('data-testid="diff-spec-moved"')[1].split("</details>")[0];
    const moved = busyDiff.rows.filter(rowMovedWithDataOnly);
    expect(folded).toContain(`<span class="figure">${moved.length}</span> measured means (no typ stated) moved with the data`);
    expect(rowBodies(`<details ${folded}`).map((b) => b.id)).toEqual(moved.map((r) => r.anchorId));
  });

  it("says every change in a word beside its mark, never by colour alone", () => {
    const bodies = html.split('data-testid="diff-spec-row"').slice(1).map((chunk) => chunk.split("</tbody>")[0]);
    const words: Record<string, string> = { tightened: "Tightened", loosened: "Loosened", added: "Added", removed: "Removed", changed: "Changed" };
    bodies.forEach((body, i) => {
      const kind = busyDiff.rows[i].kind;
      expect(body).toContain(`</span>${words[kind]}</span>`);
    });
    // The tightened max reads old → new with its direction in words for a screen reader.
    expect(bodies[0]).toContain('<span class="figure">12</span>');
    expect(bodies[0]).toContain('<span class="figure">11.5</span>');
    expect(bodies[0]).toContain('<span class="sr-only"> (down)</span>');
  });

  it("puts every table in a focusable, named region that scrolls", () => {
    const tables = html.match(/<table /g) ?? [];
    const regions = html.match(/<div class="overflow-x-auto" tabindex="0" role="region" aria-label="[^"]+, scrolls sideways on narrow screens">/g) ?? [];
    expect(tables.length).toBeGreaterThanOrEqual(4); // rows, basis, ratings, sets
    expect(regions).toHaveLength(tables.length);
  });

  it("lists the basis change apart from the figures", () => {
    const basis = html.split('data-testid="diff-basis"')[1].split("</section>")[0];
    expect(basis).toContain("Guaranteed by test");
    expect(basis).toContain("Guaranteed by characterization");
  });

  it("marks inserted and deleted words with <ins> and <del>, styled by underline and strike, and named for screen readers", () => {
    const prose = html.split('data-testid="diff-prose"')[1];
    expect(prose).toMatch(/<ins class="[^"]*underline[^"]*"><span class="sr-only">\[inserted: <\/span>rugged /);
    expect(prose).toMatch(/<del class="[^"]*line-through[^"]*"><span class="sr-only">\[deleted: <\/span>doubler/);
    expect(prose).toContain('id="diff-prose-description"');
  });

  it("shows ratings and measurement sets with their words", () => {
    expect(html).toContain("RF input power, per port");
    expect(html).toContain("+23");
    const sets = html.split('data-testid="diff-sets"')[1].split("</section>")[0];
    expect(sets).toContain(`(0 added, ${busyDiff.measurementSets.removed.length} removed)`);
    expect(sets).toContain("HX-0101");
    expect(sets).toContain("Drive sweep");
  });

  it("lists the design-in rows that changed: the section, the row, what changed and both sides; the drawing by its digest", () => {
    const designData = {
      pinFunctions: [{ pin: "1", name: "IN", function: "Input" }],
      ordering: [{ partNumber: "HX-TR", options: "", packing: "Reel, 1000" }],
      recommendedOperatingConditions: [{ parameter: "Input drive", min: "9", typ: "", max: "13", unit: "dBm" }],
      packageOutline: { caption: "3 × 3 mm", sha256: "a".repeat(64), widthPx: 4, heightPx: 3, pngBase64: "AAAA" },
    };
    const before = buildSheetModel({ ...structuredClone(base), designData, revision: { ...base.revision, label: "A", state: "released" } });
    const changed = structuredClone(designData);
    changed.recommendedOperatingConditions[0].max = "12";
    changed.packageOutline.sha256 = "b".repeat(64);
    changed.ordering.push({ partNumber: "HX-EB", options: "Evaluation board", packing: "" });
    const diff = diffSheetModels(before, buildSheetModel({ ...structuredClone(base), designData: changed }));
    const section = render({ diff }).split('data-testid="diff-design-in"')[1].split("</section>")[0];
    const rows = [...section.matchAll(/<tr>(.*?)<\/tr>/g)].slice(1).map((m) => m[1].replace(/<[^>]+>/g, "|").replace(/\|+/g, "|").replace(/\u00a0/g, " "));
    expect(rows).toEqual([
      "|~|Changed|Recommended operating conditions|Input drive|max|min 9, max 13 dBm|min 9, max 12 dBm|",
      "|~|Changed|Package outline|Drawing and caption|drawing|Drawing replaced. 3 × 3 mm|New drawing. 3 × 3 mm|",
      "|+|Added|Ordering information|HX-EB|—|none|Evaluation board|",
    ]);
    expect(render({ diff }).split('data-testid="diff-counts"')[1].split("</ul>")[0]).toContain("3</span> design-in rows");
  });

  it("gives each overlay its anchor and a description, and loads the chart lazily", () => {
    const figures = html.match(/<figure id="diff-chart-[^"]+"/g) ?? [];
    const panelCount = busyDiff.charts.reduce((n, c) => n + c.panels.length, 0);
    expect(figures).toHaveLength(panelCount);
    expect(html).toContain(`aria-label="${busyDiff.charts[0].panels[0].description.replace(/"/g, "&quot;")}"`);
    expect(html).toContain("Drawing the chart…");
  });

  it("offers the page's comment action on each row, chart and prose section, and the data link", () => {
    const seen: DiffAnchor[] = [];
    const withHooks = render({
      diff: busyDiff,
      anchorActions: (anchor) => {
        seen.push(anchor);
        return createElement("button", { type: "button", "data-anchor": anchor.anchorId }, "Comment");
      },
      dataHref: (groupId) => `/data/${encodeURIComponent(groupId)}`,
    });
    const panelCount = busyDiff.charts.reduce((n, c) => n + c.panels.length, 0);
    expect(seen.filter((a) => a.kind === "row")).toHaveLength(busyDiff.rows.length);
    expect(seen.filter((a) => a.kind === "chart")).toHaveLength(panelCount);
    expect(seen.filter((a) => a.kind === "prose").map((a) => a.key)).toEqual(["description"]);
    for (const anchor of seen) expect(withHooks).toContain(`id="${anchor.anchorId}"`);
    expect(withHooks).toContain(`href="/data/${encodeURIComponent(busyDiff.rows[0].groupId)}"`);
  });

  it("says a first release has nothing to compare with", () => {
    const first = render({ diff: diffSheetModels(null, revA) });
    expect(first).toContain('data-testid="diff-first-release"');
    expect(first).toContain("First release");
    expect(first).not.toContain("<table");
  });

  it("says so when nothing changed", () => {
    const same = render({ diff: diffSheetModels(revA, revA) });
    expect(same).toContain('data-testid="diff-empty"');
    expect(same).toContain("Changes since Rev. A");
    expect(same).not.toContain("<table");
  });
});
