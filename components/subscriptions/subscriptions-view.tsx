"use client";

import Link from "next/link";
import { useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { formatDate, formatDateTime } from "@/lib/format/date";
import type { SubscriptionsPage } from "@/lib/domain/subscriptions";

/** The customer's change notices: what they follow (each with Stop), and what was sent to them. */
export function SubscriptionsView({ runningHead, initial }: { runningHead: string; initial: SubscriptionsPage }) {
  const [data, setData] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState<number | null>(null);

  async function stop(id: number) {
    setBusy(id);
    setError(null);
    try {
      await requestJson(`/api/subscriptions/${id}`, { method: "DELETE" });
      setData(await requestJson<SubscriptionsPage>("/api/subscriptions"));
    } catch (e) {
      setError(messageOf(e));
    } finally {
      setBusy(null);
    }
  }

  return (
    <>
      <PageHeader
        runningHead={runningHead}
        title="Change notices"
        lead="Parts and device classes you follow. When a new revision is released or one is withdrawn, you get one e-mail with what changed and links to both revisions."
      />
      {error ? <Notice tone="error">{error}</Notice> : null}
      <section className="mb-10" aria-labelledby="follows-heading">
        <h2 id="follows-heading" className="mb-3 text-[1.25rem] font-semibold">
          You follow
        </h2>
        {data.follows.length === 0 ? (
          <EmptyState title="You follow nothing yet" testId="follows-empty">
            <p>
              Open a released sheet from the <Link href="/catalog">catalog</Link> and choose “Follow this part”, or follow every part of its class from the same organization.
            </p>
          </EmptyState>
        ) : (
          <ul className="divide-y divide-rule border-y border-rule" data-testid="follows">
            {data.follows.map((f) => (
              <li key={f.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
                <div>
                  <p className="font-semibold">{f.publicPath ? <Link href={f.publicPath}>{f.label}</Link> : f.label}</p>
                  <p className="text-sm text-ink-muted">
                    {f.kind === "part" ? "Part" : "Device class"} · since {formatDate(f.createdAt)}
                  </p>
                </div>
                <button type="button" className={buttonClass.secondary} disabled={busy === f.id} onClick={() => void stop(f.id)}>
                  Stop notices
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="sent-heading">
        <h2 id="sent-heading" className="mb-3 text-[1.25rem] font-semibold">
          Sent to you
        </h2>
        {data.sent.length === 0 ? (
          <p className="text-ink-muted">No notice has been sent to you yet.</p>
        ) : (
          <table className="w-full text-left text-[0.9375rem]" data-testid="sent">
            <thead>
              <tr className="border-b border-rule-strong">
                <th className="py-2 pr-4 font-semibold">Subject</th>
                <th className="py-2 pr-4 font-semibold">Queued</th>
                <th className="py-2 font-semibold">Sent</th>
              </tr>
            </thead>
            <tbody>
              {data.sent.map((m) => (
                <tr key={m.id} className="border-b border-rule">
                  <td className="py-2 pr-4">{m.subject}</td>
                  <td className="py-2 pr-4">{formatDateTime(m.queuedAt)}</td>
                  <td className="py-2">{m.sentAt ? formatDateTime(m.sentAt) : m.attempts ? `Not yet (${m.attempts} failed attempts; retrying)` : "Waiting to be sent"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </>
  );
}
