"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { reviewMeasurementBodySchema } from "@/lib/schemas/measurements";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

/** Approve, or reject with a reason. The server refuses the uploader and a set already decided. */
export function ReviewActions({ setId }: { setId: number }) {
  const router = useRouter();
  const id = useId();
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function decide(body: unknown) {
    setError(null);
    const parsed = reviewMeasurementBodySchema.safeParse(body);
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? "Check the reason.");
      return;
    }
    setPending(true);
    try {
      await requestJson(`/api/measurements/${setId}/review`, { method: "POST", body: parsed.data });
      router.refresh();
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setPending(false);
    }
  }

  return (
    <section aria-labelledby={`${id}-title`} className="border-l-2 border-signal bg-paper-bright px-5 py-4" data-testid="review-actions">
      <h2 id={`${id}-title`} className="running-head mb-2 !text-ink">
        Your decision
      </h2>
      <p className="mb-4 max-w-prose text-[0.9375rem] text-ink-muted">
        Approve when the file, its conditions and the derived figures hold up; an approved set can feed a datasheet and no longer changes. Reject with a
        reason the engineer can act on; a corrected upload supersedes this set.
      </p>
      {rejecting ? (
        <form
          onSubmit={(e) => {
            e.preventDefault();
            void decide({ decision: "reject", reason });
          }}
          className="space-y-3"
        >
          <div className="space-y-1.5">
            <label htmlFor={`${id}-reason`} className="block text-[0.9375rem] font-semibold">
              Reason for rejecting
            </label>
            <textarea id={`${id}-reason`} value={reason} onChange={(e) => setReason(e.target.value)} rows={3} className={selectClass} required />
          </div>
          <div className="flex flex-wrap gap-3">
            <button type="submit" disabled={pending} className={buttonClass.primary}>
              {pending ? "Rejecting…" : "Reject set"}
            </button>
            <button type="button" onClick={() => setRejecting(false)} className={buttonClass.quiet}>
              Back
            </button>
          </div>
        </form>
      ) : (
        <div className="flex flex-wrap gap-3">
          <button type="button" disabled={pending} onClick={() => void decide({ decision: "approve" })} className={buttonClass.primary}>
            {pending ? "Approving…" : "Approve set"}
          </button>
          <button type="button" disabled={pending} onClick={() => setRejecting(true)} className={buttonClass.secondary}>
            Reject…
          </button>
        </div>
      )}
      <div aria-live="polite" className="mt-3 empty:hidden">
        {error ? <Notice tone="error">{error}</Notice> : null}
      </div>
    </section>
  );
}
