"use client";

import { useEffect, useId, useRef, useState } from "react";
import type { CommentAnchorKind, CommentView } from "@/lib/domain/reviews";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { anchorValue, commentOnEvent, type CommentAnchorOption, type CommentOnDetail } from "./comment-anchors";

/** A reply to a thread; the server gives it the thread's anchor. */
export function ReplyForm({ candidateId, parentId, onComments }: { candidateId: number; parentId: number; onComments: (comments: CommentView[]) => void }) {
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

/** A new thread on the whole sheet, a spec row, a chart or a prose section; "Comment" buttons elsewhere pick the anchor. */
export function NewCommentForm({ candidateId, anchors, onComments }: { candidateId: number; anchors: CommentAnchorOption[]; onComments: (comments: CommentView[]) => void }) {
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
