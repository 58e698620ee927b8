type ScrollTableProps = {
  /** What the table holds, for screen readers: "Instruments" reads "Instruments, scrolls sideways on narrow screens". */
  label: string;
  testId: string;
  /** The table's caption, head and body. */
  children: React.ReactNode;
};

/**
 * A workspace table wider than a phone: a focusable, named region that scrolls sideways on its
 * own (so a keyboard user can scroll it too), around a `sheet-table`.
 */
export function ScrollTable({ label, testId, children }: ScrollTableProps) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`${label}, scrolls sideways on narrow screens`}>
      <table className="sheet-table" data-testid={testId}>
        {children}
      </table>
    </div>
  );
}
