import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { expectAccessible } from "./helpers";

// Compare as a signed-out visitor does it: tick sheets in the catalog, read the aligned figures and
// the overlaid curves, download the CSV; and the words for a selection that cannot be compared.
// The demo releases KQH-2G (Kestrine) and PS-2W (Pellacourt) as A (scripts/seed-demo-releases.ts).

const screensDir = process.env.BENCHFOLD_E2E_SCREENS;

async function screenshot(page: Page, name: string): Promise<void> {
  if (!screensDir) return;
  await page.screenshot({ path: path.join(screensDir, `${name}.png`), fullPage: true });
}

test("ticks two hybrids in the catalog and compares them: aligned figures, the better value, the mismatch, the curves, the CSV", async ({ page }) => {
  await page.goto("/catalog?class=quadrature-hybrid");
  const results = page.getByTestId("catalog-results");
  await results.getByRole("checkbox", { name: "Compare KQH-2G Rev. A" }).check();
  await results.getByRole("checkbox", { name: "Compare PS-2W Rev. A" }).check();
  await screenshot(page, "compare-catalog-ticked");
  await page.getByRole("button", { name: "Compare selected" }).click();

  // The selection lives in the address, as the catalog's plain form sent it.
  await expect(page).toHaveURL(/\/compare\?/);
  expect(new URL(page.url()).searchParams.getAll("sheets").sort()).toEqual(["kestrine/KQH-2G/A", "pellacourt/PS-2W/A"]);
  await expect(page.getByRole("heading", { name: "Compare released sheets" })).toBeVisible();
  const sheets = page.getByTestId("compare-sheet");
  await expect(sheets).toHaveCount(2);

  const table = page.getByTestId("compare-table");
  const ilLine = table.getByRole("row").filter({ hasText: "Insertion loss, port 1 to 2 (S21)" }).filter({ hasText: "Typ" });
  await expect(ilLine).toContainText("Conditions differ: band");
  // The better value carries a mark and a word for screen readers, never colour alone.
  const kqhColumn = await table.getByRole("columnheader").allTextContents();
  const kqhIndex = kqhColumn.findIndex((t) => t.includes("KQH-2G Rev. A"));
  const better = ilLine.getByTestId("compare-cell").nth(kqhIndex - 3);
  await expect(better).toHaveAttribute("data-better", "true");
  await expect(better).toContainText("✓");
  await expect(better).toContainText("Better:");
  await expect(better).toContainText("Band 1.7–2.3");

  const curves = page.getByTestId("compare-curves");
  await expect(curves.getByTestId("compare-chart").first()).toBeVisible();
  await expect(curves.getByTestId("compare-panel").first().locator("svg")).toBeVisible();
  await expect(curves.getByTestId("compare-chart-mismatch").first()).toContainText("Drawn under different conditions");
  await screenshot(page, "compare-page");

  const downloading = page.waitForEvent("download");
  await page.getByTestId("compare-csv").click();
  const download = await downloading;
  expect(download.suggestedFilename()).toMatch(/KQH-2G-A.*PS-2W-A.*-compare\.csv|PS-2W-A.*KQH-2G-A.*-compare\.csv/);
  const csv = readFileSync((await download.path())!, "utf8").replace(/^\uFEFF/, "");
  expect(csv.split("\r\n")[0]).toContain("KQH-2G Rev. A");
  expect(csv).toContain("Insertion loss, port 1 to 2 (S21)");
});

test("a selection of one sheet, of five, or of an unknown sheet is said in words, with the way back to the catalog", async ({ page }) => {
  await page.goto("/catalog?class=quadrature-hybrid");
  await page.getByTestId("catalog-results").getByRole("checkbox", { name: "Compare KQH-2G Rev. A" }).check();
  await page.getByRole("button", { name: "Compare selected" }).click();
  await expect(page.getByTestId("compare-issues").getByRole("alert")).toContainText("only one was given");
  await expect(page.getByTestId("compare-empty").getByRole("link", { name: "catalog" })).toHaveAttribute("href", "/catalog");

  await page.goto(`/compare?sheets=${Array.from({ length: 5 }, (_, i) => `kestrine/P-${i}/A`).join(",")}`);
  await expect(page.getByTestId("compare-issues").getByRole("alert")).toContainText("At most 4 sheets can be compared at once; 5 were given");

  await page.goto("/compare?sheets=kestrine/KQH-2G/A,kestrine/NO-SUCH/B");
  await expect(page.getByTestId("compare-issues").getByRole("alert")).toContainText("No released sheet at kestrine/NO-SUCH/B");
  await screenshot(page, "compare-unknown");
});

test("is accessible: a comparison with its table and curves, and a refused selection", async ({ page }) => {
  await page.goto("/compare?sheets=kestrine/KQH-2G/A,pellacourt/PS-2W/A,kestrine/KDX-2G4/B");
  await expect(page.getByTestId("compare-table")).toBeVisible();
  await expectAccessible(page, "a comparison of three sheets");
  await page.goto("/compare?sheets=kestrine/KQH-2G/A");
  await expect(page.getByTestId("compare-issues")).toBeVisible();
  await expectAccessible(page, "a refused selection");
});
