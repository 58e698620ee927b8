"use client";

import { useState } from "react";
import type { BenchTokenSummary } from "@/lib/domain/instruments";
import { benchTokenBodySchema } from "@/lib/schemas/measurements";
import { messageOf, requestJson } from "@/components/api-client";
import { formatDateTime } from "@/lib/format";
import { useJsonResource } from "@/components/use-json-resource";
import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ScrollTable } from "@/components/ui/scroll-table";

type Created = { token: string; benchToken: BenchTokenSummary };

export function BenchTokensPanel({ initialTokens, appOrigin }: { initialTokens: BenchTokenSummary[]; appOrigin: string }) {
  const tokens = useJsonResource("/api/admin/bench-tokens", initialTokens, (body: { benchTokens: BenchTokenSummary[] }) => body.benchTokens);
  const [name, setName] = useState("");
  const [fieldError, setFieldError] = useState<string | undefined>();
  const [error, setError] = useState<string | null>(null);
  const [created, setCreated] = useState<Created | null>(null);
  const [pending, setPending] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  async function create(event: React.FormEvent) {
    event.preventDefault();
    setError(null);
    setMessage(null);
    const parsed = benchTokenBodySchema.safeParse({ name });
    if (!parsed.success) {
      setFieldError(parsed.error.issues[0]?.message);
      return;
    }
    setFieldError(undefined);
    setPending(true);
    try {
      setCreated(await requestJson<Created>("/api/admin/bench-tokens", { method: "POST", body: parsed.data }));
      setName("");
      void tokens.reload();
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setPending(false);
    }
  }

  async function revoke(token: BenchTokenSummary) {
    if (!window.confirm(`Revoke “${token.name}”? Benches using it are refused from then on.`)) return;
    setError(null);
    try {
      await requestJson(`/api/admin/bench-tokens/${token.id}`, { method: "DELETE" });
      setMessage(`“${token.name}” is revoked.`);
      if (created?.benchToken.id === token.id) setCreated(null);
    } catch (e) {
      setError(messageOf(e));
    }
    await tokens.reload();
  }

  return (
    <div className="space-y-14">
      <section aria-labelledby="new-token-title" className="max-w-3xl">
        <h2 id="new-token-title" className="mb-1 text-xl font-semibold">
          New bench token
        </h2>
        <p className="mb-5 text-ink-muted">
          A bench script posts its result files with a token instead of a password. Name it after the bench or the script, so you know which one to revoke.
        </p>
        <form onSubmit={create} noValidate className="flex flex-wrap items-end gap-4" data-testid="bench-token-form">
          <div className="min-w-[18rem] flex-1">
            <Field label="Name" name="name" value={name} onChange={setName} error={fieldError} hint="e.g. Bench 3 — doubler sweep script" required />
          </div>
          <button type="submit" disabled={pending} className={`${buttonClass.primary} mb-7`}>
            {pending ? "Creating…" : "Create token"}
          </button>
        </form>
        {created ? <CreatedToken created={created} appOrigin={appOrigin} onDone={() => setCreated(null)} /> : null}
      </section>

      <section aria-labelledby="tokens-title">
        <h2 id="tokens-title" className="mb-4 text-xl font-semibold">
          Tokens
        </h2>
        <div aria-live="polite" className="mb-4 space-y-2 empty:hidden">
          {message ? <Notice tone="success">{message}</Notice> : null}
          {error ? <Notice tone="error">{error}</Notice> : null}
          {tokens.loadError ? <Notice tone="error">{tokens.loadError}</Notice> : null}
        </div>
        {tokens.data.length === 0 ? (
          <p className="border-y border-rule py-4 text-ink-muted" data-testid="no-bench-tokens">
            No bench token has been created.
          </p>
        ) : (
          <BenchTokensTable tokens={tokens.data} onRevoke={(t) => void revoke(t)} />
        )}
      </section>
    </div>
  );
}

function CreatedToken({ created, appOrigin, onDone }: { created: Created; appOrigin: string; onDone: () => void }) {
  const [copied, setCopied] = useState<string | null>(null);
  const curl = [
    `curl -X POST ${appOrigin}/api/v1/measurements \\`,
    `  -H "Authorization: Bearer ${created.token}" \\`,
    `  -F device=WL-C2611-KDX \\`,
    `  -F file=@drive-sweep.csv \\`,
    `  -F serial=BFD-0001 -F temperatureC=25 -F measuredOn=${new Date().toISOString().slice(0, 10)}`,
  ].join("\n");

  async function copy(text: string, what: string) {
    try {
      await navigator.clipboard.writeText(text);
      setCopied(what);
    } catch {
      setCopied(null);
    }
  }

  return (
    <div className="mt-6 space-y-4 border-l-2 border-signal bg-paper-bright px-5 py-4" data-testid="created-token" role="status">
      <p className="font-semibold">
        Token for “{created.benchToken.name}”: copy it now. Benchfold keeps only its hash and will not show it again.
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <code className="figure select-all break-all border border-rule-strong bg-paper px-3 py-2 text-[0.875rem]" data-testid="created-token-value">
          {created.token}
        </code>
        <button type="button" className={buttonClass.secondary} onClick={() => void copy(created.token, "token")}>
          {copied === "token" ? "Copied" : "Copy token"}
        </button>
      </div>
      <div>
        <p className="running-head mb-1.5">Upload from a bench</p>
        <pre className="figure overflow-x-auto border border-rule bg-paper px-3 py-2 text-[0.8125rem] leading-relaxed">{curl}</pre>
        <p className="mt-2 flex flex-wrap gap-4 text-sm text-ink-muted">
          <span>
            <code>device</code> is the part number; the other fields are the upload conditions.
          </span>
          <button type="button" className={buttonClass.quiet} onClick={() => void copy(curl, "curl")}>
            {copied === "curl" ? "Copied" : "Copy example"}
          </button>
          <button type="button" className={buttonClass.quiet} onClick={onDone}>
            I have stored it
          </button>
        </p>
      </div>
    </div>
  );
}

/** The organization's tokens: name, prefix, dates, state, and Revoke for an active one. */
function BenchTokensTable({ tokens, onRevoke }: { tokens: BenchTokenSummary[]; onRevoke: (token: BenchTokenSummary) => void }) {
  return (
    <ScrollTable label="Bench tokens" testId="bench-tokens-table">
      <thead>
        <tr>
          <th scope="col">Name</th>
          <th scope="col">Starts with</th>
          <th scope="col" className="num">
            Created
          </th>
          <th scope="col" className="num">
            Last used
          </th>
          <th scope="col">Status</th>
          <th scope="col">
            <span className="sr-only">Revoke</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {tokens.map((t) => (
          <tr key={t.id} data-testid={`bench-token-${t.id}`}>
            <th scope="row" className="font-semibold">
              {t.name}
            </th>
            <td className="figure">{t.prefix}…</td>
            <td className="num">
              <span className="figure">{formatDateTime(t.createdAt)}</span>
            </td>
            <td className="num">{t.lastUsedAt ? <span className="figure">{formatDateTime(t.lastUsedAt)}</span> : <span className="text-ink-muted">never</span>}</td>
            <td>
              {t.revokedAt ? (
                <span className="font-semibold text-signal-deep">
                  Revoked <span className="figure font-normal">{formatDateTime(t.revokedAt)}</span>
                </span>
              ) : (
                "Active"
              )}
            </td>
            <td className="num">
              {t.revokedAt ? null : (
                <button type="button" className={buttonClass.quiet} onClick={() => onRevoke(t)}>
                  Revoke<span className="sr-only"> {t.name}</span>
                </button>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </ScrollTable>
  );
}
