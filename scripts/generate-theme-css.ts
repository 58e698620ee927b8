import { writeFileSync } from "node:fs";
import path from "node:path";
import { ICON_SVG_PATH, iconSvg, THEME_CSS_PATH, themeCss } from "../lib/design/theme-css";

/** Writes app/theme.css and app/icon.svg from lib/design/tokens.ts (npm run tokens). */
for (const [file, text] of [
  [THEME_CSS_PATH, themeCss()],
  [ICON_SVG_PATH, iconSvg()],
] as const) {
  writeFileSync(path.resolve(__dirname, "..", file), text);
  process.stdout.write(`wrote ${file}\n`);
}
