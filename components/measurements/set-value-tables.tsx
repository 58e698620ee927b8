import type { ValueTable } from "@/lib/analysis/tables";
import { settingSourceWords } from "@/lib/domain/analysis-settings";
import { formatNumber, formatQuantity, MISSING } from "@/lib/format";

/** Rows drawn on the page; the API (GET /api/measurements/[id], the bench API's answer) and the CLI's --json give every row. */
const MAX_ROWS = 1000;

/**
 * Every value at each point of the file (frequency or drive step): S-parameter magnitude and phase,
 * mismatch loss, and power readings as dBm, Vrms and dBµV into the stated impedance.
 */
export function SetValueTables({ tables }: { tables: ValueTable[] }) {
  if (tables.length === 0) return null;
  return (
    <section aria-labelledby="value-tables-title" className="mb-12" data-testid="set-value-tables">
      <h2 id="value-tables-title" className="mb-3 text-xl font-semibold">
        Values at each point
      </h2>
      {tables.map((table) => (
        <details key={table.id} className="mb-4 border-b border-rule pb-2">
          <summary className="cursor-pointer py-1 text-[0.9375rem] font-semibold">
            {table.title} <span className="figure font-normal text-ink-muted">({table.rows.length} rows{table.impedanceOhm ? `, ${impedanceWords(table)}` : ""})</span>
          </summary>
          {table.rows.length > MAX_ROWS ? (
            <p className="mt-2 text-sm text-ink-muted">
              The first {MAX_ROWS} of {table.rows.length} rows; the set&apos;s JSON (<code>GET /api/measurements/&lt;id&gt;</code>) and <code>benchfold analyze --json</code> give them all.
            </p>
          ) : null}
          <div className="mt-3 max-h-[32rem] overflow-auto" tabIndex={0} role="region" aria-label={`${table.title}, scrolls both ways`}>
            <table className="sheet-table">
              <thead>
                <tr>
                  <th scope="col">{table.x.label}</th>
                  {table.columns.map((column, i) => (
                    <th key={i} scope="col" className="num whitespace-nowrap">
                      {column.label} <span className="font-normal text-ink-muted">{column.unit === "deg" ? "°" : column.unit}</span>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {table.rows.slice(0, MAX_ROWS).map((row, r) => (
                  <tr key={r}>
                    <th scope="row" className="figure whitespace-nowrap font-normal">
                      {table.x.unit === "Hz" ? formatQuantity(row[0] ?? Number.NaN, "Hz", { digits: { maxSignificant: 7 } }) : formatNumber(row[0] ?? Number.NaN, { signed: table.x.unit === "dBm", digits: { maxDecimals: 2 } })}
                    </th>
                    {row.slice(1).map((value, c) => (
                      <td key={c} className="num figure">
                        {value === null ? MISSING : formatCell(value, table.columns[c].unit)}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </details>
      ))}
    </section>
  );
}

/** "into 75 Ω, set by the file": the impedance the Vrms and dBµV columns (or the S-parameters) are referred to, and who stated it. */
function impedanceWords(table: ValueTable): string {
  const ohm = formatQuantity(table.impedanceOhm ?? Number.NaN, "Ω", { digits: { maxSignificant: 4 } });
  return table.impedanceSource ? `${ohm}, set by ${settingSourceWords[table.impedanceSource]}` : ohm;
}

function formatCell(value: number, unit: string): string {
  if (unit === "Vrms") return formatNumber(value, { digits: { maxSignificant: 4 } });
  if (unit === "deg") return formatNumber(value, { digits: { decimals: 2 } });
  return formatNumber(value, { digits: { decimals: 3 } });
}
