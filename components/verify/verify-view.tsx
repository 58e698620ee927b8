"use client";

import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import { ApiError, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { useFileDrop } from "@/components/ui/use-file-drop";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { formatDate, formatDateTime } from "@/lib/format/date";
import { formatByteSize } from "@/lib/format/byte-size";
import { notReleasedSentence, readVerifyInput, standingMarks, verifySentence, type VerifyAnswer, type VerifyQuery } from "@/lib/domain/verify";
import { hashBlob } from "@/lib/verify/hash-blob";

type State =
  | { kind: "idle" }
  | { kind: "hashing"; fileName: string; done: number; total: number }
  | { kind: "asking"; what: string }
  | { kind: "answer"; answer: VerifyAnswer; what: string }
  | { kind: "unknown"; what: string }
  | { kind: "error"; message: string };

function describe(query: VerifyQuery): string {
  return "sha256" in query ? `SHA-256 ${query.sha256}` : `reference ${query.reference}`;
}

/**
 * The verify screen: drop a PDF (hashed here, in slices, nothing uploaded) or paste its SHA-256 or
 * the reference from its footer; the answer is one sentence in large type with a word and a mark.
 */
export function VerifyView({ initial }: { initial: string }) {
  const [state, setState] = useState<State>({ kind: "idle" });
  const [text, setText] = useState(initial);
  const { dragging, dropProps } = useFileDrop((files) => {
    if (files[0]) void hashFile(files[0]);
  });
  const hashing = useRef<AbortController | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);

  async function ask(query: VerifyQuery, what: string) {
    setState({ kind: "asking", what });
    const params = new URLSearchParams("sha256" in query ? { sha256: query.sha256 } : { reference: query.reference });
    try {
      const { verification } = await requestJson<{ verification: VerifyAnswer }>(`/api/v1/verify?${params}`);
      setState({ kind: "answer", answer: verification, what });
    } catch (error) {
      if (error instanceof ApiError && error.status === 404) setState({ kind: "unknown", what });
      else setState({ kind: "error", message: error instanceof Error ? error.message : "Something went wrong." });
    }
  }

  function askText(value: string) {
    const query = readVerifyInput(value);
    if (!query) {
      setState({ kind: "error", message: "Paste the PDF's SHA-256 (64 hexadecimal digits) or the reference from its footer (two groups of five, e.g. 7KQ2M-XR4TD)." });
      return;
    }
    void ask(query, describe(query));
  }

  async function hashFile(file: File) {
    hashing.current?.abort(new Error("replaced"));
    const controller = new AbortController();
    hashing.current = controller;
    setState({ kind: "hashing", fileName: file.name, done: 0, total: file.size });
    try {
      const sha256 = await hashBlob(file, {
        signal: controller.signal,
        subtle: typeof crypto !== "undefined" && crypto.subtle ? crypto.subtle : null,
        onProgress: (done, total) => setState({ kind: "hashing", fileName: file.name, done, total }),
      });
      if (hashing.current !== controller) return;
      hashing.current = null;
      await ask({ sha256 }, `${file.name} (${formatByteSize(file.size)}), SHA-256 ${sha256}`);
    } catch (error) {
      if (controller.signal.aborted) {
        if (hashing.current === controller) setState({ kind: "idle" });
        return;
      }
      setState({ kind: "error", message: `The file could not be read: ${error instanceof Error ? error.message : "unknown error"}.` });
    }
  }

  useEffect(() => {
    if (initial.trim()) askText(initial);
    return () => hashing.current?.abort(new Error("left the page"));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  return (
    <>
      <PageHeader
        runningHead="Verify a printout"
        title="Is this sheet released?"
        lead="Drop a datasheet PDF, or paste its SHA-256 or the verification reference printed in its footer. The file is hashed in your browser; it is never uploaded."
      />
      <div className="grid gap-8 lg:grid-cols-2">
        <div
          data-testid="verify-drop"
          {...dropProps}
          className={`flex min-h-40 flex-col items-start justify-center gap-3 rounded border-2 border-dashed p-6 ${dragging ? "border-signal bg-signal-wash" : "border-rule-strong bg-paper-deep"}`}
        >
          <p className="text-[1.0625rem] font-semibold">{dragging ? "Drop it here" : "Drop the PDF here"}</p>
          <p className="text-sm text-ink-muted">or</p>
          <button type="button" className={buttonClass.secondary} onClick={() => fileInput.current?.click()}>
            Choose a file…
          </button>
          <input
            ref={fileInput}
            type="file"
            accept="application/pdf,.pdf"
            className="sr-only"
            data-testid="verify-file"
            aria-label="PDF to verify"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void hashFile(file);
              e.target.value = "";
            }}
          />
        </div>
        <form
          className="space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            askText(text);
          }}
        >
          <label htmlFor="verify-text" className="block text-[0.9375rem] font-semibold">
            SHA-256 or verification reference
          </label>
          <input
            id="verify-text"
            name="q"
            value={text}
            onChange={(e) => setText(e.target.value)}
            maxLength={500}
            autoComplete="off"
            spellCheck={false}
            placeholder="7KQ2M-XR4TD"
            className="w-full rounded border border-rule-strong bg-paper-bright px-3 py-2 font-mono text-base text-ink placeholder:text-ink-muted"
          />
          <p className="text-sm text-ink-muted">The footer of every page of a released PDF reads “Verify: XXXXX-XXXXX at …”.</p>
          <button type="submit" className={buttonClass.primary}>
            Verify
          </button>
        </form>
      </div>
      <section aria-live="polite" className="mt-10" data-testid="verify-result">
        <Result state={state} onCancel={() => hashing.current?.abort(new Error("cancelled"))} />
      </section>
    </>
  );
}

