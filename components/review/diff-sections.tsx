import { ScrollTable } from "@/components/ui/scroll-table";
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
      <ScrollTable label="Changed absolute maximum ratings" testId="diff-ratings-table">
        <thead>
          <tr>
            <th scope="col">Change</th>
            <th scope="col">Rating</th>
            <th scope="col" className="num">
              {diff.previousLabel ?? "Previous"}
            </th>
            <th scope="col" className="num">
              {diff.nextLabel}
            </th>
          </tr>
        </thead>
        <tbody>
          {diff.ratings.map((rating: RatingChange) => (
            <tr key={rating.label}>
              <td>
                <MarkWord {...rowKindWords[rating.kind]} />
              </td>
              <th scope="row">{rating.label}</th>
              <td className="num">
                <RatingValue figures={rating.previous} />
              </td>
              <td className="num">
                <RatingValue figures={rating.next} />
              </td>
            </tr>
          ))}
        </tbody>
      </ScrollTable>
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
      <ScrollTable label="Changed design-in rows" testId="diff-design-in-table">
        <thead>
          <tr>
            <th scope="col">Change</th>
            <th scope="col">Section</th>
            <th scope="col">Row</th>
            <th scope="col">{diff.previousLabel ?? "Previous"}</th>
            <th scope="col">{diff.nextLabel}</th>
          </tr>
        </thead>
        <tbody>
          {diff.designIn.map((change) => (
            <tr key={`${change.section}-${change.key}`}>
              <td>
                <MarkWord {...rowKindWords[change.kind]} />
              </td>
              <td>{designInSectionTitles[change.section]}</td>
              <th scope="row">
                {change.key}
                {change.kind === "changed" ? <span className="block text-ink-muted text-sm">{change.fields.join(", ")}</span> : null}
              </th>
              <td>
                <DesignInLine change={change} side="previous" />
              </td>
              <td>
                <DesignInLine change={change} side="next" />
              </td>
            </tr>
          ))}
        </tbody>
      </ScrollTable>
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
      <ScrollTable label="Measurement sets added and removed" testId="diff-sets-table">
        <thead>
          <tr>
            <th scope="col">Change</th>
            <th scope="col">Unit</th>
            <th scope="col">Kind</th>
            <th scope="col">Lot</th>
            <th scope="col">Temperature</th>
            <th scope="col">Measured on</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(({ kind, set }) => (
            <tr key={`${kind}-${set.id}`}>
              <td>
                <MarkWord {...rowKindWords[kind]} />
              </td>
              <th scope="row" className="figure">
                {set.serial}
              </th>
              <td>{kindLabel(set.kind)}</td>
              <td className="figure">{set.lot ?? <Absent />}</td>
              <td className="figure">{set.temperature || <Absent />}</td>
              <td className="figure whitespace-nowrap">{set.measuredOn}</td>
            </tr>
          ))}
        </tbody>
      </ScrollTable>
    </DiffSection>
  );
}

export function DiffDetails({ diff }: { diff: SheetDiff }) {
  if (diff.details.length === 0) return null;
  return (
    <DiffSection id="diff-details" title="Header and key facts" testId="diff-details">
      <ScrollTable label="Changed header and key facts" testId="diff-details-table">
        <thead>
          <tr>
            <th scope="col">Item</th>
            <th scope="col">{diff.previousLabel ?? "Previous"}</th>
            <th scope="col">{diff.nextLabel}</th>
          </tr>
        </thead>
        <tbody>
          {diff.details.map((detail) => (
            <tr key={detail.label}>
              <th scope="row">{detail.label}</th>
              <td>{detail.previous ?? <Absent />}</td>
              <td>{detail.next ?? <Absent />}</td>
            </tr>
          ))}
        </tbody>
      </ScrollTable>
    </DiffSection>
  );
}
