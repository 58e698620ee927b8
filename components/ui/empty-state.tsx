type EmptyStateProps = { title: string; children: React.ReactNode; testId?: string };

/** Says plainly what is not there yet, and why: a ruled note, not a cartoon. */
export function EmptyState({ title, children, testId }: EmptyStateProps) {
  return (
    <section
      className="max-w-prose border-y border-rule py-6 pl-5 [border-left:2px_solid_var(--color-rule-strong)]"
      data-testid={testId ?? "empty-state"}
    >
      <h2 className="text-lg font-semibold">{title}</h2>
      <div className="mt-2 space-y-2 text-ink-muted">{children}</div>
    </section>
  );
}
