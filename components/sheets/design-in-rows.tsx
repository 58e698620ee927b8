"use client";

import { buttonClass } from "@/components/ui/button";
import { selectClass } from "@/components/ui/field";

export type RowColumn<K extends string> = { key: K; header: string; maxLength: number; figure?: boolean; width?: string };
export type DraftRow<K extends string> = { id: number } & Record<K, string>;

/** One editable table of text cells with add and remove: a design-in list (pins, ordering, operating conditions). */
export function DesignInRows<K extends string>(props: {
  legend: string;
  hint: string;
  rowNoun: string;
  columns: RowColumn<K>[];
  rows: DraftRow<K>[];
  fieldErrors: Record<string, string>;
  errorKey: string;
  onChange: (rows: DraftRow<K>[]) => void;
}) {
  const { legend, hint, rowNoun, columns, rows, fieldErrors, errorKey, onChange } = props;
  const blank = () => ({ id: Math.max(999, ...rows.map((r) => r.id)) + 1, ...Object.fromEntries(columns.map((c) => [c.key, ""])) }) as DraftRow<K>;
  return (
    <fieldset className="mt-10" data-testid={`design-in-${errorKey}`}>
      <legend className="text-lg font-semibold">{legend}</legend>
      <p className="max-w-prose text-sm text-ink-muted">{hint}</p>
      <table className="sheet-table mt-3 max-w-4xl">
        <thead>
          <tr>
            {columns.map((c) => (
              <th key={c.key} scope="col">
                {c.header}
              </th>
            ))}
            <th scope="col">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row, i) => {
            const err = fieldErrors[`${errorKey}-${row.id}`];
            const set = (key: K, value: string) => onChange(rows.map((x) => (x.id === row.id ? { ...x, [key]: value } : x)));
            const name = `${rowNoun} ${i + 1}`;
            return (
              <tr key={row.id}>
                {columns.map((c, ci) => (
                  <td key={c.key} className={c.width}>
                    <input
                      type="text"
                      value={row[c.key]}
                      maxLength={c.maxLength}
                      onChange={(e) => set(c.key, e.target.value)}
                      aria-label={`${name}, ${c.header.toLowerCase()}`}
                      aria-invalid={err && ci === 0 ? true : undefined}
                      className={`${selectClass} ${c.figure ? "figure" : ""} px-2 py-1 text-sm aria-[invalid=true]:border-signal`}
                    />
                    {err && ci === 0 ? <p className="text-sm text-signal-deep">{err}</p> : null}
                  </td>
                ))}
                <td className="w-20 text-right">
                  <button type="button" className={`${buttonClass.quiet} text-sm`} onClick={() => onChange(rows.filter((x) => x.id !== row.id))} aria-label={`Remove ${name}`}>
                    Remove
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <button type="button" className={`${buttonClass.secondary} mt-3 px-3 py-1 text-sm`} onClick={() => onChange([...rows, blank()])}>
        Add a {rowNoun.toLowerCase()}
      </button>
    </fieldset>
  );
}
