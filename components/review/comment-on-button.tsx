"use client";

import type { CommentAnchorKind } from "@/lib/domain/reviews";
import { commentOnEvent, type CommentOnDetail } from "./comment-anchors";

/** A small button that points the comment form at one row, chart or section. */
export function CommentOnButton({ kind, id, label }: { kind: CommentAnchorKind; id: string | null; label: string }) {
  return (
    <button
      type="button"
      onClick={() => window.dispatchEvent(new CustomEvent<CommentOnDetail>(commentOnEvent, { detail: { kind, id } }))}
      className="text-[0.8125rem] text-ink-muted underline decoration-rule-strong underline-offset-4 hover:text-ink hover:decoration-signal"
      aria-label={`Comment on ${label}`}
    >
      Comment
    </button>
  );
}
