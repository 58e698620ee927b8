import Link from "next/link";
import type { RefObject } from "react";
import type { StatisticsGroup } from "@/lib/sheet/types";
import { differenceUnit, formatNumber, formatQuantity } from "@/lib/format";
import { formatCpkInterval } from "@/lib/sheet/format";
import { Notation } from "@/components/sheet/notation";

const basisWords = { test: "guaranteed by test", characterization: "guaranteed by characterization", design: "guaranteed by design" } as const;

function Figure({ text, unit }: { text: string; unit?: string }) {
  if (!text) return <span className="text-ink-muted">—</span>;
  return (
    <span className="whitespace-nowrap">
      <span className="figure">{text}</span>
      {unit ? <span className="unit">{`\u00a0${unit}`}</span> : null}
    </span>
  );
}

function percent(fraction: number): string {
  return formatQuantity(fraction * 100, "%", { digits: { maxDecimals: 1 } });
}

function decisionRuleText(rule: StatisticsGroup["decisionRule"]): string {
  return rule === "guard-band"
    ? "Guard-banded acceptance: each limit is moved inward by the expanded uncertainty U before a unit is judged."
    : rule === "simple-acceptance"
      ? "Simple acceptance: a unit passes when its value is within the limit; results within U of a limit are marked conditional."
      : "No decision: no limit is stated for this group.";
}

/** The group's name and conditions, with the panel's close button. */
export function PanelHeading({ group: g, headingRef, onClose }: { group: StatisticsGroup; headingRef: RefObject<HTMLHeadingElement | null>; onClose: () => void }) {
  return (
    <div className="flex items-start justify-between gap-4 border-b border-rule px-5 pb-3 pt-5">
      <div>
        <p className="running-head">Data behind the figure</p>
        <h2 id="statistics-panel-title" ref={headingRef} tabIndex={-1} className="mt-1 text-xl font-semibold leading-tight outline-none">
          {g.label} <span className="font-normal text-ink-muted">({g.symbol})</span>
        </h2>
        <p className="mt-1 text-sm text-ink-muted">{g.conditionsText ? <Notation text={g.conditionsText} /> : "No conditions"}</p>
      </div>
      <button type="button" onClick={onClose} className="rounded border border-rule-strong px-2 py-1 text-sm font-semibold hover:border-signal">
        Close<span className="sr-only"> the data panel</span>
      </button>
    </div>
  );
}

