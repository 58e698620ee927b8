// Adds up the runners' JSON reports into one closing line: "tests: N passed, N failed, N skipped".
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const dir = process.argv[2];
// --partial: a run of chosen steps (scripts/test.sh, TEST_* variables); a step that did not run is no failure.
const partial = process.argv.includes("--partial");
let passed = 0, failed = 0, skipped = 0;
const rows = [];
for (const name of ["unit", "integration"]) {
  const file = path.join(dir, `${name}.json`);
  if (!existsSync(file)) { rows.push(`${name}: no report`); if (!partial) failed += 1; continue; }
  const r = JSON.parse(readFileSync(file, "utf8"));
  passed += r.numPassedTests; failed += r.numFailedTests; skipped += r.numPendingTests + (r.numTodoTests ?? 0);
  rows.push(`${name}: ${r.numPassedTests} passed, ${r.numFailedTests} failed`);
}
const e2e = path.join(dir, "e2e.json");
if (existsSync(e2e)) {
  const s = JSON.parse(readFileSync(e2e, "utf8")).stats;
  passed += s.expected; failed += s.unexpected + s.flaky; skipped += s.skipped;
  rows.push(`browser: ${s.expected} passed, ${s.unexpected + s.flaky} failed`);
} else { rows.push("browser: no report"); if (!partial) failed += 1; }
console.log(rows.join(" · "));
console.log(`tests: ${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
