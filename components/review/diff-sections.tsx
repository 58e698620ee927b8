import { RuledTable } from "@/components/ui/ruled-table";
import { kindLabel } from "@/lib/domain/measurements";
import { designInSectionTitles } from "@/lib/sheet/diff-design-in";
import type { DesignInChange, MeasurementSetRef, ProseChange, ProseDiffPart, RatingChange, RatingFigures, SheetDiff } from "@/lib/sheet/diff-types";
import { Absent, DiffSection, MarkWord, type DiffHooks } from "./diff-parts";
import { rowKindWords } from "./diff-spec-rows";

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** Prose by word: inserted words underlined, deleted ones struck through, and each said so to a screen reader. */
export function DiffProse({ diff, hooks }: { diff: SheetDiff; hooks: DiffHooks }) {
  if (diff.prose.length === 0) return null;
  return (
    <DiffSection id="diff-prose" title="Prose" testId="diff-prose">
      <p className="mb-4 text-sm text-ink-muted">
        Inserted words are <ins className={insClass}>underlined</ins>; deleted words are <del className={delClass}>struck through</del>.
      </p>
      <div className="space-y-8">
        {diff.prose.map((section) => (
          <ProseSectionDiff key={section.sectionId} section={section} hooks={hooks} />
        ))}
      </div>
    </DiffSection>
  );
}

const insClass = "rounded-sm bg-signal-wash px-0.5 text-ink underline decoration-2 underline-offset-[0.2em]";
const delClass = "rounded-sm bg-paper-deep px-0.5 text-ink-muted line-through decoration-2";

function ProseSectionDiff({ section, hooks }: { section: ProseChange; hooks: DiffHooks }) {
  return (
    <section id={section.anchorId} aria-labelledby={`${section.anchorId}-title`} className="scroll-mt-24 max-w-prose" data-testid="diff-prose-section">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h4 id={`${section.anchorId}-title`} className="font-semibold">
          {section.title}
        </h4>
        <p className="text-sm text-ink-muted">
          {plural(section.insertedWords, "word", "words")} inserted, {plural(section.deletedWords, "word", "words")} deleted
          {hooks.anchorActions ? <span className="ml-3">{hooks.anchorActions({ kind: "prose", key: section.sectionId, anchorId: section.anchorId, label: section.title })}</span> : null}
        </p>
      </div>
      <p className="mt-2 whitespace-pre-line">
        {section.parts.map((part, i) => (
          <ProsePart key={i} part={part} />
        ))}
      </p>
    </section>
  );
}

function ProsePart({ part }: { part: ProseDiffPart }) {
  if (part.change === "inserted") {
    return (
      <ins className={insClass}>
        <span className="sr-only">[inserted: </span>
        {part.text}
        <span className="sr-only">]</span>
      </ins>
    );
  }
  if (part.change === "deleted") {
    return (
      <del className={delClass}>
        <span className="sr-only">[deleted: </span>
        {part.text}
        <span className="sr-only">]</span>
      </del>
    );
  }
  return <>{part.text}</>;
}

function RatingValue({ figures }: { figures: RatingFigures | null }) {
  if (!figures) return <Absent />;
  if (figures.missing) return <span className="text-ink-muted">to be stated</span>;
  return (
    <span className="whitespace-nowrap">
      <span className="figure">{figures.value}</span> <span className="unit">{figures.unit}</span>
    </span>
  );
}

export function DiffRatings({ diff }: { diff: SheetDiff }) {
  if (diff.ratings.length === 0) return null;
  return (
    <DiffSection id="diff-ratings" title="Absolute maximum ratings" testId="diff-ratings">
      <RuledTable
        scroll={{ label: "Changed absolute maximum ratings", testId: "diff-ratings-table" }}
        columns={[{ head: "Change" }, { head: "Rating", rowHeader: true }, { head: diff.previousLabel ?? "Previous", numeric: true }, { head: diff.nextLabel, numeric: true }]}
        rows={diff.ratings.map((rating: RatingChange) => ({
          key: rating.label,
          cells: [<MarkWord key="kind" {...rowKindWords[rating.kind]} />, rating.label, <RatingValue key="previous" figures={rating.previous} />, <RatingValue key="next" figures={rating.next} />],
        }))}
      />
    </DiffSection>
  );
}

