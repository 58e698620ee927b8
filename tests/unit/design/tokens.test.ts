import { readFileSync } from "node:fs";
import path from "node:path";
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { ICON_SVG_PATH, iconSvg, THEME_CSS_PATH, themeCss } from "@/lib/design/theme-css";
import { tokens } from "@/lib/design/tokens";

const ROOT = path.resolve(__dirname, "../../..");
const read = (file: string) => readFileSync(path.join(ROOT, file), "utf8");

/** Files git tracks under the given folders with the given endings. */
function trackedFiles(folders: string[], pattern: RegExp): string[] {
  return execFileSync("git", ["ls-files", ...folders], { cwd: ROOT, encoding: "utf8" })
    .split("\n")
    .filter((f) => pattern.test(f));
}

// WCAG 2.x contrast ratio from relative luminance (https://www.w3.org/TR/WCAG22/#dfn-relative-luminance).
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

describe("design tokens have one source", () => {
  it("app/theme.css is what lib/design/tokens.ts generates (run `npm run tokens` after changing a token)", () => {
    expect(read(THEME_CSS_PATH)).toBe(themeCss());
  });

  it("app/icon.svg, the favicon, is the mark in the token colours", () => {
    expect(read(ICON_SVG_PATH)).toBe(iconSvg());
  });

  it("the generator writes every token, so a changed colour reaches the page", () => {
    const changed = themeCss({ ...tokens, colors: { ...tokens.colors, signal: "#123456" } });
    expect(changed).toContain("--color-signal: #123456;");
    expect(changed).not.toContain(tokens.colors.signal.toLowerCase());
  });

  it("globals.css defines no theme of its own and imports the generated one", () => {
    const globals = read("app/globals.css");
    expect(globals).toContain('@import "./theme.css";');
    expect(globals).not.toMatch(/@theme/);
    expect(globals).not.toMatch(/--color-[\w-]+\s*:/);
  });

  it("every colour variable the stylesheets and components use is a token", () => {
    const names = new Set(Object.keys(tokens.colors));
    const files = trackedFiles(["app", "components"], /\.(css|tsx?)$/).filter((f) => f !== THEME_CSS_PATH);
    const used = files.flatMap((f) => [...read(f).matchAll(/var\(--color-([\w-]+)/g)].map((m) => `${m[1]} (${f})`));
    expect(used.length).toBeGreaterThan(10);
    expect(used.filter((u) => !names.has(u.split(" ")[0]))).toEqual([]);
  });

  it("no colour is written out by hand in the page, the charts or the PDF", () => {
    const generated = [THEME_CSS_PATH, ICON_SVG_PATH, "lib/design/tokens.ts"];
    const files = trackedFiles(["app", "components", "lib"], /\.(css|svg|tsx?)$/).filter((f) => !generated.includes(f));
    // The printed page's white (PDF page, print stylesheet, raster background) is the paper it is printed on, not a theme colour.
    const hand = files.flatMap((f) => [...read(f).matchAll(/#[0-9a-fA-F]{6}\b|#[0-9a-fA-F]{3}\b(?![\w-])/g)].map((m) => `${m[0]} in ${f}`));
    expect(hand.filter((h) => !/^#(fff|ffffff) in /i.test(h))).toEqual([]);
  });

  it("chart traces stand out from the chart ground (WCAG 2.x 1.4.11: 3:1 for graphics)", () => {
    expect(contrast("#000000", "#FFFFFF")).toBeCloseTo(21, 5); // the scale's end point, WCAG 2.x
    for (const name of ["ink", "signal", "ink-muted", "trace-slate", "trace-umber", "trace-pine"] as const) {
      expect(contrast(tokens.colors[name], tokens.colors["paper-bright"]), name).toBeGreaterThanOrEqual(3);
    }
  });
});
