import { ScrollTable } from "@/components/ui/scroll-table";
import { limitBasisWords } from "@/lib/domain/sheets";
import { rowMovedWithDataOnly } from "@/lib/sheet/diff-queries";
import type { BasisChange, LimitEffect, SheetDiff, SpecRowChange, SpecRowFieldChange, SpecRowFigures } from "@/lib/sheet/diff-types";
import type { LimitBasis } from "@/lib/sheet/types";
import { Notation } from "@/components/sheet/notation";
import { Absent, DiffSection, Figure, MarkWord, type DiffHooks } from "./diff-parts";

/** The row kinds in words, each with a mark: a window closing in, opening out, a plus, a minus, a tilde. */
export const rowKindWords: Record<SpecRowChange["kind"], { mark: string; word: string }> = {
  tightened: { mark: "→←", word: "Tightened" },
  loosened: { mark: "←→", word: "Loosened" },
  added: { mark: "+", word: "Added" },
  removed: { mark: "−", word: "Removed" },
  changed: { mark: "~", word: "Changed" },
};

const effectWords: Record<LimitEffect, { mark: string; word: string }> = {
  tightened: rowKindWords.tightened,
  loosened: rowKindWords.loosened,
  neutral: { mark: "·", word: "Not a guarantee" },
  incomparable: { mark: "≠", word: "Units differ, not compared" },
};

const fieldWords: Record<SpecRowFieldChange["field"], string> = {
  min: "Min",
  typ: "Typ",
  max: "Max",
  unit: "Unit",
  conditions: "Conditions",
  footnotes: "Footnotes",
};

type Labels = { previousLabel: string; nextLabel: string };

/**
 * The spec-table changes in review order, one body per row so each can be linked to and commented
 * on. Rows whose only change is a measured mean that moved with new data follow in a folded table:
 * nobody decided them, and listed among the decisions they would bury them.
 */
export function DiffSpecRows({ diff, hooks }: { diff: SheetDiff; hooks: DiffHooks }) {
  if (diff.rows.length === 0) return null;
  const labels = { previousLabel: diff.previousLabel ?? "Previous", nextLabel: diff.nextLabel };
  const decided = diff.rows.filter((row) => !rowMovedWithDataOnly(row));
  const moved = diff.rows.filter(rowMovedWithDataOnly);
  return (
    <DiffSection id="diff-spec-rows" title="Electrical specifications" testId="diff-spec-rows">
      {decided.length > 0 ? (
        <SpecRowTable
          rows={decided}
          labels={labels}
          hooks={hooks}
          label="Changed specification rows"
          testId="diff-spec-table"
          caption="Guarantees tightened first, then loosened, then rows added and removed, then other changes. Arrows give the direction of a figure."
        />
      ) : null}
      {moved.length > 0 ? (
        <details id="diff-spec-moved" className="mt-6 scroll-mt-24" data-testid="diff-spec-moved" open={decided.length === 0}>
          <summary className="cursor-pointer text-[0.9375rem]">
            <span className="figure">{moved.length}</span> measured {moved.length === 1 ? "mean" : "means"} (no typ stated) moved with the data
          </summary>
          <div className="mt-3">
            <SpecRowTable
              rows={moved}
              labels={labels}
              hooks={hooks}
              label="Measured means that moved with the data"
              testId="diff-spec-moved-table"
              caption="The typ column of these rows is the mean of the units measured; it changes whenever the data do."
            />
          </div>
        </details>
      ) : null}
    </DiffSection>
  );
}

