import { limitBases, limitBasisWords, type LimitBasis } from "@/lib/domain/sheets";
import type { StatisticsGroup } from "@/lib/sheet/types";
import { selectClass } from "@/components/ui/field";
import { Notation } from "@/components/sheet/notation";
import { FlagList } from "./flag-list";
import type { EditorRow, LimitDraft } from "./spec-limits-state";

const basisOptions = limitBases.map((value) => ({ value, label: limitBasisWords[value].choice }));

type SpecLimitRowProps = {
  row: EditorRow;
  heading: string | null;
  draft: LimitDraft;
  dirty: boolean;
  errors: string[] | undefined;
  cpkThreshold: number;
  onChange: (patch: Partial<LimitDraft>) => void;
};

/** One line of the limits editor: its conditions, the limits typed for them, and the statistics that judge them. */
export function SpecLimitRow({ row, heading, draft, dirty, errors, cpkThreshold, onChange }: SpecLimitRowProps) {
  const g = row.group;
  return (
    <li className="list-none" data-testid="limit-row" data-key={row.key}>
      {heading ? <h3 className="running-head mt-6 border-b border-ink pb-1 text-ink">{heading}</h3> : null}
      <div
        className={`grid gap-x-6 gap-y-3 border-b border-rule py-3 lg:grid-cols-[minmax(11rem,1fr)_minmax(26rem,2.2fr)_minmax(15rem,1.4fr)] ${errors ? "bg-signal-wash/50" : ""}`}
      >
        <div>
          <p className="font-semibold">{row.conditionsText ? <Notation text={row.conditionsText} /> : "No conditions"}</p>
          <p className="text-sm text-ink-muted">
            in <span className="unit">{row.unit}</span>
            {dirty ? <span className="ml-2 font-semibold text-ink">· changed, not saved</span> : null}
          </p>
        </div>
        <LimitFields row={row} draft={draft} errors={errors} onChange={onChange} />
        <div className="text-sm">
          {g ? <GroupFigures group={g} cpkThreshold={cpkThreshold} /> : <p className="text-ink-muted">No approved data under these conditions.</p>}
          {g ? (
            <div className="mt-2">
              <FlagList flags={g.flags} compact />
              {dirty && g.flags.length > 0 ? <p className="mt-1 text-ink-muted">Flags are for the saved limits; save to re-check.</p> : null}
            </div>
          ) : null}
        </div>
      </div>
    </li>
  );
}

function LimitFields({ row, draft: d, errors, onChange }: Pick<SpecLimitRowProps, "row" | "draft" | "errors" | "onChange">) {
  const name = `${row.label}, ${row.conditionsText}`;
  return (
    <fieldset className="grid grid-cols-3 gap-2 sm:grid-cols-[repeat(3,minmax(5rem,1fr))_minmax(11rem,1.6fr)]">
      <legend className="sr-only">Limits for {name}</legend>
      {(["min", "typ", "max"] as const).map((which) => (
        <label key={which} className="block text-sm">
          <span className="font-semibold capitalize">{which}</span> <span className="unit">{row.unit}</span>
          <input
            type="text"
            inputMode="decimal"
            value={d[which]}
            onChange={(e) => onChange({ [which]: e.target.value })}
            aria-label={`${which} ${row.unit}, ${name}`}
            aria-invalid={errors ? true : undefined}
            className={`${selectClass} figure mt-0.5 px-2 py-1 text-right aria-[invalid=true]:border-signal`}
            autoComplete="off"
          />
        </label>
      ))}
      <label className="col-span-3 block text-sm sm:col-span-1">
        <span className="font-semibold">Basis</span>
        <select
          value={d.basis}
          onChange={(e) => onChange({ basis: e.target.value as LimitBasis })}
          aria-label={`Basis, ${name}`}
          className={`${selectClass} mt-0.5 px-2 py-1 text-sm`}
        >
          {basisOptions.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </label>
      <label className="col-span-3 block text-sm sm:col-span-4">
        <span className="font-semibold">Footnote</span> <span className="text-ink-muted">(optional)</span>
        <input
          type="text"
          value={d.footnote}
          maxLength={500}
          onChange={(e) => onChange({ footnote: e.target.value })}
          aria-label={`Footnote, ${name}`}
          className={`${selectClass} mt-0.5 px-2 py-1 text-sm`}
        />
      </label>
      {errors ? (
        <ul className="col-span-full text-sm text-signal-deep" role="alert">
          {errors.map((e) => (
            <li key={e}>{e}</li>
          ))}
        </ul>
      ) : null}
    </fieldset>
  );
}

function GroupFigures({ group: g, cpkThreshold }: { group: StatisticsGroup; cpkThreshold: number }) {
  const cpkLow = g.cpk.value !== null && g.cpk.value < cpkThreshold;
  const item = (label: string, text: string) => (
    <div className="flex justify-between gap-2">
      <dt className="text-ink-muted">{label}</dt>
      <dd className="figure">{text || "—"}</dd>
    </div>
  );
  return (
    <dl className="grid grid-cols-2 gap-x-5 gap-y-0.5" data-testid="limit-statistics">
      {item("n", String(g.n))}
      {item("mean", g.mean.text)}
      {item("s", g.standardDeviation.text)}
      {item("min", g.min.text)}
      {item("max", g.max.text)}
      {item("tol. low", g.toleranceInterval?.lower.text ?? "")}
      {item("tol. high", g.toleranceInterval?.upper.text ?? "")}
      <div className="flex justify-between gap-2">
        <dt className="text-ink-muted">Cpk</dt>
        <dd className={`figure ${cpkLow ? "font-semibold text-signal-deep" : ""}`}>{g.cpk.text || "—"}</dd>
      </div>
    </dl>
  );
}
