import { readFileSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { expectAccessible, signInAs } from "./helpers";

// A released sheet's data as files (the demo's hybrid KQH-2G, released as A before the tests by
// scripts/seed-demo-catalog.ts), and a set's raw file from its workspace page.
// BENCHFOLD_E2E_SCREENS=<dir> saves a screenshot of each.

const screens = process.env.BENCHFOLD_E2E_SCREENS;

test("a visitor takes a released hybrid's Touchstone files and its specifications away as files", async ({ page }) => {
  test.setTimeout(120_000);
  await page.goto("/datasheets/kestrine/KQH-2G/A");
  const section = page.getByRole("region", { name: "Data of Rev. A" });
  await expect(section).toBeVisible();
  const touchstone = section.getByTestId("download-touchstone");
  expect(await touchstone.count()).toBeGreaterThan(0);
  if (screens) await section.screenshot({ path: `${screens}/released-downloads.png` });
  await expectAccessible(page, "the released sheet page with its downloads");

  const [s4p] = await Promise.all([page.waitForEvent("download"), touchstone.first().click()]);
  expect(s4p.suggestedFilename()).toMatch(/^KQH-2G_revA_[A-Za-z0-9.-]+_[A-Za-z0-9.-]+\.s4p$/);
  const text = readFileSync((await s4p.path())!, "utf8");
  // A Touchstone file: its option line, as the bench wrote it.
  expect(text).toMatch(/^#\s*\S+\s+S\s+(RI|MA|DB)\b/im);

  const [csv] = await Promise.all([page.waitForEvent("download"), section.getByTestId("download-spec-csv").click()]);
  expect(csv.suggestedFilename()).toBe("KQH-2G-rev-A-specifications.csv");
  expect(readFileSync((await csv.path())!, "utf8")).toMatch(/^\uFEFFParameter,Symbol,/);
});

test("a reviewer downloads a set's raw file from its page", async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, "reviewer");
  const { devices } = (await (await page.request.get("/api/devices")).json()) as { devices: { id: number }[] };
  let target: { deviceId: number; setId: number; fileName: string } | null = null;
  for (const device of devices) {
    const { measurementSets } = (await (await page.request.get(`/api/devices/${device.id}/measurements`)).json()) as { measurementSets: { id: number; fileName: string }[] };
    if (measurementSets.length) {
      target = { deviceId: device.id, setId: measurementSets[0].id, fileName: measurementSets[0].fileName };
      break;
    }
  }
  expect(target, "a demo device with a measurement set").not.toBeNull();
  await page.goto(`/devices/${target!.deviceId}/measurements/${target!.setId}`);
  const link = page.getByTestId("download-raw-file");
  await expect(link).toHaveText("Download the raw file");
  if (screens) await page.screenshot({ path: `${screens}/set-raw-file.png`, fullPage: true });
  await expectAccessible(page, "the measurement set page with its raw-file link");
  const [raw] = await Promise.all([page.waitForEvent("download"), link.click()]);
  expect(raw.suggestedFilename()).toBe(target!.fileName);
  expect(readFileSync((await raw.path())!).length).toBeGreaterThan(0);
});
