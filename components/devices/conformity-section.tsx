import type { ConformityAlertView, ConformityWatchView } from "@/lib/domain/conformity";
import { formatDate, formatDateTime } from "@/lib/format";
import { LazySpecChart } from "@/components/charts/lazy-spec-chart";
import { Notation } from "@/components/sheet/notation";
import { ScrollTable } from "@/components/ui/scroll-table";
import { CloseAlertForm } from "./close-alert-form";

type ConformitySectionProps = {
  watch: ConformityWatchView;
  /** The viewer may close an alert (an engineer). */
  canClose: boolean;
};

/**
 * The device's conformity watch: for its current revision, how many units approved since the release
 * sit inside each guaranteed limit, the control chart of each guaranteed parameter at its key condition,
 * and the alerts (open first), each with a word and a mark for its state, never colour alone.
 */
export function ConformitySection({ watch, canClose }: ConformitySectionProps) {
  const open = watch.alerts.filter((a) => !a.closed);
  return (
    <section id="conformity" aria-labelledby="conformity-title" className="mb-12" data-testid="conformity">
      <h2 id="conformity-title" className="mb-2 text-xl font-semibold">
        Conformity since release
      </h2>
      {watch.revision ? (
        <p className="mb-4 max-w-prose text-[0.9375rem] text-ink-muted" data-testid="conformity-lead">
          Units approved after Rev. {watch.revision.letter} was released on <span className="figure">{formatDate(watch.revision.releasedAt)}</span>:{" "}
          <span className="figure">{watch.setCount}</span> {watch.setCount === 1 ? "set" : "sets"}, read against its guaranteed limits and control charts.
        </p>
      ) : (
        <p className="mb-4 max-w-prose text-ink-muted" data-testid="conformity-lead">
          Nothing is watched yet: the watch starts when a revision of this device&apos;s sheet is released (and stops while the newest is withdrawn).
        </p>
      )}

      <AlertList alerts={watch.alerts} openCount={open.length} canClose={canClose} />

      {watch.revision && watch.limits.length > 0 ? (
        <div className="mb-6">
          <h3 className="mb-3 text-lg font-semibold">Units inside each guaranteed limit</h3>
          <ScrollTable label={`Units since Rev. ${watch.revision.letter} inside each guaranteed limit`} testId="conformity-limits">
            <thead>
              <tr>
                <th scope="col">Parameter</th>
                <th scope="col">Conditions</th>
                <th scope="col">Guaranteed limit and decision rule</th>
                <th scope="col" className="text-right">
                  Inside
                </th>
                <th scope="col" className="text-right">
                  Outside
                </th>
              </tr>
            </thead>
            <tbody>
              {watch.limits.map((l) => (
                <tr key={l.groupId} data-testid="conformity-limit-row">
                  <th scope="row">
                    {l.label} <span className="text-ink-muted">(<Notation text={l.symbol} />)</span>
                  </th>
                  <td>
                    <Notation text={l.conditionsText} />
                  </td>
                  <td className="min-w-[16rem]">{l.limitText}</td>
                  <td className="figure text-right">
                    {l.inside} of {l.inside + l.outside}
                  </td>
                  <td className="figure text-right">{l.outside > 0 ? <strong>✗ {l.outside}</strong> : "0"}</td>
                </tr>
              ))}
            </tbody>
          </ScrollTable>
        </div>
      ) : null}

      {watch.charts.length > 0 ? (
        <div className="space-y-8">
          <h3 className="text-lg font-semibold">Control charts</h3>
          {watch.charts.map((c) => (
            <figure key={c.groupId} className="max-w-4xl" data-testid="conformity-chart">
              <figcaption className="mb-2 text-[0.9375rem]">
                <span className="font-semibold">{c.label}</span>, <Notation text={c.conditionsText} />: <span className="figure">{c.pointCount}</span>{" "}
                {c.pointCount === 1 ? "unit" : "units"} since release; centre <span className="figure">{c.centreText}</span>, σ{" "}
                <span className="figure">{c.sigmaText}</span> from the <span className="figure">{c.releaseUnitCount}</span> units at release.
              </figcaption>
              <LazySpecChart spec={c.vegaLite} testId={`conformity-chart-${c.groupId}`} />
              <p className="sr-only">{c.description}</p>
              {c.signals.length > 0 ? (
                <ul className="mt-2 space-y-1 text-[0.875rem]" data-testid="conformity-signals">
                  {c.signals.map((s, i) => (
                    <li key={i}>
                      <span aria-hidden="true">○ </span>
                      Unit <span className="figure">{s.serial}</span> (set #{s.setId}): Nelson test {s.rule}, {s.words}
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="mt-2 text-[0.875rem] text-ink-muted">No test for special causes signals: in control.</p>
              )}
            </figure>
          ))}
        </div>
      ) : null}

      {watch.notes.length > 0 ? (
        <ul className="mt-4 list-disc pl-5 text-[0.875rem] text-ink-muted">
          {watch.notes.map((n, i) => (
            <li key={i}>
              <Notation text={n} />
            </li>
          ))}
        </ul>
      ) : null}
      {watch.revision ? (
        <details className="mt-4 max-w-prose text-[0.875rem] text-ink-muted">
          <summary className="cursor-pointer">How the watch decides</summary>
          <p className="mt-2">{watch.method}</p>
        </details>
      ) : null}
    </section>
  );
}

function AlertList({ alerts, openCount, canClose }: { alerts: ConformityAlertView[]; openCount: number; canClose: boolean }) {
  if (alerts.length === 0) return null;
  return (
    <div className="mb-6">
      <h3 className="mb-3 text-lg font-semibold">
        Alerts <span className="figure text-base font-normal text-ink-muted">({openCount} open)</span>
      </h3>
      <ul className="space-y-4" data-testid="conformity-alerts">
        {alerts.map((a) => (
          <li key={a.id} className={`border-l-2 pl-4 ${a.closed ? "border-rule" : "border-signal"}`} data-testid={`conformity-alert-${a.id}`}>
            <p className="text-[0.9375rem]">
              <span className={`running-head mr-2 ${a.closed ? "" : "!text-signal-deep"}`}>{a.closed ? "✓ Closed" : "⚠ Open"}</span>
              <span className="font-semibold">Alert #{a.id}</span> on Rev. {a.revisionLetter}, unit <span className="figure">{a.serial}</span> (set #
              {a.measurementSetId}), raised <span className="figure">{formatDateTime(a.raisedAt)}</span>
            </p>
            <ul className="mt-1 list-disc pl-5 text-[0.875rem]">
              {a.findings.map((f, i) => (
                <li key={i}>
                  <Notation text={f} />
                </li>
              ))}
            </ul>
            {a.closed ? (
              <p className="mt-1 text-[0.875rem] text-ink-muted" data-testid="alert-close-reason">
                Closed <span className="figure">{formatDateTime(a.closed.at)}</span> by {a.closed.by}: {a.closed.reason}
              </p>
            ) : canClose ? (
              <CloseAlertForm alertId={a.id} />
            ) : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
