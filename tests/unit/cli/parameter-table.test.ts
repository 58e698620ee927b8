import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { deriveParameters, formatParameterTable } from "@/lib/analysis";
import { parseMeasurementFile } from "@/lib/ingest";

const ROOT = path.resolve(__dirname, "../../..");
const EXAMPLES = readdirSync(path.join(ROOT, "fixtures/examples")).sort();

// The CLI's table, recorded: it goes through lib/format like every page, and its digits must not
// move when the formatter changes (rerun with -u only for a change in the engine's values).
describe("the CLI table of every example", () => {
  it.each(EXAMPLES)("%s", async (name) => {
    const parsed = parseMeasurementFile({ fileName: name, bytes: readFileSync(path.join(ROOT, "fixtures/examples", name)) });
    const result = deriveParameters(parsed);
    const text = [formatParameterTable(result.parameters), "", ...result.warnings].join("\n");
    await expect(text).toMatchFileSnapshot(`__snapshots__/${name}.txt`);
  });
});
