import { buttonClass } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { NumberQuantity, Quantity, RangeQuantity } from "@/components/ui/quantity";
import { ScrollTable } from "@/components/ui/scroll-table";
import { Notation } from "@/components/sheet/notation";
import { quantityText, type DesignInAnswer, type DesignInCurves, type DesignInLimit, type DesignInOutcome, type DesignInReading } from "@/lib/sheet/design-in";
import type { DesignInChart } from "@/lib/sheet/design-in-charts";
import { formatNumber, formatRange } from "@/lib/format";
import { keyConditionField } from "@/lib/domain/measurement-conditions";
import { classConditions } from "@/templates/upload-conditions";

type DesignInCalculatorProps = {
  /** The page's own address, which the GET form submits to (the query is the calculator's state). */
  action: string;
  partNumber: string;
  revisionLetter: string;
  /** Said above the form when the revision is no longer the part's current one. */
  standingNote?: string;
  /** The curves the frozen model holds, or why there are none to read. */
  curves: { ok: true; curves: DesignInCurves } | { ok: false; message: string };
  typed: { drive: string; frequency: string };
  outcome: DesignInOutcome;
  charts: DesignInChart[];
  /** SVG markup per chart id, drawn on the server from the charts' Vega-Lite specs. */
  chartSvgs: Record<string, string>;
};

const FIGURE_DIGITS = { decimals: 2 } as const;
const DRIVE_STYLE = { signed: true, digits: { maxDecimals: 2 } } as const;

/**
 * The design-in calculator of a released sheet: a GET form (works without JavaScript, the query is an
 * address to share), then the reading of the released curves at the design, the units' spread, the
 * sheet's limits at those conditions, how it was read, and the charts with the design marked.
 * Drawn on the server; it ships no JavaScript.
 */
export function DesignInCalculator({ action, partNumber, revisionLetter, standingNote, curves, typed, outcome, charts, chartSvgs }: DesignInCalculatorProps) {
  const issues = outcome.kind === "issues" ? outcome.issues : [];
  const refusal = outcome.kind === "refused" ? outcome.refusal : null;
  // Each message is said once, below the form; a field it is about is marked invalid and pointed at it.
  const messageIdFor = (field: "drive" | "frequency") =>
    issues.some((i) => i.field === field) ? `design-in-issue-${field}` : refusal && refusal.field === field ? "design-in-refusal-message" : undefined;
  const blank = outcome.kind === "blank";
  // The class's words for its drive and input frequency, as its upload form and its sheet's key facts say them.
  const words = curves.ok ? classConditions[curves.curves.deviceClass] : undefined;
  const drive = keyConditionField(words, "drive");
  const frequency = keyConditionField(words, "inputFrequency");
  const fixedDefault = (field: "drive" | "frequency") =>
    blank && curves.ok && curves.curves.fixed.field === field ? quantityText(curves.curves.fixed.value, curves.curves.fixed.unit).replace(/\u00a0/g, " ") : "";
  return (
    <section id="design-in" aria-labelledby="design-in-title" className="mb-8 border-y border-rule py-6 print:hidden" data-testid="design-in">
      <h2 id="design-in-title" className="mb-1 text-lg font-semibold">
        Design-in calculator
      </h2>
      <p className="mb-4 max-w-prose text-[0.9375rem] text-ink-muted">
        Conversion loss and {curves.ok && curves.curves.deviceClass === "double-balanced-mixer" ? "isolation" : "suppression"} at your own drive and
        frequency, read off the typical curves released in {partNumber} Rev. {revisionLetter}: computed from the frozen data of this revision only,
        never extrapolated.
      </p>
      {standingNote ? (
        <div className="mb-4 max-w-prose" data-testid="design-in-standing">
          <Notice>{standingNote}</Notice>
        </div>
      ) : null}
      {!curves.ok ? (
        <div data-testid="design-in-unavailable">
          <Notice>{curves.message}</Notice>
        </div>
      ) : (
        <>
          <MeasuredRange curves={curves.curves} />
          <form method="get" action={`${action}#design-in`} aria-label="Design point" className="mb-6 grid max-w-3xl gap-4 sm:grid-cols-[1fr_1fr_auto] sm:items-start" data-testid="design-in-form">
            <DesignField
              id="design-in-drive"
              name="drive"
              label={drive.label}
              defaultValue={typed.drive || fixedDefault("drive")}
              placeholder="e.g. +10 dBm"
              hint={`${drive.hint ? `${drive.hint}. ` : ""}dBm if no unit is typed.`}
              messageId={messageIdFor("drive")}
            />
            <DesignField
              id="design-in-frequency"
              name="frequency"
              label={frequency.label}
              defaultValue={typed.frequency || fixedDefault("frequency")}
              placeholder="e.g. 1.5 GHz"
              hint="With its unit: GHz, MHz, kHz or Hz."
              messageId={messageIdFor("frequency")}
            />
            <button type="submit" className={`${buttonClass.primary} sm:mt-7`}>
              Read the curves
            </button>
          </form>
        </>
      )}
      {refusal && (refusal.field === "sheet" ? curves.ok : true) ? (
        <div className="mb-4 max-w-prose" data-testid="design-in-refusal">
          <Notice tone="error" id="design-in-refusal-message">
            {refusal.message}
          </Notice>
        </div>
      ) : null}
      {issues.length ? (
        <div className="mb-4 max-w-prose space-y-2" data-testid="design-in-issues">
          {issues.map((issue) => (
            <Notice key={issue.field} tone="error" id={`design-in-issue-${issue.field}`}>
              {issue.message}
            </Notice>
          ))}
        </div>
      ) : null}
      {outcome.kind === "answer" ? <DesignInResult answer={outcome.answer} charts={charts} chartSvgs={chartSvgs} /> : null}
    </section>
  );
}

