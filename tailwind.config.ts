/**
 * Benchfold's design tokens, documented in one place.
 *
 * Tailwind 4 reads its theme from CSS: the live copy of these values is the
 * `@theme` block in app/globals.css, which mirrors this object name for name
 * (colour `paper` → `--color-paper` → `bg-paper`). We do not load this file with
 * `@config`: two sources feeding the theme would drift silently. Change a value
 * here and in globals.css together; server-side renderers (PDF, charts) can
 * import `tokens` so the printed sheet and the web page share one palette.
 *
 * Contrast (WCAG 2.x, checked against paper #FAF7F0 and paper-deep #F2EDE2):
 * ink 16.2 / 14.9, ink-muted 5.2 / 4.7, signal 5.7 / 5.2, white on signal 6.1,
 * rule-strong 3.5 (non-text UI boundary, ≥ 3 required).
 */
export const tokens = {
  colors: {
    paper: "#FAF7F0", // warm paper-white ground
    "paper-deep": "#F2EDE2", // table heads, quiet panels
    "paper-bright": "#FFFDF8", // form fields, lifted from the page
    ink: "#1C1A17", // body text
    "ink-muted": "#6E685E", // captions, units, secondary text
    rule: "#D6CEBE", // hairlines
    "rule-strong": "#8C8273", // input borders, booktabs top rule
    signal: "#B3361C", // the one accent: signal vermilion, for actions and states
    "signal-deep": "#9A2C17", // hover / pressed
    "signal-wash": "#F6E4DC", // faint ground behind a signal message
  },
  fonts: {
    sans: "Source Sans 3", // text, via next/font/local (--font-text)
    mono: "Source Code Pro", // every figure, via next/font/local (--font-figures)
  },
  radius: { DEFAULT: "2px" },
  measure: { prose: "68ch", page: "76rem" },
} as const;

export type Tokens = typeof tokens;

export default {
  theme: {
    extend: {
      colors: tokens.colors,
      fontFamily: { sans: [tokens.fonts.sans], mono: [tokens.fonts.mono] },
      borderRadius: tokens.radius,
      maxWidth: tokens.measure,
    },
  },
};
