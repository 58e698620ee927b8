"use client";

import { useEffect, useMemo, useState } from "react";
import type { CommentView } from "@/lib/domain/reviews";
import { formatDateTime } from "@/lib/format";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { anchorKindWords, anchorValue, type CommentAnchorOption } from "./comment-anchors";
import { NewCommentForm, ReplyForm } from "./comment-forms";

type CommentThreadsProps = {
  candidateId: number;
  comments: CommentView[];
  anchors: CommentAnchorOption[];
  viewerId: number;
  /** Comments are open while the candidate is in review or changes are requested. */
  canComment: boolean;
};

type Thread = { opener: CommentView; replies: CommentView[] };

function threadsOf(comments: CommentView[]): Thread[] {
  const replies = new Map<number, CommentView[]>();
  for (const c of comments) if (c.parentId !== null) replies.set(c.parentId, [...(replies.get(c.parentId) ?? []), c]);
  return comments.filter((c) => c.parentId === null).map((opener) => ({ opener, replies: replies.get(opener.id) ?? [] }));
}

/**
 * The review's comment threads: each on the whole sheet, a spec row, a chart or a prose section,
 * with replies; the person who opened a thread resolves it. Open threads of an earlier submission
 * of the same sheet carry over.
 */
export function CommentThreads({ candidateId, comments: initial, anchors, viewerId, canComment }: CommentThreadsProps) {
  const [comments, setComments] = useState(initial);
  useEffect(() => setComments(initial), [initial]);
  const threads = useMemo(() => threadsOf(comments), [comments]);
  const open = threads.filter((t) => !t.opener.resolvedAt).length;

  return (
    <section aria-labelledby="comments-title" data-testid="comment-threads">
      <h2 id="comments-title" className="mb-3 text-xl font-semibold">
        Comments{" "}
        <span className="figure text-base font-normal text-ink-muted">
          ({open} open, {threads.length - open} resolved)
        </span>
      </h2>
      {threads.length === 0 ? <p className="mb-4 text-[0.9375rem] text-ink-muted">No comments yet.</p> : null}
      <ol className="mb-6 space-y-4">
        {threads.map((thread) => (
          <ThreadItem key={thread.opener.id} thread={thread} viewerId={viewerId} canComment={canComment} candidateId={candidateId} onComments={setComments} />
        ))}
      </ol>
      {canComment ? (
        <NewCommentForm candidateId={candidateId} anchors={anchors} onComments={setComments} />
      ) : (
        <p className="text-[0.9375rem] text-ink-muted">Comments are closed: the candidate is no longer under review.</p>
      )}
    </section>
  );
}

function ThreadItem({
  thread,
  viewerId,
  canComment,
  candidateId,
  onComments,
}: {
  thread: Thread;
  viewerId: number;
  canComment: boolean;
  candidateId: number;
  onComments: (comments: CommentView[]) => void;
}) {
  const { opener, replies } = thread;
  const resolved = opener.resolvedAt !== null;
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function resolve() {
    setError(null);
    setPending(true);
    try {
      await requestJson(`/api/sheet-comments/${opener.id}/resolve`, { method: "POST", body: {} });
      // The answer lists the threads of the candidate the thread was opened on; this page shows its own.
      const { candidate } = await requestJson<{ candidate: { comments: CommentView[] } }>(`/api/sheet-candidates/${candidateId}`);
      onComments(candidate.comments);
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setPending(false);
    }
  }

  return (
    <li
      className={`border-l-2 pl-4 ${resolved ? "border-rule" : "border-signal"}`}
      data-testid="comment-thread"
      data-anchor={anchorValue(opener.anchor)}
      data-resolved={resolved ? "true" : "false"}
    >
      <p className="text-[0.875rem]">
        <span className="running-head mr-2 !text-ink">{anchorKindWords[opener.anchor.kind]}</span>
        <span className="font-semibold">{opener.anchor.label}</span>
        {" · "}
        {resolved ? (
          <span data-testid="thread-state">
            <span aria-hidden="true">✓ </span>Resolved by {opener.resolvedBy?.name ?? "the author"}, <span className="figure">{formatDateTime(opener.resolvedAt!)}</span>
          </span>
        ) : (
          <span data-testid="thread-state">
            <span aria-hidden="true">○ </span>Open
          </span>
        )}
        {opener.earlier ? <span className="ml-2 text-ink-muted">(written on an earlier submission)</span> : null}
      </p>
      <ul className="mt-2 space-y-3">
        {[opener, ...replies].map((c) => (
          <li key={c.id} data-testid="comment">
            <p className="text-[0.875rem] text-ink-muted">
              <span className="font-semibold text-ink">{c.author.name}</span> · <span className="figure">{formatDateTime(c.createdAt)}</span>
            </p>
            <p className="whitespace-pre-line text-[0.9375rem]">{c.body}</p>
          </li>
        ))}
      </ul>
      {!resolved && canComment ? <ReplyForm candidateId={candidateId} parentId={opener.id} onComments={onComments} /> : null}
      {!resolved && opener.author.id === viewerId ? (
        <button type="button" onClick={() => void resolve()} disabled={pending} className={`${buttonClass.quiet} mt-2`}>
          {pending ? "Resolving…" : "Resolve thread"}
        </button>
      ) : null}
      <div aria-live="polite" className="mt-2 empty:hidden">
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>
    </li>
  );
}