function Result({ state, onCancel }: { state: State; onCancel: () => void }) {
  switch (state.kind) {
    case "idle":
      return null;
    case "hashing": {
      const percent = state.total ? Math.floor((100 * state.done) / state.total) : 100;
      return (
        <div className="space-y-2">
          <p>
            Hashing {state.fileName} in your browser: {formatByteSize(state.done)} of {formatByteSize(state.total)} ({percent} %).
          </p>
          <progress max={state.total || 1} value={state.done} className="w-full max-w-md" aria-label="Hashing progress" />
          <button type="button" className={buttonClass.quiet} onClick={onCancel}>
            Cancel
          </button>
        </div>
      );
    }
    case "asking":
      return <p>Looking up {state.what}…</p>;
    case "error":
      return <Notice tone="error">{state.message}</Notice>;
    case "unknown":
      return (
        <div data-standing="unknown">
          <Sentence mark="✗" word="Unknown" sentence={notReleasedSentence} />
          <p className="mt-3 break-all text-sm text-ink-muted">Checked: {state.what}. No revision released on Benchfold has this file or reference; a draft, an edited copy or another maker&apos;s sheet reads like this.</p>
        </div>
      );
    case "answer": {
      const a = state.answer;
      const { word, mark } = standingMarks[a.standing];
      return (
        <div data-standing={a.standing} className="space-y-6">
          <Sentence mark={mark} word={word} sentence={verifySentence(a)} />
          <dl className="grid max-w-3xl grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-[0.9375rem]">
            <dt className="font-semibold">Organization</dt>
            <dd>{a.organization.name}</dd>
            <dt className="font-semibold">Part</dt>
            <dd>
              {a.partNumber}
              {a.title ? `: ${a.title}` : ""}
            </dd>
            <dt className="font-semibold">Revision</dt>
            <dd>
              <Link href={a.publicPath}>Revision {a.letter}</Link>, released {formatDate(a.releasedAt)} · <a href={a.pdfPath}>stored PDF</a>
            </dd>
            <dt className="font-semibold">Signed by</dt>
            <dd>
              {a.signers.length
                ? a.signers.map((s) => `${s.name} (${s.roleWord}, ${formatDateTime(s.signedAt)})`).join("; ")
                : "No signature recorded"}
            </dd>
            <dt className="font-semibold">Reference</dt>
            <dd className="font-mono">{a.reference}</dd>
            <dt className="font-semibold">SHA-256</dt>
            <dd className="break-all font-mono text-sm">{a.pdfSha256}</dd>
          </dl>
          {a.withdrawal ? (
            <Notice tone="error">
              Withdrawn on {formatDate(a.withdrawal.withdrawnAt)}. Reason: {a.withdrawal.reason}
            </Notice>
          ) : null}
          {a.later.length ? (
            <div>
              <h2 className="mb-2 text-[1.25rem] font-semibold">Released since revision {a.letter}</h2>
              <ol className="space-y-3">
                {a.later.map((r) => (
                  <li key={r.letter}>
                    <p>
                      <Link href={r.publicPath}>Revision {r.letter}</Link>, released {formatDate(r.releasedAt)} — {standingMarks[r.standing].mark} {standingMarks[r.standing].word}
                    </p>
                    {r.notes.length ? (
                      <ul className="ml-5 list-disc text-[0.9375rem] text-ink-muted">
                        {r.notes.map((n, i) => (
                          <li key={i}>{n}</li>
                        ))}
                      </ul>
                    ) : null}
                  </li>
                ))}
              </ol>
            </div>
          ) : null}
          <p className="break-all text-sm text-ink-muted">Checked: {state.what}.</p>
        </div>
      );
    }
  }
}

function Sentence({ mark, word, sentence }: { mark: string; word: string; sentence: string }) {
  return (
    <p className="flex flex-wrap items-baseline gap-x-4 gap-y-2 text-[1.75rem] font-semibold leading-snug sm:text-[2rem]" data-testid="verify-sentence">
      <span className="inline-flex items-baseline gap-2 rounded border-2 border-ink px-3 py-0.5 text-[1.25rem] uppercase tracking-wide">
        <span aria-hidden="true">{mark}</span>
        {word}
      </span>
      <span>{sentence}</span>
    </p>
  );
}
