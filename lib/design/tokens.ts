/**
 * Benchfold's design tokens: the one source for the page (Tailwind's theme), the charts and the PDF.
 *
 * Tailwind 4 reads its theme from CSS, so `app/theme.css` (the `@theme` block) is generated from this
 * object by `npm run tokens` (lib/design/theme-css.ts); tests/unit/design/tokens.test.ts fails when the
 * file and this object disagree. Colour `paper` → `--color-paper` → `bg-paper`. The chart palette
 * (lib/charts/styles.ts) and the PDF (lib/server/pdf/pdf-parts.tsx) import `tokens` directly.
 *
 * Contrast (WCAG 2.x, checked against paper #FAF7F0 and paper-deep #F2EDE2):
 * ink 16.2 / 14.9, ink-muted 5.2 / 4.7, signal 5.7 / 5.2, white on signal 6.1,
 * rule-strong 3.5 (non-text UI boundary, ≥ 3 required). The trace colours are for chart lines
 * (graphics, ≥ 3 required against paper-bright): slate 5.4, umber 6.1, pine 7.4 (checked by tests/unit/design/tokens.test.ts).
 */
export const tokens = {
  colors: {
    paper: "#FAF7F0", // warm paper-white ground
    "paper-deep": "#F2EDE2", // table heads, quiet panels
    "paper-bright": "#FFFDF8", // form fields, lifted from the page; chart ground
    ink: "#1C1A17", // body text
    "ink-muted": "#6E685E", // captions, units, secondary text
    rule: "#D6CEBE", // hairlines
    "rule-strong": "#8C8273", // input borders, booktabs top rule
    signal: "#B3361C", // the one accent: signal vermilion, for actions and states
    "signal-deep": "#9A2C17", // hover / pressed
    "signal-wash": "#F6E4DC", // faint ground behind a signal message
    "trace-slate": "#5B6B7A", // chart traces beyond ink and signal
    "trace-umber": "#7A5B2E",
    "trace-pine": "#2F5D50",
  },
  fonts: {
    sans: "Source Sans 3", // text, via next/font/local (--font-text)
    mono: "Source Code Pro", // every figure, via next/font/local (--font-figures)
  },
  radius: "2px",
  containers: { prose: "68ch", page: "76rem" },
} as const;

export type Tokens = typeof tokens;
export type ColorToken = keyof Tokens["colors"];
