import { expect, test, type Page } from "@playwright/test";
import { expectAccessible } from "./helpers";

// The design-in calculator on the released sheet page, as a signed-out customer uses it: the demo
// releases KDX-2G4 (a doubler) as B and KM-7H (a mixer) as A before the tests (scripts/seed-demo-releases.ts).
// BENCHFOLD_E2E_SCREENS=<dir> saves a screenshot of each state.

const screens = process.env.BENCHFOLD_E2E_SCREENS;

async function screenshot(page: Page, name: string): Promise<void> {
  if (screens) await page.getByTestId("design-in").screenshot({ path: `${screens}/design-in-${name}.png` });
}

test("reads the doubler's curves at the customer's drive and frequency; the query stays in the address", async ({ page }) => {
  test.setTimeout(120_000);
  await page.goto("/datasheets/kestrine/KDX-2G4/B");
  const calculator = page.getByTestId("design-in");
  await expect(calculator.getByTestId("design-in-range")).toContainText("1\u00a0GHz only");
  // The frequency the curves hold is filled in; the drive is the customer's to type.
  await expect(calculator.getByLabel("Input frequency")).toHaveValue("1 GHz");
  await screenshot(page, "empty");
  const form = calculator.getByRole("form", { name: "Design point" });
  await form.getByLabel("Drive level, per port").fill("+10 dBm");
  await form.getByLabel("Input frequency").fill("1000 MHz");
  await form.getByRole("button", { name: "Read the curves" }).click();

  await expect(page).toHaveURL(/#design-in$/);
  const url = new URL(page.url());
  expect(url.searchParams.get("drive")).toBe("+10 dBm");
  expect(url.searchParams.get("frequency")).toBe("1000 MHz");

  const answer = page.getByTestId("design-in-answer");
  const loss = answer.getByTestId("design-in-row-conversion-loss");
  // NumPy reads B's typical curve at 9.5702 dB there (tests/unit/sheet/reference/design-in-numpy.json, released).
  await expect(loss).toContainText("9.57\u00a0dB");
  await expect(loss).toContainText("max 11\u00a0dB");
  await expect(loss).toContainText("max 11.5\u00a0dB (C)Conversion loss over temperature");
  await expect(answer.getByTestId("design-in-row-harmonic-suppression:fundamental (×1)")).toContainText("Fundamental suppression");
  await expect(answer.getByTestId("design-in-method")).toContainText("linear in dB against per-port drive in dBm");
  // The point on the curve: the chart is drawn on the server and marks the design.
  const chart = answer.getByTestId("design-in-chart-conversion-loss-vs-drive").getByRole("img", { name: /^Conversion loss at your design/ });
  await expect(chart).toHaveAttribute("aria-label", /Conversion loss 9\.57\u00a0dB at \+10\u00a0dBm, marked by an open circle/);
  await expect(chart.locator("svg")).toBeVisible();
  await expect(chart).toContainText("your design");
  await expect(form.getByLabel("Drive level, per port")).toHaveValue("+10 dBm");
  await screenshot(page, "doubler");
  await expectAccessible(page, "an answered design point");
});

test("refuses to extrapolate and names the range; unreadable input is named by field", async ({ page }) => {
  test.setTimeout(120_000);
  await page.goto("/datasheets/kestrine/KDX-2G4/B?drive=%2B20%20dBm&frequency=1%20GHz");
  await expect(page.getByTestId("design-in-refusal").getByRole("alert")).toContainText("−9.01\u00a0dBm to +15.99\u00a0dBm; the calculator does not extrapolate");
  const drive = page.getByLabel("Drive level, per port");
  await expect(drive).toHaveAttribute("aria-invalid", "true");
  await expect(drive).toHaveAccessibleDescription(/outside the measured range/);
  await screenshot(page, "refused");
  await expectAccessible(page, "a refused design point");

  await page.goto("/datasheets/kestrine/KDX-2G4/B?drive=ten&frequency=1%20furlong");
  const issues = page.getByTestId("design-in-issues").getByRole("alert");
  await expect(issues).toHaveCount(2);
  await expect(issues.nth(1)).toContainText('Input frequency: unknown unit "furlong"');
  await expectAccessible(page, "unreadable input");
});

test("reads the mixer along RF frequency at its LO drive", async ({ page }) => {
  test.setTimeout(120_000);
  await page.goto("/datasheets/kestrine/KM-7H/current?drive=%2B7&frequency=1.55%20GHz#design-in");
  const answer = page.getByTestId("design-in-answer");
  await expect(answer.getByTestId("design-in-row-conversion-loss")).toContainText("max 8.5\u00a0dB");
  await expect(answer.getByTestId("design-in-row-isolation:LO-RF")).toContainText("Isolation LO–RF");
  await expect(answer.getByTestId("design-in-chart-isolation-vs-frequency").locator("svg")).toBeVisible();
  await screenshot(page, "mixer");
  await expectAccessible(page, "the mixer's design point");
});
