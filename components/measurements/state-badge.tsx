import { measurementSetStateLabels, type MeasurementSetState } from "@/lib/domain/measurements";

const marks: Record<MeasurementSetState, string> = { submitted: "○", approved: "●", rejected: "×" };

/** A set's state in words, with a mark and a rule; colour only adds to what the word says. */
export function StateBadge({ state }: { state: MeasurementSetState }) {
  const tone =
    state === "approved"
      ? "border-ink text-ink"
      : state === "rejected"
        ? "border-signal text-signal-deep"
        : "border-rule-strong text-ink-muted";
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded border px-1.5 py-px text-[0.8125rem] font-semibold ${tone}`} data-state={state}>
      <span aria-hidden="true">{marks[state]}</span>
      {measurementSetStateLabels[state]}
    </span>
  );
}
