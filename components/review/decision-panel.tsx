"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { signatureMeanings, signatureMeaningWords, type CandidateDetail } from "@/lib/domain/reviews";
import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ReasonField } from "@/components/ui/reason-field";
import { useJsonForm, type FieldErrors, type FormCheck } from "@/components/use-json-form";
import type { CandidateDecisionBody } from "@/lib/schemas/reviews";

type DecisionPanelProps = {
  candidateId: number;
  /** The viewer may decide now (the server checks again). */
  canDecide: boolean;
  /** Why the viewer may not decide, said plainly. */
  blockedBecause: string | null;
  /** The SHA-256 of the frozen candidate: what a signature names. */
  digest: string;
  signatureCount: number;
  requiredSignatures: number;
};

type Outcome = "changes-requested" | "signed" | "approved";

/**
 * The reviewer's decision at the foot of the review: changes requested with a reason, or an
 * electronic signature, which states its meaning, asks for the password again and names the
 * digest it signs (21 CFR Part 11 §11.50, §11.70, §11.200(a)). The server checks all of it again.
 */
export function DecisionPanel({ candidateId, canDecide, blockedBecause, digest, signatureCount, requiredSignatures }: DecisionPanelProps) {
  const router = useRouter();
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const done = (candidate: CandidateDetail, decision: CandidateDecisionBody["decision"]) => {
    setOutcome(decision === "request-changes" ? "changes-requested" : candidate.state === "approved" ? "approved" : "signed");
    router.refresh();
  };

  // The outcome stays on screen after the page reloads its data (when the forms are no longer offered).
  if (outcome) {
    const words: Record<Outcome, string> = {
      "changes-requested": "Changes requested: the engineer has been told why.",
      signed: "Signed. The candidate waits for another reviewer's signature.",
      approved: "Signed and approved: the engineer may now release the sheet.",
    };
    return (
      <div data-testid="decision-done">
        <Notice tone="success">{words[outcome]}</Notice>
      </div>
    );
  }

  return (
    <>
      {blockedBecause ? (
        <div className="max-w-prose" data-testid="decide-blocked">
          <Notice>{blockedBecause}</Notice>
        </div>
      ) : null}
      {canDecide ? <DecisionForms candidateId={candidateId} digest={digest} signatureCount={signatureCount} requiredSignatures={requiredSignatures} onDone={done} /> : null}
    </>
  );
}

function DecisionForms({
  candidateId,
  digest,
  signatureCount,
  requiredSignatures,
  onDone: done,
}: {
  candidateId: number;
  digest: string;
  signatureCount: number;
  requiredSignatures: number;
  onDone: DoneHandler;
}) {
  return (
    <div className="grid gap-8 lg:grid-cols-2">
      <RequestChangesForm candidateId={candidateId} onDone={done} />
      <SignForm candidateId={candidateId} digest={digest} signatureCount={signatureCount} requiredSignatures={requiredSignatures} onDone={done} />
    </div>
  );
}

type DoneHandler = (candidate: CandidateDetail, decision: CandidateDecisionBody["decision"]) => void;

function RequestChangesForm({ candidateId, onDone }: { candidateId: number; onDone: DoneHandler }) {
  const id = useId();
  const { errors, formError, pending, submit } = useJsonForm<CandidateDecisionBody, { candidate: CandidateDetail }>({
    url: `/api/sheet-candidates/${candidateId}/decision`,
    check: (form): FormCheck<CandidateDecisionBody> => {
      const reason = String(form.get("reason") ?? "").trim();
      if (reason.length < 10) return { errors: { reason: "Say what must change (at least 10 characters)." } };
      return { body: { decision: "request-changes", reason } };
    },
    onSuccess: ({ candidate }, body) => onDone(candidate, body.decision),
  });
  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="space-y-3 border-l-2 border-rule-strong px-5 py-4" data-testid="request-changes-form" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="text-lg font-semibold">
        Request changes
      </h3>
      <p className="text-[0.9375rem] text-ink-muted">The engineer reads your reason, fixes the sheet and submits it again; this candidate then closes.</p>
      <div className="space-y-1.5">
        <ReasonField id={id} label="What must change" error={errors.reason} rows={4} />
      </div>
      <button type="submit" disabled={pending} className={buttonClass.secondary}>
        {pending ? "Sending…" : "Request changes"}
      </button>
      <div aria-live="polite" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
    </form>
  );
}

