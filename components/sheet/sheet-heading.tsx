import type { ReactNode } from "react";

export function SheetHeading({ id, children }: { id: string; children: ReactNode }) {
  return (
    <h2 id={id} className="running-head mb-3 border-b border-ink pb-1 text-ink">
      {children}
    </h2>
  );
}
