import { LOGO_PATHS } from "./logo";
import { tokens as designTokens } from "./tokens";

/** The shape of the tokens, without their literal values (a test feeds in a changed colour). */
export type ThemeSource = {
  colors: Readonly<Record<string, string>>;
  fonts: { readonly sans: string; readonly mono: string };
  radius: string;
  containers: Readonly<Record<string, string>>;
};

/** The paths, from the repository root, of the generated theme globals.css imports and of the favicon. */
export const THEME_CSS_PATH = "app/theme.css";
export const ICON_SVG_PATH = "app/icon.svg";

/**
 * The `@theme` block Tailwind 4 builds its utilities and CSS variables from, written out of the
 * design tokens (`npm run tokens`). Tailwind's `@config` would read the tokens as a JavaScript
 * config, but it inlines the values into utilities and emits no `--color-*` variables, which the
 * stylesheet and the SVG logo use; so the block is generated instead.
 */
export function themeCss(tokens: ThemeSource = designTokens): string {
  const lines = [
    "/* Generated from lib/design/tokens.ts by `npm run tokens`; do not edit (a unit test compares the two). */",
    "@theme {",
    ...Object.entries(tokens.colors).map(([name, value]) => `  --color-${name}: ${value.toLowerCase()};`),
    "",
    `  --radius: ${tokens.radius};`,
    ...Object.entries(tokens.containers).map(([name, value]) => `  --container-${name}: ${value};`),
    "}",
    "",
    "/* The font files are wired by next/font/local in app/layout.tsx as --font-text / --font-figures. */",
    "@theme inline {",
    `  --font-sans: var(--font-text), "${tokens.fonts.sans}", ui-sans-serif, system-ui, sans-serif;`,
    `  --font-mono: var(--font-figures), "${tokens.fonts.mono}", ui-monospace, monospace;`,
    "}",
  ];
  return `${lines.join("\n")}\n`;
}

/** The favicon: the mark in the token colours (a favicon cannot read the page's CSS variables). */
export function iconSvg(tokens: ThemeSource = designTokens): string {
  const c = tokens.colors;
  return [
    '<svg xmlns="http://www.w3.org/2000/svg" width="32" height="32" viewBox="0 0 32 32" fill="none">',
    `  <path d="${LOGO_PATHS.sheet}" fill="${c["paper-bright"]}" stroke="${c.ink}" stroke-width="2" stroke-linejoin="round"/>`,
    `  <path d="${LOGO_PATHS.fold}" stroke="${c.ink}" stroke-width="2" stroke-linejoin="round"/>`,
    `  <path d="${LOGO_PATHS.fundamental}" stroke="${c.ink}" stroke-width="2" stroke-linecap="round"/>`,
    `  <path d="${LOGO_PATHS.octave}" stroke="${c.signal}" stroke-width="2" stroke-linecap="round"/>`,
    "</svg>",
    "",
  ].join("\n");
}
