import { writeFileSync } from "node:fs";
import path from "node:path";
import { THEME_CSS_PATH, themeCss } from "../lib/design/theme-css";

/** Writes app/theme.css from lib/design/tokens.ts (npm run tokens). */
const file = path.resolve(__dirname, "..", THEME_CSS_PATH);
writeFileSync(file, themeCss());
process.stdout.write(`wrote ${THEME_CSS_PATH}\n`);