function MeasuredRange({ curves }: { curves: DesignInCurves }) {
  const { swept, fixed, range } = curves;
  return (
    <p className="mb-4 text-[0.9375rem]" data-testid="design-in-range">
      <span className="running-head mr-2 !text-ink">Measured</span>
      {swept.label}{" "}
      {swept.unit === "dBm" ? (
        <Quantity value={`${formatNumber(range.min, DRIVE_STYLE)} to ${formatNumber(range.max, DRIVE_STYLE)}`} unit="dBm" />
      ) : (
        <RangeQuantity min={range.min} max={range.max} unit={swept.unit} digits={{ maxSignificant: 6 }} />
      )}
      {" "}at {fixed.label.replace(/^Input/, "input")} <span className="figure">{quantityText(fixed.value, fixed.unit)}</span> only
      {curves.temperatureC !== null ? (
        <>
          , <NumberQuantity value={curves.temperatureC} unit="°C" digits={{ maxDecimals: 1 }} />
        </>
      ) : null}
      .
    </p>
  );
}

/** A typed quantity of the design-in form: the house Field, bounded as the API bounds it (40 characters). */
function DesignField(props: { id: string; name: string; label: string; defaultValue: string; placeholder: string; hint: string; messageId?: string }) {
  return <Field {...props} maxLength={40} autoComplete="off" figure />;
}

