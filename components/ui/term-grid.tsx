/** Terms and values as a ruled definition grid (a part's key conditions, a set's conditions). */
export function TermGrid({ items, columns, testId }: { items: [string, React.ReactNode][]; columns: string; testId: string }) {
  return (
    <dl className={`grid grid-cols-2 gap-x-8 gap-y-3 border-y border-rule py-4 ${columns}`} data-testid={testId}>
      {items.map(([term, value]) => (
        <div key={term}>
          <dt className="running-head">{term}</dt>
          <dd className="mt-0.5">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
