/** Class strings rather than a component, so links and buttons share the look. */
const base =
  "inline-flex items-center justify-center gap-2 rounded px-4 py-2 text-[0.9375rem] font-semibold no-underline transition-colors disabled:cursor-not-allowed disabled:opacity-60";

export const buttonClass = {
  primary: `${base} bg-signal text-paper hover:bg-signal-deep`,
  secondary: `${base} border border-ink text-ink hover:border-signal hover:text-signal-deep`,
  quiet: "rounded px-1 text-[0.9375rem] underline decoration-rule-strong underline-offset-4 hover:decoration-signal disabled:opacity-60",
} as const;