function DesignInResult({ answer, charts, chartSvgs }: { answer: DesignInAnswer; charts: DesignInChart[]; chartSvgs: Record<string, string> }) {
  const n = Math.max(...answer.readings.map((r) => r.spread.n));
  return (
    <div data-testid="design-in-answer">
      <h3 className="mb-2 text-base font-semibold">
        At <span className="figure">{quantityText(answer.query.driveDbm, "dBm")}</span>,{" "}
        <span className="figure">{quantityText(answer.query.frequencyHz, "Hz")}</span>
        {answer.temperatureC !== null ? (
          <>
            , <NumberQuantity value={answer.temperatureC} unit="°C" digits={{ maxDecimals: 1 }} />
          </>
        ) : null}
      </h3>
      <ScrollTable label="Design-in reading" testId="design-in-table">
        <thead>
          <tr>
            <th scope="col">Figure</th>
            <th scope="col" className="num">
              Typical
            </th>
            <th scope="col" className="num">
              Spread, s (n − 1)
            </th>
            <th scope="col" className="num">
              Lowest – highest of {n} units
            </th>
            <th scope="col">The sheet&apos;s limits at these conditions</th>
          </tr>
        </thead>
        <tbody>
          {answer.readings.map((r) => (
            <ReadingRow key={r.id} reading={r} />
          ))}
        </tbody>
      </ScrollTable>
      <div className="mt-4 max-w-prose space-y-2 text-[0.9375rem]" data-testid="design-in-method">
        <p>
          <span className="running-head mr-2 !text-ink">Method</span>
          {answer.method}
        </p>
        <p>
          <span className="running-head mr-2 !text-ink">Uncertainty</span>
          {answer.uncertainty}
        </p>
      </div>
      {charts.length ? (
        <div className="mt-6 grid gap-6 xl:grid-cols-2">
          {charts.map((chart) => (
            <figure key={chart.id} className="min-w-0" data-testid={`design-in-chart-${chart.id}`}>
              {chartSvgs[chart.id] ? (
                <div
                  role="img"
                  aria-label={chart.description}
                  className="[&>svg]:h-auto [&>svg]:max-w-full"
                  // Our own SVG, drawn on the server by Vega from a spec built in lib/charts.
                  dangerouslySetInnerHTML={{ __html: chartSvgs[chart.id] }}
                />
              ) : (
                <p className="text-sm text-ink-muted">{chart.description}</p>
              )}
              <figcaption className="mt-1 text-sm text-ink-muted">{chart.title}: the open circle is your design on the typical curve.</figcaption>
            </figure>
          ))}
        </div>
      ) : null}
    </div>
  );
}

function ReadingRow({ reading }: { reading: DesignInReading }) {
  const { spread, unit } = reading;
  return (
    <tr data-testid={`design-in-row-${reading.id}`}>
      <th scope="row" className="font-normal">
        {reading.label}
      </th>
      <td className="num font-semibold">
        <NumberQuantity value={reading.typical} unit={unit} digits={FIGURE_DIGITS} />
      </td>
      <td className="num">{spread.standardDeviation === null ? "one unit" : <NumberQuantity value={spread.standardDeviation} unit={unit} digits={FIGURE_DIGITS} />}</td>
      <td className="num">
        <span className="figure whitespace-nowrap">{formatRange(spread.min, spread.max, unit, { digits: FIGURE_DIGITS })}</span>
      </td>
      <td>
        {reading.limits.length ? (
          <ul className="space-y-1">
            {reading.limits.map((limit) => (
              <LimitLine key={limit.rowId} limit={limit} />
            ))}
          </ul>
        ) : (
          <span className="text-ink-muted">none stated at these conditions</span>
        )}
      </td>
    </tr>
  );
}

function LimitLine({ limit }: { limit: DesignInLimit }) {
  const parts = [
    limit.minText ? ["min", limit.minText] : null,
    limit.typText ? ["typ", limit.typText] : null,
    limit.maxText ? ["max", limit.maxText] : null,
  ].filter((p): p is [string, string] => p !== null);
  return (
    <li>
      {parts.map(([word, text], i) => (
        <span key={word}>
          {i > 0 ? ", " : ""}
          {word} <Quantity value={text} unit={limit.unit} />
        </span>
      ))}{" "}
      <abbr title={limit.basisText} className="no-underline">
        ({limit.basisMark})
      </abbr>
      <span className="block text-sm text-ink-muted">
        {limit.label}; <Notation text={limit.conditionsText} />
        {limit.driveDiffers ? ". Stated at that drive, not at yours." : ""}
      </span>
    </li>
  );
}