function DesignInLine({ change, side }: { change: DesignInChange; side: "previous" | "next" }) {
  const text = change[side];
  if (text === null) return <Absent />;
  if (change.section === "outline") {
    const drawing = change.fields.includes("drawing") ? (side === "previous" ? "Drawing replaced. " : "New drawing. ") : "";
    return (
      <span>
        {drawing}
        {text || <span className="text-ink-muted">No caption</span>}
      </span>
    );
  }
  return text ? <span>{text}</span> : <span className="text-ink-muted">Nothing stated</span>;
}

/** Pins, ordering, operating conditions and the outline, row by row: which changed, and what it read before and now. */
export function DiffDesignIn({ diff }: { diff: SheetDiff }) {
  if (diff.designIn.length === 0) return null;
  return (
    <DiffSection id="diff-design-in" title="Design-in data" testId="diff-design-in">
      <RuledTable
        scroll={{ label: "Changed design-in rows", testId: "diff-design-in-table" }}
        columns={[{ head: "Change" }, { head: "Section" }, { head: "Row", rowHeader: true }, { head: diff.previousLabel ?? "Previous" }, { head: diff.nextLabel }]}
        rows={diff.designIn.map((change) => ({
          key: `${change.section}-${change.key}`,
          cells: [
            <MarkWord key="kind" {...rowKindWords[change.kind]} />,
            designInSectionTitles[change.section],
            <>
              {change.key}
              {change.kind === "changed" ? <span className="block text-ink-muted text-sm">{change.fields.join(", ")}</span> : null}
            </>,
            <DesignInLine key="previous" change={change} side="previous" />,
            <DesignInLine key="next" change={change} side="next" />,
          ],
        }))}
      />
    </DiffSection>
  );
}

export function DiffCautions({ diff }: { diff: SheetDiff }) {
  const { added, removed } = diff.cautions;
  if (added.length === 0 && removed.length === 0) return null;
  return (
    <DiffSection id="diff-cautions" title="Cautions" testId="diff-cautions">
      <ul className="max-w-prose space-y-2">
        {added.map((caution) => (
          <li key={`added-${caution}`} className="flex gap-2">
            <MarkWord {...rowKindWords.added} className="font-semibold" />
            <span>{caution}</span>
          </li>
        ))}
        {removed.map((caution) => (
          <li key={`removed-${caution}`} className="flex gap-2">
            <MarkWord {...rowKindWords.removed} className="font-semibold" />
            <del className={delClass}>{caution}</del>
          </li>
        ))}
      </ul>
    </DiffSection>
  );
}

export function DiffMeasurementSets({ diff }: { diff: SheetDiff }) {
  const { added, removed } = diff.measurementSets;
  if (added.length === 0 && removed.length === 0) return null;
  const rows: { kind: "added" | "removed"; set: MeasurementSetRef }[] = [
    ...added.map((set) => ({ kind: "added" as const, set })),
    ...removed.map((set) => ({ kind: "removed" as const, set })),
  ];
  return (
    <DiffSection id="diff-sets" title={`Measurement sets (${added.length} added, ${removed.length} removed)`} testId="diff-sets">
      <RuledTable
        scroll={{ label: "Measurement sets added and removed", testId: "diff-sets-table" }}
        columns={[
          { head: "Change" },
          { head: "Unit", rowHeader: true, cellClassName: "figure" },
          { head: "Kind" },
          { head: "Lot", cellClassName: "figure" },
          { head: "Temperature", cellClassName: "figure" },
          { head: "Measured on", cellClassName: "figure whitespace-nowrap" },
        ]}
        rows={rows.map(({ kind, set }) => ({
          key: `${kind}-${set.id}`,
          cells: [<MarkWord key="kind" {...rowKindWords[kind]} />, set.serial, kindLabel(set.kind), set.lot ?? <Absent />, set.temperature || <Absent />, set.measuredOn],
        }))}
      />
    </DiffSection>
  );
}

export function DiffDetails({ diff }: { diff: SheetDiff }) {
  if (diff.details.length === 0) return null;
  return (
    <DiffSection id="diff-details" title="Header and key facts" testId="diff-details">
      <RuledTable
        scroll={{ label: "Changed header and key facts", testId: "diff-details-table" }}
        columns={[{ head: "Item", rowHeader: true }, { head: diff.previousLabel ?? "Previous" }, { head: diff.nextLabel }]}
        rows={diff.details.map((detail) => ({ key: detail.label, cells: [detail.label, detail.previous ?? <Absent />, detail.next ?? <Absent />] }))}
      />
    </DiffSection>
  );
}