function SignForm({
  candidateId,
  digest,
  signatureCount,
  requiredSignatures,
  onDone,
}: {
  candidateId: number;
  digest: string;
  signatureCount: number;
  requiredSignatures: number;
  onDone: DoneHandler;
}) {
  const id = useId();
  const { errors, formError, pending, submit } = useJsonForm<CandidateDecisionBody, { candidate: CandidateDetail }>({
    url: `/api/sheet-candidates/${candidateId}/decision`,
    check: (form): FormCheck<CandidateDecisionBody> => {
      const meaning = String(form.get("meaning") ?? "");
      const password = String(form.get("password") ?? "");
      const found: FieldErrors = {};
      const known = signatureMeanings.find((m) => m === meaning);
      if (!known) found.meaning = "State the meaning of your signature.";
      if (!password) found.password = "Enter your password to sign.";
      if (!known || !password) return { errors: found };
      return { body: { decision: "approve", meaning: known, password } };
    },
    onSuccess: ({ candidate }, body) => onDone(candidate, body.decision),
  });
  const remaining = requiredSignatures - signatureCount;
  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="space-y-4 border-l-2 border-signal bg-paper-bright px-5 py-4" data-testid="sign-form" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="text-lg font-semibold">
        Sign and approve
      </h3>
      <p className="text-[0.9375rem] text-ink-muted">
        Your electronic signature records your printed name, role, organization, the time (UTC), its meaning and the digest below; it is printed on the
        released sheet and PDF.{" "}
        {requiredSignatures > 1
          ? `Your organization requires ${requiredSignatures} signatures; ${remaining === 1 ? "yours is the last one" : `${remaining} are still needed`}.`
          : null}
      </p>
      <fieldset aria-describedby={errors.meaning ? `${id}-meaning-error` : undefined}>
        <legend className="mb-1.5 text-[0.9375rem] font-semibold">Meaning of your signature</legend>
        {signatureMeanings.map((meaning) => (
          <label key={meaning} className="flex items-start gap-2 text-[0.9375rem]">
            <input type="radio" name="meaning" value={meaning} required className="mt-1.5" />
            <span>{signatureMeaningWords[meaning]}</span>
          </label>
        ))}
        {errors.meaning ? (
          <p id={`${id}-meaning-error`} className="mt-1 text-sm text-signal-deep">
            {errors.meaning}
          </p>
        ) : null}
      </fieldset>
      <div className="space-y-1.5">
        <label htmlFor={`${id}-password`} className="block text-[0.9375rem] font-semibold">
          Your password
        </label>
        <input
          id={`${id}-password`}
          name="password"
          type="password"
          autoComplete="current-password"
          required
          aria-invalid={errors.password ? true : undefined}
          aria-describedby={[`${id}-password-hint`, errors.password ? `${id}-password-error` : ""].filter(Boolean).join(" ")}
          className={`${selectClass} aria-[invalid=true]:border-signal`}
        />
        <p id={`${id}-password-hint`} className="text-sm text-ink-muted">
          Asked again at the moment of signing; a wrong one counts toward the sign-in limit.
        </p>
        {errors.password ? (
          <p id={`${id}-password-error`} className="text-sm text-signal-deep">
            {errors.password}
          </p>
        ) : null}
      </div>
      <p className="text-[0.75rem] text-ink-muted" data-testid="signed-digest">
        You sign candidate #{candidateId}, SHA-256 <span className="figure break-all">{digest}</span>
      </p>
      <button type="submit" disabled={pending} className={buttonClass.primary}>
        {pending ? "Signing…" : "Sign and approve"}
      </button>
      <div aria-live="polite" className="empty:hidden">
        {formError ? <Notice tone="error">{formError}</Notice> : null}
      </div>
    </form>
  );
}
