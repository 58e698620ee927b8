import { parameterCatalog, type ParameterDescription } from "@/lib/analysis/catalog";
import type { DerivedParameter } from "@/lib/analysis/types";
import { NumberQuantity } from "@/components/ui/quantity";
import { describeConditions } from "./parameter-conditions";
import { derivedParameterName, nameConditionKeys } from "@/lib/domain/parameter-names";

/**
 * The figure's name as the sheet's row and the charts' legend name it (lib/domain/parameter-names.ts): the
 * parameter with its harmonic order or path; the conditions column then leaves those out.
 */
function labelOf(name: string, conditions: DerivedParameter["conditions"] = {}): { label: string; description?: string } {
  const entry = (parameterCatalog as Record<string, ParameterDescription>)[name];
  const label = derivedParameterName(name, conditions);
  return entry ? { label, description: entry.description } : { label };
}

/** The conditions not already said by the figure's name. */
function conditionsBesideName(conditions: DerivedParameter["conditions"]): DerivedParameter["conditions"] {
  return Object.fromEntries(Object.entries(conditions).filter(([key]) => !(nameConditionKeys as readonly string[]).includes(key)));
}

function ParameterValue({ p }: { p: DerivedParameter }) {
  if (p.value === null) return <span className="text-ink-muted">not computed</span>;
  // Two decimals, or three significant figures for a small value (an RMS phase error of 0.0042° is not "0°").
  return <NumberQuantity value={p.value} unit={p.unit} digits={{ maxDecimals: 2, minSignificant: 3 }} signed={p.unit === "dBm"} />;
}

/** Parameters that recur at every sweep step (conversion loss per drive step) fold away below the key figures. */
const FOLD_AT = 9;

export function ParametersTable({ parameters }: { parameters: DerivedParameter[] }) {
  if (parameters.length === 0) return <p className="border-y border-rule py-4 text-ink-muted">No parameter was derived from this file.</p>;
  const counts = new Map<string, number>();
  for (const p of parameters) counts.set(p.name, (counts.get(p.name) ?? 0) + 1);
  // Within a recurring name, the rows a datasheet quotes (optimum, worst, band statistics) stay up top.
  const isSummary = (p: DerivedParameter) =>
    (counts.get(p.name) ?? 0) < FOLD_AT || "statistic" in p.conditions || p.conditions.drive === "optimum" || "method" in p.conditions;
  const key = parameters.filter(isSummary);
  const steps = parameters.filter((p) => !isSummary(p));
  const stepNames = [...new Set(steps.map((p) => labelOf(p.name).label))];
  return (
    <>
      <ParameterRows parameters={key} testId="set-parameters" />
      {steps.length > 0 ? (
        <details className="mt-4 border-b border-rule pb-2" data-testid="set-parameters-steps">
          <summary className="cursor-pointer py-1 text-[0.9375rem] font-semibold">
            {stepNames.join(", ")} at each step <span className="figure font-normal text-ink-muted">({steps.length})</span>
          </summary>
          <div className="mt-3">
            <ParameterRows parameters={steps} />
          </div>
        </details>
      ) : null}
    </>
  );
}

function ParameterRows({ parameters, testId }: { parameters: DerivedParameter[]; testId?: string }) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Derived parameters, scrolls sideways on narrow screens">
      <table className="sheet-table" data-testid={testId}>
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">Conditions</th>
            <th scope="col" className="num">
              Value
            </th>
          </tr>
        </thead>
        <tbody>
          {parameters.map((p, i) => {
            const { label, description } = labelOf(p.name, p.conditions);
            const parts = describeConditions(conditionsBesideName(p.conditions));
            return (
              <tr key={i}>
                <th scope="row" className="font-semibold" title={description}>
                  {label}
                </th>
                <td className="text-[0.875rem] text-ink-muted">
                  {parts.length === 0
                    ? "—"
                    : parts.map((part, j) => (
                        <span key={j} className="mr-2.5 inline-block whitespace-nowrap">
                          {part.label ? `${part.label} ` : ""}
                          <span className="figure text-ink">{part.value}</span>
                          {part.unit ? <span>{part.unit === "°" ? "°" : `\u00a0${part.unit}`}</span> : null}
                        </span>
                      ))}
                </td>
                <td className="num whitespace-nowrap">
                  <ParameterValue p={p} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
