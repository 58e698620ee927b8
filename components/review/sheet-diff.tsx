import { Notice } from "@/components/ui/notice";
import { diffIsEmpty, rowMovedWithDataOnly } from "@/lib/sheet/diff-queries";
import type { SheetDiff } from "@/lib/sheet/diff-types";
import { DiffCharts } from "./diff-charts";
import type { DiffHooks } from "./diff-parts";
import { DiffCautions, DiffDesignIn, DiffDetails, DiffMeasurementSets, DiffProse, DiffRatings } from "./diff-sections";
import { DiffBasisChanges, DiffSpecRows, rowKindWords } from "./diff-spec-rows";

export type { DiffAnchor, DiffHooks } from "./diff-parts";

type SheetDiffViewProps = DiffHooks & {
  diff: SheetDiff;
  /** The heading's id, for the page's own navigation. */
  headingId?: string;
};

/**
 * What changed since the last release, as a reviewer reads it: the specification rows (guarantees
 * tightened, then loosened, then rows added and removed, then the rest), limit bases, prose by word,
 * ratings, cautions, header and key facts, measurement sets and the typical curves overlaid. Every
 * change carries a word and a mark, never colour alone; every row, chart and prose section an id
 * a comment can link to. Renders on the server or in the browser alike.
 */
export function SheetDiffView({ diff, headingId = "sheet-diff", anchorActions, dataHref }: SheetDiffViewProps) {
  const hooks: DiffHooks = { anchorActions, dataHref };
  const empty = diffIsEmpty(diff);
  const previousLabel = diff.previousLabel ?? "the last release";
  return (
    <section aria-labelledby={headingId} data-testid="sheet-diff">
      <h2 id={headingId} className="text-xl font-semibold">
        {diff.firstRelease ? "Changes: first release" : `Changes since ${previousLabel}`}
      </h2>
      {diff.firstRelease ? (
        <div className="mt-3" data-testid="diff-first-release">
          <Notice>First release: there is no released revision to compare with, so everything on the {diff.nextLabel.toLowerCase()} is new.</Notice>
        </div>
      ) : empty ? (
        <div className="mt-3" data-testid="diff-empty">
          <Notice>
            Nothing on the {diff.nextLabel.toLowerCase()} differs from {previousLabel}: the same rows, figures, prose, ratings, design-in data, cautions,
            sets and curves.
          </Notice>
        </div>
      ) : (
        <>
          <DiffCounts diff={diff} />
          <DiffSpecRows diff={diff} hooks={hooks} />
          <DiffBasisChanges diff={diff} hooks={hooks} />
          <DiffProse diff={diff} hooks={hooks} />
          <DiffRatings diff={diff} />
          <DiffDesignIn diff={diff} />
          <DiffCautions diff={diff} />
          <DiffDetails diff={diff} />
          <DiffMeasurementSets diff={diff} />
          <DiffCharts diff={diff} hooks={hooks} />
        </>
      )}
    </section>
  );
}

/** The change list at a glance: how many rows of each kind, in the list's order, each a link to its section. */
function DiffCounts({ diff }: { diff: SheetDiff }) {
  const decided = diff.rows.filter((row) => !rowMovedWithDataOnly(row));
  const moved = diff.rows.length - decided.length;
  const kinds = (["tightened", "loosened", "added", "removed", "changed"] as const)
    .map((kind) => ({ kind, count: decided.filter((row) => row.kind === kind).length }))
    .filter(({ count }) => count > 0);
  const plural = (n: number, one: string, many: string) => (n === 1 ? one : many);
  const cautions = diff.cautions.added.length + diff.cautions.removed.length;
  const sets = diff.measurementSets.added.length + diff.measurementSets.removed.length;
  const panels = diff.charts.flatMap((chart) => chart.panels).filter((panel) => panel.changed).length;
  const others = [
    { key: "moved", count: moved, words: plural(moved, "measured mean moved", "measured means moved"), href: "#diff-spec-moved" },
    { key: "basis", count: diff.basisChanges.length, words: plural(diff.basisChanges.length, "basis", "bases"), href: "#diff-basis" },
    { key: "prose", count: diff.prose.length, words: plural(diff.prose.length, "prose section", "prose sections"), href: "#diff-prose" },
    { key: "ratings", count: diff.ratings.length, words: plural(diff.ratings.length, "rating", "ratings"), href: "#diff-ratings" },
    { key: "design-in", count: diff.designIn.length, words: plural(diff.designIn.length, "design-in row", "design-in rows"), href: "#diff-design-in" },
    { key: "cautions", count: cautions, words: plural(cautions, "caution", "cautions"), href: "#diff-cautions" },
    { key: "details", count: diff.details.length, words: plural(diff.details.length, "header item", "header items"), href: "#diff-details" },
    { key: "sets", count: sets, words: plural(sets, "measurement set", "measurement sets"), href: "#diff-sets" },
    { key: "curves", count: panels, words: plural(panels, "curve differs", "curves differ"), href: "#diff-charts" },
  ].filter(({ count }) => count > 0);
  if (kinds.length === 0 && others.length === 0) return null;
  return (
    <ul className="mt-3 flex flex-wrap gap-x-6 gap-y-1 border-y border-rule py-3 text-[0.9375rem]" aria-label="Changes at a glance" data-testid="diff-counts">
      {kinds.map(({ kind, count }) => (
        <li key={kind}>
          <a href="#diff-spec-rows" className="no-underline hover:underline">
            <span aria-hidden="true" className="figure mr-1">
              {rowKindWords[kind].mark}
            </span>
            <span className="figure">{count}</span> {rowKindWords[kind].word.toLowerCase()}
          </a>
        </li>
      ))}
      {others.map(({ key, count, words, href }) => (
        <li key={key}>
          <a href={href} className="no-underline hover:underline">
            <span className="figure">{count}</span> {words}
          </a>
        </li>
      ))}
    </ul>
  );
}
