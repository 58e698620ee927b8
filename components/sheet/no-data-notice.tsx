/** Said in place of a table that approved measurements would fill (the model's noDataNotice). */
export function NoDataNotice({ text }: { text: string }) {
  return (
    <p className="mt-4 max-w-prose border-l-2 border-rule-strong pl-3 text-ink-muted" data-testid="no-data-notice">
      {text}
    </p>
  );
}
