type AuthFrameProps = { runningHead: string; title: string; lead?: React.ReactNode; children: React.ReactNode; aside?: React.ReactNode };

/** Account pages: one narrow column, like a form printed on the page's left half. */
export function AuthFrame({ runningHead, title, lead, children, aside }: AuthFrameProps) {
  return (
    <div className="grid gap-12 md:grid-cols-[minmax(0,26rem)_minmax(0,1fr)] md:gap-20">
      <section aria-labelledby="auth-title">
        <p className="running-head mb-2">{runningHead}</p>
        <h1 id="auth-title" className="text-[2rem] font-semibold leading-tight">
          {title}
        </h1>
        {lead ? <div className="mt-3 text-ink-muted">{lead}</div> : null}
        <div className="mt-8 border-t border-rule pt-8">{children}</div>
      </section>
      {aside ? <aside className="max-w-prose self-start border-l border-rule pl-8 text-ink-muted md:mt-24">{aside}</aside> : null}
    </div>
  );
}
