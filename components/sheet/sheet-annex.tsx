import { annexUnitText, describeAbsentCpk, formatCpkInterval, formatPassCount } from "@/lib/sheet/format";
import type { SheetModel } from "@/lib/sheet/types";
import { NoDataNotice } from "./no-data-notice";
import { Notation } from "./notation";
import { SheetHeading } from "./sheet-heading";

export function SheetTraceability({ model }: { model: SheetModel }) {
  const { traceability } = model;
  return (
    <section aria-labelledby="sheet-traceability" className="mt-10">
      <SheetHeading id="sheet-traceability">Measurement traceability</SheetHeading>
      <div className="max-w-prose space-y-1">
        {traceability.statements.map((statement, i) => (
          <p key={i}>{statement}</p>
        ))}
      </div>
      {model.noDataNotice ? (
        <NoDataNotice text={model.noDataNotice} />
      ) : (
      <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="Instruments, scrolls sideways on narrow screens">
        <table className="sheet-table">
          <caption>Instruments</caption>
          <thead>
            <tr>
              <th scope="col">Instrument</th>
              <th scope="col">Model</th>
              <th scope="col">Serial</th>
              <th scope="col">Calibrated</th>
              <th scope="col">Due</th>
              <th scope="col">Stated uncertainty</th>
              <th scope="col" className="num">
                Sets
              </th>
            </tr>
          </thead>
          <tbody>
            {traceability.instruments.map((instrument) => (
              <tr key={`${instrument.kind}|${instrument.model}|${instrument.serial}|${instrument.calibratedOn}`}>
                <th scope="row">{instrument.kind}</th>
                <td>{instrument.model}</td>
                <td className="figure">{instrument.serial}</td>
                <td className="figure">{instrument.calibratedOn}</td>
                <td className="figure">
                  {instrument.calibrationDueOn}
                  {instrument.calibrationLapsed ? <span className="ml-1 text-signal">lapsed</span> : null}
                </td>
                <td>
                  {instrument.uncertainty.map((line) => (
                    <div key={line}>{line}</div>
                  ))}
                </td>
                <td className="num figure">{instrument.setCount}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      )}
      {model.noDataNotice ? null : (
      <div className="mt-6 overflow-x-auto" tabIndex={0} role="region" aria-label="Approved measurement sets, scrolls sideways on narrow screens">
        <table className="sheet-table">
          <caption>Approved measurement sets</caption>
          <thead>
            <tr>
              <th scope="col">Set</th>
              <th scope="col">Serial</th>
              <th scope="col">Lot</th>
              <th scope="col">Kind</th>
              <th scope="col" className="num">
                Temperature
              </th>
              <th scope="col" className="num">
                Measured on
              </th>
            </tr>
          </thead>
          <tbody>
            {traceability.measurementSets.map((set) => (
              <tr key={set.id}>
                <td className="figure">{set.id}</td>
                <th scope="row" className="figure">
                  {set.serial}
                </th>
                <td className="figure">{set.lot ?? ""}</td>
                <td>{set.kind}</td>
                <td className="num figure">{set.temperature}</td>
                <td className="num figure">{set.measuredOn}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      )}
    </section>
  );
}

export function SheetStatistics({ model }: { model: SheetModel }) {
  const { statistics } = model;
  const flagged = statistics.groups.filter((g) => !g.supported);
  const cpkAbsent = describeAbsentCpk(statistics);
  return (
    <section aria-labelledby="sheet-statistics" className="mt-10">
      <SheetHeading id="sheet-statistics">Statistics annex</SheetHeading>
      <p className="max-w-prose">{statistics.method}</p>
      {model.noDataNotice ? (
        <NoDataNotice text={model.noDataNotice} />
      ) : (
      <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-label="Statistics annex, scrolls sideways on narrow screens">
        <table className="sheet-table">
          <thead>
            <tr>
              <th scope="col">Parameter, conditions</th>
              {["n", "Mean", "s", "Median", "Min", "Max", "Tol. low", "Tol. high", "Cpk", "U (k = 2)", "Pass"].map((h) => (
                <th key={h} scope="col" className="num">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {statistics.groups.map((g) => (
              <tr key={g.groupId}>
                <th scope="row">
                  {g.label} <span className="unit">{annexUnitText(g.unit)}</span>
                  {!g.supported ? <span className="ml-1 font-semibold text-signal">!</span> : null}
                  <div className="text-sm text-ink-muted">
                    <Notation text={g.conditionsText} />
                  </div>
                </th>
                <td className="num figure">{g.n}</td>
                <td className="num figure">{g.mean.text}</td>
                <td className="num figure">{g.standardDeviation.text}</td>
                <td className="num figure">{g.median.text}</td>
                <td className="num figure">{g.min.text}</td>
                <td className="num figure">{g.max.text}</td>
                <td className="num figure">{g.toleranceInterval?.lower.text ?? ""}</td>
                <td className="num figure">{g.toleranceInterval?.upper.text ?? ""}</td>
                <td className="num figure">
                  {g.cpk.text}
                  {g.cpkInterval ? <div className="text-sm text-ink-muted">{formatCpkInterval(g)}</div> : null}
                </td>
                <td className="num figure">{g.expandedUncertainty.text}</td>
                <td className="num figure">{formatPassCount(g)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      )}
      {cpkAbsent ? (
        <div className="sheet-keep mt-6 max-w-prose" data-testid="cpk-absent">
          <h3 className="font-semibold">Cpk not stated</h3>
          <p className="mt-2">{cpkAbsent}</p>
          <ul className="mt-1 text-sm">
            {statistics.groups
              .filter((g) => g.cpkAbsentReason)
              .map((g) => (
                <li key={g.groupId}>
                  {g.label}, <Notation text={g.conditionsText} />: n = <span className="figure">{g.n}</span>
                </li>
              ))}
          </ul>
        </div>
      ) : null}
      {flagged.length > 0 ? (
        <div className="sheet-keep mt-6">
          <h3 className="font-semibold">Limits the data do not support</h3>
          <ul className="mt-2 space-y-2">
            {flagged.map((g) => (
              <li key={g.groupId} className="border-l-2 border-signal pl-3">
                <span className="font-semibold">
                  {g.label}, <Notation text={g.conditionsText} />:
                </span>{" "}
                {g.flags.map((f) => f.message).join(" ")}
                {g.units.some((u) => u.decision === "fail") ? (
                  <details className="mt-1 text-sm">
                    <summary className="cursor-pointer text-ink-muted">Per-unit results</summary>
                    <ul className="mt-1">
                      {g.units.map((u) => (
                        <li key={u.serial} className="figure">
                          {u.serial} {u.value.text} {g.unit}: {u.decision}
                          {u.conditional ? " (conditional)" : ""}
                        </li>
                      ))}
                    </ul>
                  </details>
                ) : null}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {statistics.decisionRules.length > 0 ? (
        <div className="mt-6 max-w-prose">
          <h3 className="font-semibold">Decision rules (ISO/IEC 17025:2017 §7.8.6)</h3>
          {statistics.decisionRules.map((rule) => (
            <p key={rule} className="mt-1">
              {rule}
            </p>
          ))}
        </div>
      ) : null}
    </section>
  );
}
