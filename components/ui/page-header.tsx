type PageHeaderProps = { runningHead?: string; title: string; lead?: React.ReactNode; actions?: React.ReactNode };

/** A page opens like a document section: running head, title, one lead paragraph, a hairline. */
export function PageHeader({ runningHead, title, lead, actions }: PageHeaderProps) {
  return (
    <header className="mb-8 border-b border-rule pb-6">
      {runningHead ? <p className="running-head mb-2">{runningHead}</p> : null}
      <div className="flex flex-wrap items-end justify-between gap-4">
        <h1 className="text-[2rem] font-semibold leading-tight sm:text-[2.25rem]">{title}</h1>
        {actions}
      </div>
      {lead ? <div className="mt-3 max-w-prose text-[1.0625rem] text-ink-muted">{lead}</div> : null}
    </header>
  );
}