function SpecRowTable({
  rows,
  labels,
  hooks,
  label,
  testId,
  caption,
}: {
  rows: SpecRowChange[];
  labels: Labels;
  hooks: DiffHooks;
  label: string;
  testId: string;
  caption: string;
}) {
  const withActions = Boolean(hooks.anchorActions || hooks.dataHref);
  return (
    <ScrollTable label={label} testId={testId}>
      <caption>{caption}</caption>
      <thead>
        <tr>
          <th scope="col">Change</th>
          <th scope="col">Parameter and conditions</th>
          <th scope="col">Field</th>
          <th scope="col" className="num">
            {labels.previousLabel}
          </th>
          <th scope="col" className="num">
            {labels.nextLabel}
          </th>
          <th scope="col">Effect</th>
          {withActions ? (
            <th scope="col">
              <span className="sr-only">Actions</span>
            </th>
          ) : null}
        </tr>
      </thead>
      {rows.map((row) => (
        <SpecRowBody key={row.groupId} row={row} hooks={hooks} withActions={withActions} />
      ))}
    </ScrollTable>
  );
}

function SpecRowBody({ row, hooks, withActions }: { row: SpecRowChange; hooks: DiffHooks; withActions: boolean }) {
  const lines = fieldLines(row);
  const kind = rowKindWords[row.kind];
  const emphasis = row.kind === "tightened" || row.kind === "loosened" ? "font-semibold" : "";
  const dataHref = hooks.dataHref?.(row.groupId) ?? null;
  const name = `${row.label}${row.conditionsText ? `, ${row.conditionsText}` : ""}`;
  return (
    <tbody id={row.anchorId} data-testid="diff-spec-row" data-kind={row.kind} className="scroll-mt-24 target:bg-paper-deep">
      {lines.map((line, i) => (
        <tr key={line.key}>
          {i === 0 ? (
            <>
              <td rowSpan={lines.length} className={`whitespace-nowrap ${emphasis}`}>
                <MarkWord {...kind} />
              </td>
              <th scope="row" rowSpan={lines.length} className="min-w-[14rem]">
                <span className="font-semibold">{row.label}</span>
                {row.conditionsText ? (
                  <span className="block text-sm text-ink-muted">
                    <Notation text={row.conditionsText} />
                  </span>
                ) : null}
              </th>
            </>
          ) : null}
          {/* A continuation line starts at the Field column, not at the table's edge. */}
          <td className={i === 0 ? "" : "pl-3"}>{line.field}</td>
          <td className="num whitespace-nowrap">{line.previous}</td>
          <td className="num whitespace-nowrap">{line.next}</td>
          <td>{line.effect}</td>
          {withActions && i === 0 ? (
            <td rowSpan={lines.length} className="whitespace-nowrap">
              {dataHref ? (
                <a href={dataHref} className="mr-3">
                  Data<span className="sr-only"> for {name}</span>
                </a>
              ) : null}
              {hooks.anchorActions?.({ kind: "row", key: row.groupId, anchorId: row.anchorId, label: name })}
            </td>
          ) : null}
        </tr>
      ))}
    </tbody>
  );
}

type Line = { key: string; field: string; previous: React.ReactNode; next: React.ReactNode; effect: React.ReactNode };

/** One table line per changed field; an added or removed row shows what its side stated. */
function fieldLines(row: SpecRowChange): Line[] {
  if (row.kind === "added" || row.kind === "removed") {
    const stated = row.kind === "added" ? row.next : row.previous;
    const figures = stated ? <StatedFigures figures={stated} /> : <Absent />;
    return [
      {
        key: "limits",
        field: "Figures",
        previous: row.kind === "removed" ? figures : <Absent />,
        next: row.kind === "added" ? figures : <Absent />,
        effect: row.kind === "added" ? "New row" : "Row no longer on the sheet",
      },
    ];
  }
  return row.fields.map((change) => fieldLine(change, row));
}

