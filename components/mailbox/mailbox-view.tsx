import type { CaughtMessage } from "@/lib/domain/dev-mailbox";
import { formatDateTime } from "@/lib/format";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

const URL_PATTERN = /(https?:\/\/[^\s<>"')\]]+)/g;

/** Plain text with its URLs made into links; nothing else of the message is interpreted. */
function LinkedText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <>
      {parts.map((part, index) =>
        index % 2 === 1 ? (
          <a key={index} href={part} className="break-all">
            {part}
          </a>
        ) : (
          <span key={index}>{part}</span>
        ),
      )}
    </>
  );
}

export function MailboxView({ messages }: { messages: CaughtMessage[] }) {
  const newestFirst = [...messages].sort((a, b) => b.date.localeCompare(a.date));
  return (
    <>
      <PageHeader
        runningHead="Development only"
        title="Caught mail"
        lead="What Benchfold sent while the local fake mail server was running. Nothing here left this machine."
      />
      {newestFirst.length === 0 ? (
        <EmptyState title="No mail caught yet">
          <p>Invite someone, sign up, or ask for a new password, then reload this page.</p>
        </EmptyState>
      ) : (
        <ol className="space-y-10" data-testid="mailbox">
          {newestFirst.map((message) => (
            <li key={message.id} className="border-t-[1.5px] border-ink pt-4" data-testid="mail-message">
              <article aria-labelledby={`mail-${message.id}`}>
                <h2 id={`mail-${message.id}`} className="text-lg font-semibold">
                  {message.subject || "(no subject)"}
                </h2>
                <dl className="mt-2 grid grid-cols-[5rem_1fr] gap-x-4 gap-y-0.5 text-[0.9375rem]">
                  <dt className="running-head pt-0.5">To</dt>
                  <dd>{message.to}</dd>
                  <dt className="running-head pt-0.5">From</dt>
                  <dd className="text-ink-muted">{message.from}</dd>
                  <dt className="running-head pt-0.5">Date</dt>
                  <dd className="figure">{formatDateTime(message.date)}</dd>
                </dl>
                <pre className="mt-4 max-w-prose whitespace-pre-wrap border-l-2 border-rule pl-4 font-sans text-[0.9375rem] leading-relaxed">
                  <LinkedText text={message.text} />
                </pre>
              </article>
            </li>
          ))}
        </ol>
      )}
    </>
  );
}