/** The statistics across units, the limits and the decision rule that judged them. */
export function GroupSummary({
  group: g,
  coverage,
  confidence,
  cpkThreshold,
  decisionRules,
}: {
  group: StatisticsGroup;
  coverage: number;
  confidence: number;
  cpkThreshold: number;
  decisionRules: string[];
}) {
  const rule = decisionRuleText(g.decisionRule);
  return (
    <section aria-labelledby="panel-summary">
      <h3 id="panel-summary" className="running-head mb-2">
        Statistics across units
      </h3>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-[0.9375rem]" data-testid="panel-statistics">
        <SpreadFigures group={g} coverage={coverage} confidence={confidence} />
        <LimitFigures group={g} cpkThreshold={cpkThreshold} />
      </dl>
      <p className="mt-3 text-sm">
        <span className="font-semibold">Decision rule.</span> {rule}
      </p>
      {g.decisionRule && decisionRules.length > 0 ? (
        <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm text-ink-muted">
          {decisionRules.map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}

/** Every unit's value and its pass or fail, each linked to its measurement set. */
export function UnitResults({ group: g, deviceId }: { group: StatisticsGroup; deviceId: number }) {
  return (
    <section aria-labelledby="panel-units">
      <h3 id="panel-units" className="running-head mb-2">
        Per-unit results
      </h3>
      <table className="sheet-table text-sm" data-testid="panel-units">
        <thead>
          <tr>
            <th scope="col">Serial</th>
            <th scope="col">Lot</th>
            <th scope="col">Set</th>
            <th scope="col" className="num">
              Value
            </th>
            <th scope="col">Result</th>
          </tr>
        </thead>
        <tbody>
          {g.units.map((unit) => (
            <tr key={`${unit.setId}|${unit.serial}`}>
              <th scope="row" className="figure whitespace-nowrap">
                {unit.serial}
              </th>
              <td className="figure">{unit.lot ?? "—"}</td>
              <td className="figure">
                <Link href={`/devices/${deviceId}/measurements/${unit.setId}`} aria-label={`Measurement set ${unit.setId}`}>
                  #{unit.setId}
                </Link>
              </td>
              <td className="num">
                <Figure text={unit.value.text} unit={g.unit} />
              </td>
              <td className="whitespace-nowrap">
                <UnitDecision unit={unit} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {g.units.some((u) => u.conditional) ? (
        <p className="mt-2 text-sm text-ink-muted">
          Conditional: within the expanded uncertainty U of a limit, so the result is not certain either way.
        </p>
      ) : null}
    </section>
  );
}

/** How many units, and how they spread: mean, s, median, range and the tolerance interval. */
function SpreadFigures({ group: g, coverage, confidence }: { group: StatisticsGroup; coverage: number; confidence: number }) {
  return (
    <>
      <dt>n (units)</dt>
      <dd className="figure" data-testid="panel-n">
        {g.n}
      </dd>
      <dt>Lots</dt>
      <dd className="figure">{g.lots}</dd>
      <dt>Mean</dt>
      <dd>
        <Figure text={g.mean.text} unit={g.unit} />
      </dd>
      <dt>s</dt>
      <dd>
        <Figure text={g.standardDeviation.text} unit={differenceUnit(g.unit)} />
      </dd>
      <dt>Median</dt>
      <dd>
        <Figure text={g.median.text} unit={g.unit} />
      </dd>
      <dt>Min · max</dt>
      <dd>
        <Figure text={g.min.text} /> · <Figure text={g.max.text} unit={g.unit} />
      </dd>
      <dt>Tolerance interval</dt>
      <dd>
        {g.toleranceInterval ? (
          <>
            <Figure text={g.toleranceInterval.lower.text} /> to <Figure text={g.toleranceInterval.upper.text} unit={g.unit} />
            <div className="text-sm text-ink-muted">
              {percent(coverage)} of units, {percent(confidence)} confidence, k = <span className="figure">{g.toleranceInterval.factor.text}</span>
            </div>
          </>
        ) : (
          <span className="text-ink-muted">needs at least two units</span>
        )}
      </dd>
    </>
  );
}

/** The stated limits and how the units fare against them: Cpk, U, the acceptance interval, pass and fail. */
function LimitFigures({ group: g, cpkThreshold }: { group: StatisticsGroup; cpkThreshold: number }) {
  const cpkLow = g.cpk.value !== null && g.cpk.value < cpkThreshold;
  return (
    <>
      <dt>Limits</dt>
      <dd>
        {g.limits ? (
          <>
            <span className="text-ink-muted">min</span> <Figure text={g.limits.min.text} /> · <span className="text-ink-muted">typ</span>{" "}
            <Figure text={g.limits.typ.text} /> · <span className="text-ink-muted">max</span> <Figure text={g.limits.max.text} unit={g.unit} />
            <div className="text-sm text-ink-muted">{basisWords[g.limits.basis]}</div>
          </>
        ) : (
          <span className="text-ink-muted">none stated</span>
        )}
      </dd>
      <dt>Cpk</dt>
      <dd data-testid="panel-cpk">
        {g.cpk.text ? (
          <span className={cpkLow ? "font-semibold text-signal-deep" : ""}>
            <span className="figure">{g.cpk.text}</span>
            {g.cpkInterval ? <span className="figure text-sm text-ink-muted"> ({formatCpkInterval(g)})</span> : null}
            <span className="text-sm">
              {" "}
              {cpkLow ? "below" : "meets"} the threshold <span className="figure">{formatNumber(cpkThreshold, { digits: { maxDecimals: 2 } })}</span>
            </span>
          </span>
        ) : g.cpkAbsentReason ? (
          <span className="text-ink-muted">
            —{" "}
            <span className="text-sm">
              {g.cpkAbsentReason} (threshold {formatNumber(cpkThreshold, { digits: { maxDecimals: 2 } })})
            </span>
          </span>
        ) : (
          <span className="text-ink-muted">
            — <span className="text-sm">(needs a limit; threshold {formatNumber(cpkThreshold, { digits: { maxDecimals: 2 } })})</span>
          </span>
        )}
      </dd>
      <dt>U (k = 2)</dt>
      <dd>
        <Figure text={g.expandedUncertainty.text} unit={g.expandedUncertainty.text ? differenceUnit(g.unit) : undefined} />
      </dd>
      {g.acceptance ? (
        <>
          <dt>Acceptance</dt>
          <dd>
            <Figure text={g.acceptance.lower.text} /> to <Figure text={g.acceptance.upper.text} unit={g.unit} />
          </dd>
        </>
      ) : null}
      <dt>Pass · fail</dt>
      <dd>
        {g.acceptance ? (
          <>
            <span className="figure">{g.passCount}</span> · <span className="figure">{g.failCount}</span>
          </>
        ) : (
          <span className="text-ink-muted">—</span>
        )}
      </dd>
    </>
  );
}

function UnitDecision({ unit }: { unit: StatisticsGroup["units"][number] }) {
  if (unit.decision === null) return <span className="text-ink-muted">no limit</span>;
  if (unit.decision === "pass") return <span>pass{unit.conditional ? <span className="text-ink-muted"> (conditional)</span> : null}</span>;
  return (
    <span className="font-semibold text-signal-deep">
      fail{unit.conditional ? <span className="font-normal"> (conditional)</span> : null}
    </span>
  );
}