function fieldLine(change: SpecRowFieldChange, row: SpecRowChange): Line {
  const key = change.field;
  const field = fieldWords[change.field];
  switch (change.field) {
    case "min":
    case "typ":
    case "max": {
      const arrow = change.direction === "up" ? "↑" : change.direction === "down" ? "↓" : null;
      const effect = effectWords[change.effect];
      return {
        key,
        field: change.measuredMean ? `${field} (mean)` : field,
        previous: <Figure value={change.previous} unit={row.previous?.unit ?? ""} />,
        next: (
          <>
            <Figure value={change.next} unit={row.next?.unit ?? ""} />
            {arrow ? (
              <>
                <span aria-hidden="true" className="ml-1">
                  {arrow}
                </span>
                <span className="sr-only"> ({change.direction})</span>
              </>
            ) : null}
          </>
        ),
        effect: <MarkWord {...effect} className={change.effect === "tightened" || change.effect === "loosened" ? "font-semibold" : ""} />,
      };
    }
    case "unit":
      return {
        key,
        field,
        previous: <span className="unit">{change.previous || "none"}</span>,
        next: <span className="unit">{change.next || "none"}</span>,
        effect: change.convertible ? "Same quantity, other prefix: limits compared after conversion" : "Units differ: limits not compared",
      };
    case "conditions":
      return { key, field, previous: change.previous || <Absent />, next: change.next || <Absent />, effect: "Conditions as printed" };
    case "footnotes":
      return { key, field, previous: <NoteList notes={change.previous} />, next: <NoteList notes={change.next} />, effect: "Footnotes as printed" };
  }
}

function StatedFigures({ figures }: { figures: SpecRowFigures }) {
  const stated = (["min", "typ", "max"] as const).filter((f) => figures[f].text !== "");
  if (stated.length === 0) return <Absent />;
  return (
    <span className="inline-flex flex-col items-end gap-0.5">
      {stated.map((f) => (
        <span key={f} className="whitespace-nowrap">
          <span className="running-head mr-1">{f}</span>
          <Figure value={figures[f]} unit={figures.unit} />
        </span>
      ))}
    </span>
  );
}

function NoteList({ notes }: { notes: string[] }) {
  if (notes.length === 0) return <Absent />;
  return (
    <ul className="space-y-1 text-left text-sm">
      {notes.map((note) => (
        <li key={note}>{note}</li>
      ))}
    </ul>
  );
}

function BasisWords({ basis }: { basis: LimitBasis }) {
  const words = limitBasisWords[basis];
  return (
    <span>
      <span className="figure mr-1">{words.mark}</span>
      {words.choice}
    </span>
  );
}

/** Where a limit comes from (test, characterization, design), listed apart from the figures. */
export function DiffBasisChanges({ diff, hooks }: { diff: SheetDiff; hooks: DiffHooks }) {
  if (diff.basisChanges.length === 0) return null;
  const listed = new Set(diff.rows.map((row) => row.groupId));
  return (
    <DiffSection id="diff-basis" title="Limit basis" testId="diff-basis">
      <ScrollTable label="Changed limit bases" testId="diff-basis-table">
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">Conditions</th>
            <th scope="col">{diff.previousLabel ?? "Previous"}</th>
            <th scope="col">{diff.nextLabel}</th>
            {hooks.anchorActions ? (
              <th scope="col">
                <span className="sr-only">Actions</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {diff.basisChanges.map((change: BasisChange) => (
            // A row whose only change is its basis is linked to here; otherwise its anchor is in the table above.
            <tr
              key={change.groupId}
              id={listed.has(change.groupId) ? `${change.anchorId}-basis` : change.anchorId}
              className="scroll-mt-24 target:bg-paper-deep"
            >
              <th scope="row">{change.label}</th>
              <td>{change.conditionsText ? <Notation text={change.conditionsText} /> : <Absent />}</td>
              <td>
                <BasisWords basis={change.previous} />
              </td>
              <td>
                <BasisWords basis={change.next} />
              </td>
              {hooks.anchorActions ? (
                <td className="whitespace-nowrap">
                  {listed.has(change.groupId)
                    ? null
                    : hooks.anchorActions({
                        kind: "row",
                        key: change.groupId,
                        anchorId: change.anchorId,
                        label: `${change.label}${change.conditionsText ? `, ${change.conditionsText}` : ""}`,
                      })}
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </ScrollTable>
    </DiffSection>
  );
}
