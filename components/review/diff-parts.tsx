import type { ReactNode } from "react";
import { Quantity } from "@/components/ui/quantity";
import type { CommentAnchorKind } from "@/lib/domain/reviews";
import type { FormattedValue } from "@/lib/sheet/types";

/** Something a review comment can sit on, as the diff names it. */
export type DiffAnchor = {
  kind: Extract<CommentAnchorKind, "row" | "chart" | "prose">;
  /** groupId for a row, the panel id for a chart, the section id for prose. */
  key: string;
  /** The HTML id of the entry in the diff (lib/sheet/diff-anchors). */
  anchorId: string;
  /** Words naming the entry, for a button's accessible name ("Comment on …"). */
  label: string;
};

/** What a page may add beside each entry: a comment button, a link to the data behind a row. */
export type DiffHooks = {
  anchorActions?: (anchor: DiffAnchor) => ReactNode;
  /** Where the data behind a spec-table row is (the statistics of its group); null for none. */
  dataHref?: (groupId: string) => string | null;
};

export function DiffHeading({ id, children }: { id: string; children: ReactNode }) {
  return (
    <h3 id={id} className="running-head mb-3 border-b border-ink pb-1 text-ink">
      {children}
    </h3>
  );
}

/** A section of the diff: a heading and its content, reachable by its heading's id. */
export function DiffSection({ id, title, children, testId }: { id: string; title: ReactNode; children: ReactNode; testId: string }) {
  return (
    <section aria-labelledby={id} className="mt-10" data-testid={testId}>
      <DiffHeading id={id}>{title}</DiffHeading>
      {children}
    </section>
  );
}

/** A mark and a word, so a change never depends on colour to be read. The mark is decoration; the word is read out. */
export function MarkWord({ mark, word, className }: { mark: string; word: string; className?: string }) {
  return (
    <span className={`whitespace-nowrap ${className ?? ""}`}>
      <span aria-hidden="true" className="figure mr-1 inline-block min-w-[1.75em] text-center">
        {mark}
      </span>
      {word}
    </span>
  );
}

/** A figure as the sheet printed it, or a dash read out as "none". */
export function Figure({ value, unit }: { value: FormattedValue | null; unit: string }) {
  if (!value || value.text === "") return <Absent />;
  return <Quantity value={value.text} unit={unit} />;
}

export function Absent() {
  return (
    <>
      <span aria-hidden="true" className="text-ink-muted">
        —
      </span>
      <span className="sr-only">none</span>
    </>
  );
}
