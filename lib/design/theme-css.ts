import { tokens as designTokens } from "./tokens";

/** The shape of the tokens, without their literal values (a test feeds in a changed colour). */
export type ThemeSource = {
  colors: Readonly<Record<string, string>>;
  fonts: { readonly sans: string; readonly mono: string };
  radius: string;
  containers: Readonly<Record<string, string>>;
};

/** The path, from the repository root, of the generated file globals.css imports. */
export const THEME_CSS_PATH = "app/theme.css";

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
