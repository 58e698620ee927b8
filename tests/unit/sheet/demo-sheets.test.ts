import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
import { buildSheetModel, serializeSheetModel } from "@/lib/sheet";
import { demoSheetInputs } from "./demo-inputs";

/**
 * A reviewed record of every demo device's sheet model: a change in a parser, a derivation, a
 * statistic, a template or the demo data shows up here as a snapshot diff, to be read and
 * accepted on purpose (`npx vitest run --project unit -u`, then review the diff in git).
 * The revision date is fixed; the demo measurement dates are stated in the demo data.
 */
describe("demo sheets", () => {
  for (const { partNumber, input } of demoSheetInputs("2026-12-01")) {
    it(`${partNumber} builds the recorded sheet model`, async () => {
      const json = JSON.stringify(JSON.parse(serializeSheetModel(buildSheetModel(input))), null, 1);
      await expect(`${json}\n`).toMatchFileSnapshot(`./__snapshots__/demo-${partNumber}.json`);
    });
  }
});
