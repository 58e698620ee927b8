import { expect as baseExpect, test } from "@playwright/test";
import { signInAs } from "./helpers";

test.describe.configure({ timeout: 120_000 });
const expect = baseExpect.configure({ timeout: 30_000 });

function tag(): string {
  return `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();
}

test("an administrator lists an instrument with its stated uncertainty, and an overdue one is marked", async ({ page }) => {
  await signInAs(page, "admin");
  await page.goto("/admin/instruments");
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Instruments");

  const serial = `SA-${tag()}`;
  const form = page.getByTestId("instrument-form");
  await form.getByLabel("Kind").fill("Spectrum analyzer");
  await form.getByLabel("Model").fill("Tessaly SX-26");
  await form.getByLabel("Serial").fill(serial);
  await form.getByLabel("Calibrated on").fill("2024-01-10");
  await form.getByLabel("Calibration due").fill("2025-01-10");
  await form.getByRole("button", { name: "Add an uncertainty row" }).click();
  await form.getByLabel("Quantity", { exact: true }).fill("absolute power");
  await form.getByLabel("± value").fill("0.35");
  await form.getByRole("button", { name: "Add instrument" }).click();

  const row = page.getByTestId(`instrument-${serial}`);
  await expect(row).toContainText("Tessaly SX-26");
  await expect(row).toContainText("2025-01-10");
  await expect(row).toContainText("overdue");
  await expect(row).toContainText("absolute power ±0.35\u00a0dB (k = 2)");

  // Edit: a new calibration moves the due date forward and the mark goes away.
  await row.getByRole("button", { name: /Edit/ }).click();
  await form.getByLabel("Calibrated on").fill("2026-10-01");
  await form.getByLabel("Calibration due").fill("2099-10-01");
  await form.getByRole("button", { name: "Save changes" }).click();
  await expect(row).toContainText("2099-10-01");
  await expect(row).not.toContainText("overdue");
});

test("other roles are refused the instrument and bench-token pages", async ({ page }) => {
  await signInAs(page, "engineer");
  for (const path of ["/admin/instruments", "/admin/bench-tokens"]) {
    await page.goto(path);
    await expect(page.getByTestId("forbidden")).toBeVisible();
  }
});
