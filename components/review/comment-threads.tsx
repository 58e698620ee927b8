"use client";

import { useEffect, useId, useMemo, useRef, useState } from "react";
import type { CommentAnchorKind, CommentView } from "@/lib/domain/reviews";
import { formatDateTime } from "@/lib/format";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { anchorKindWords, anchorValue, commentOnEvent, type CommentAnchorOption, type CommentOnDetail } from "./comment-anchors";

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

function ReplyForm({ candidateId, parentId, onComments }: { candidateId: number; parentId: number; onComments: (comments: CommentView[]) => void }) {
  const id = useId();
  const [body, setBody] = useState("");
  const [opened, setOpened] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function send() {
    setError(null);
    if (!body.trim()) {
      setError("Write the reply.");
      return;
    }
    setPending(true);
    try {
      const result = await requestJson<{ comments: CommentView[] }>(`/api/sheet-candidates/${candidateId}/comments`, {
        method: "POST",
        body: { anchor: { kind: "sheet" }, body: body.trim(), parentId },
      });
      onComments(result.comments);
      setBody("");
      setOpened(false);
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setPending(false);
    }
  }

  if (!opened) {
    return (
      <button type="button" onClick={() => setOpened(true)} className={`${buttonClass.quiet} mr-4 mt-2`}>
        Reply
      </button>
    );
  }
  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        void send();
      }}
      className="mt-3 space-y-2"
    >
      <label htmlFor={`${id}-reply`} className="block text-[0.875rem] font-semibold">
        Your reply
      </label>
      <textarea id={`${id}-reply`} rows={2} value={body} onChange={(e) => setBody(e.target.value)} className={selectClass} maxLength={4000} autoFocus />
      <div className="flex gap-3">
        <button type="submit" disabled={pending} className={buttonClass.secondary}>
          {pending ? "Sending…" : "Send reply"}
        </button>
        <button type="button" onClick={() => setOpened(false)} className={buttonClass.quiet}>
          Cancel
        </button>
      </div>
      <div aria-live="polite" className="empty:hidden">
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>
    </form>
  );
}

function NewCommentForm({ candidateId, anchors, onComments }: { candidateId: number; anchors: CommentAnchorOption[]; onComments: (comments: CommentView[]) => void }) {
  const id = useId();
  const [anchor, setAnchor] = useState(anchorValue(anchors[0] ?? { kind: "sheet", id: null }));
  const [body, setBody] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const bodyRef = useRef<HTMLTextAreaElement>(null);

  // "Comment on this" beside a row, chart or section of the sheet or of the change list picks it here.
  useEffect(() => {
    const listener = (event: Event) => {
      const detail = (event as CustomEvent<CommentOnDetail>).detail;
      setAnchor(anchorValue(detail));
      bodyRef.current?.scrollIntoView({ block: "center" });
      bodyRef.current?.focus();
    };
    window.addEventListener(commentOnEvent, listener);
    return () => window.removeEventListener(commentOnEvent, listener);
  }, []);

  const groups: { kind: CommentAnchorKind; label: string }[] = [
    { kind: "row", label: "Spec-table rows" },
    { kind: "chart", label: "Charts" },
    { kind: "prose", label: "Prose sections" },
  ];

  async function send() {
    setError(null);
    if (!body.trim()) {
      setError("Write the comment.");
      bodyRef.current?.focus();
      return;
    }
    const [kind, ...rest] = anchor.split(":");
    const anchorId = rest.join(":");
    setPending(true);
    try {
      const result = await requestJson<{ comments: CommentView[] }>(`/api/sheet-candidates/${candidateId}/comments`, {
        method: "POST",
        body: { anchor: anchorId ? { kind, id: anchorId } : { kind }, body: body.trim() },
      });
      onComments(result.comments);
      setBody("");
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setPending(false);
    }
  }

  return (
    <form
      id="new-comment"
      onSubmit={(e) => {
        e.preventDefault();
        void send();
      }}
      className="space-y-3 border-t border-rule pt-4"
      data-testid="new-comment-form"
      aria-labelledby={`${id}-title`}
    >
      <h3 id={`${id}-title`} className="text-lg font-semibold">
        New comment
      </h3>
      <div className="space-y-1.5">
        <label htmlFor={`${id}-anchor`} className="block text-[0.9375rem] font-semibold">
          About
        </label>
        <select id={`${id}-anchor`} value={anchor} onChange={(e) => setAnchor(e.target.value)} className={selectClass}>
          {anchors
            .filter((a) => a.kind === "sheet")
            .map((a) => (
              <option key={anchorValue(a)} value={anchorValue(a)}>
                {a.label}
              </option>
            ))}
          {groups.map((g) => {
            const options = anchors.filter((a) => a.kind === g.kind);
            if (!options.length) return null;
            return (
              <optgroup key={g.kind} label={g.label}>
                {options.map((a) => (
                  <option key={anchorValue(a)} value={anchorValue(a)}>
                    {a.label}
                  </option>
                ))}
              </optgroup>
            );
          })}
        </select>
      </div>
      <div className="space-y-1.5">
        <label htmlFor={`${id}-body`} className="block text-[0.9375rem] font-semibold">
          Comment
        </label>
        <textarea ref={bodyRef} id={`${id}-body`} rows={3} value={body} onChange={(e) => setBody(e.target.value)} className={selectClass} maxLength={4000} />
      </div>
      <button type="submit" disabled={pending} className={buttonClass.secondary}>
        {pending ? "Sending…" : "Add comment"}
      </button>
      <div aria-live="polite" className="empty:hidden">
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>
    </form>
  );
}

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
