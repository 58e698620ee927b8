import type { FlagCode, StatisticsFlag } from "@/lib/sheet/types";

/** Short names of the statistics flags; the model's message says the rest. */
export const flagWords: Record<FlagCode, string> = {
  "cpk-below-threshold": "Cpk below threshold",
  "unit-outside-acceptance": "Unit outside the guard-banded limit",
  "insufficient-data": "Too few units",
  "limit-without-data": "Limit without data",
  "limit-unit-mismatch": "Unit of the limit does not match",
  "guard-band-closes-acceptance": "Guard band closes the acceptance zone",
};

/** A group's flags in words, each marked "!" so colour is never the only sign. */
export function FlagList({ flags, emptyText, compact }: { flags: StatisticsFlag[]; emptyText?: string; compact?: boolean }) {
  if (flags.length === 0) return emptyText ? <p className="text-sm text-ink-muted">{emptyText}</p> : null;
  return (
    <ul className={`space-y-1 ${compact ? "text-sm" : "text-[0.9375rem]"}`} data-testid="flag-list">
      {flags.map((flag, i) => (
        <li key={`${flag.code}-${i}`} className="border-l-2 border-signal pl-2">
          <span className="font-semibold text-signal-deep">! {flagWords[flag.code] ?? flag.code}.</span> {flag.message}
        </li>
      ))}
    </ul>
  );
}
