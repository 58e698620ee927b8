import { readFileSync } from "node:fs";
import path from "node:path";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { expectAccessible, signInAs } from "./helpers";

// Issue 13, item 1: the upload form asks for the device class's own conditions (templates/<class>/conditions.ts):
// a mixer's RF, LO and IF frequencies and LO drive, a hybrid's band; never a splitter's excess loss.
// Each form is checked with axe-core (WCAG 2.1 A/AA) and a submit that is stored with those conditions.
test.describe.configure({ timeout: 180_000 });
const expect = baseExpect.configure({ timeout: 45_000 });
const fixtures = path.join(__dirname, "..", "..", "fixtures");

type StoredSet = { measurementSet: { conditions: Record<string, unknown>; parameters: { name: string; conditions: Record<string, string | number> }[] } };

async function openNewDevice(page: Page, deviceClass: string, title: string): Promise<string> {
  await signInAs(page, "engineer");
  const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();
  const created = await page.request.post("/api/devices", { data: { partNumber: `E2E-UC-${tag}`, deviceClass, title } });
  expect(created.status()).toBe(201);
  const { device } = (await created.json()) as { device: { id: number } };
  await page.goto(`/devices/${device.id}`);
  return tag;
}

/** Uploads one file from the panel and reads the stored set back through the API. */
async function uploadAndRead(page: Page, file: { name: string; mimeType: string; buffer: Buffer }): Promise<StoredSet> {
  const panel = page.getByTestId("upload-panel");
  await panel.getByTestId("upload-file-input").setInputFiles(file);
  await panel.getByRole("button", { name: "Upload", exact: true }).click();
  const row = panel.getByTestId("upload-row").filter({ hasText: file.name });
  await expect(row).toHaveAttribute("data-phase", "done");
  const href = (await row.getByRole("link", { name: /Set #\d+/ }).getAttribute("href"))!;
  const setId = /(\d+)$/.exec(href)![1];
  const response = await page.request.get(`/api/measurements/${setId}`);
  expect(response.status()).toBe(200);
  await page.goto(href);
  return (await response.json()) as StoredSet;
}

test("a mixer's upload form asks for RF, LO and IF frequencies and LO drive, and the figures carry them", async ({ page }) => {
  const tag = await openNewDevice(page, "double-balanced-mixer", "Browser-test mixer for its conditions");
  const conditions = page.getByTestId("upload-conditions");
  for (const label of ["RF frequency", "LO frequency", "IF frequency", "LO drive"]) await expect(conditions.getByLabel(label, { exact: true })).toBeVisible();
  for (const label of ["Splitter excess loss", "Input frequency", "Drive level", "Band start"]) await expect(conditions.getByLabel(label, { exact: true })).toHaveCount(0);
  await expect(conditions.getByTestId("upload-class-conditions")).toContainText("RF frequency, LO frequency, IF frequency, LO drive");

  await conditions.getByLabel("LO frequency", { exact: true }).fill("1.07");
  await conditions.getByLabel("LO frequency unit").selectOption("GHz");
  await conditions.getByLabel("IF frequency", { exact: true }).fill("70");
  await conditions.getByLabel("IF frequency unit").selectOption("MHz");
  await expectAccessible(page, "a mixer's upload form");
  if (process.env.BENCHFOLD_E2E_SCREENS) await conditions.screenshot({ path: path.join(process.env.BENCHFOLD_E2E_SCREENS, "upload-mixer-conditions.png") });

  // The two-tone file states its tone (the RF, 1000 MHz) and its LO drive (+7 dBm) itself; the form adds LO and IF.
  const text = readFileSync(path.join(fixtures, "examples", "two-tone-mixer.tsv"), "utf8").replace("# serial: BFD-0107", `# serial: UC-${tag}`);
  const stored = await uploadAndRead(page, { name: "two-tone-mixer.tsv", mimeType: "text/tab-separated-values", buffer: Buffer.from(text) });
  expect(stored.measurementSet.conditions).toMatchObject({ loFrequencyHz: 1.07e9, ifFrequencyHz: 70e6, loDriveDbm: 7 });
  const iip3 = stored.measurementSet.parameters.find((p) => p.name === "iip3")!;
  expect(iip3.conditions).toMatchObject({ rfFrequencyHz: 1e9, loFrequencyHz: 1.07e9, ifFrequencyHz: 70e6, loPowerDbm: 7 });
  await expect(page.getByTestId("set-conditions")).toContainText("LO frequency");
  await expect(page.getByTestId("set-conditions")).toContainText("1.07\u00a0GHz");
  await expectAccessible(page, "the mixer's set page");
});

test("a hybrid's upload form asks for the band, refuses a reversed one, and derives the figures over it", async ({ page }) => {
  const tag = await openNewDevice(page, "quadrature-hybrid", "Browser-test hybrid for its band");
  const conditions = page.getByTestId("upload-conditions");
  await expect(conditions.getByLabel("Band start", { exact: true })).toBeVisible();
  await expect(conditions.getByLabel("Band stop", { exact: true })).toBeVisible();
  for (const label of ["Splitter excess loss", "Cable loss", "Drive level", "LO drive", "Input frequency"]) await expect(conditions.getByLabel(label, { exact: true })).toHaveCount(0);

  const text = readFileSync(path.join(fixtures, "examples", "hybrid-4port-v2.s4p"), "utf8").replace("serial BFD-4411", `serial UC-${tag}`);
  const file = { name: "hybrid-4port-v2.s4p", mimeType: "application/octet-stream", buffer: Buffer.from(text) };
  const panel = page.getByTestId("upload-panel");
  await conditions.getByLabel("Serial", { exact: true }).fill(`UC-${tag}`);
  await conditions.getByLabel("Band start", { exact: true }).fill("2.4");
  await conditions.getByLabel("Band stop", { exact: true }).fill("1.6");
  await panel.getByTestId("upload-file-input").setInputFiles(file);
  await panel.getByRole("button", { name: "Upload", exact: true }).click();
  await expect(panel).toContainText("The band stop must lie above the band start.");
  await expectAccessible(page, "a hybrid's upload form with its refusal");

  await conditions.getByLabel("Band start", { exact: true }).fill("1.6");
  await conditions.getByLabel("Band stop", { exact: true }).fill("2.4");
  if (process.env.BENCHFOLD_E2E_SCREENS) await conditions.screenshot({ path: path.join(process.env.BENCHFOLD_E2E_SCREENS, "upload-hybrid-conditions.png") });
  await panel.getByRole("button", { name: "Upload", exact: true }).click();
  const row = panel.getByTestId("upload-row").filter({ hasText: file.name });
  await expect(row).toHaveAttribute("data-phase", "done");
  const href = (await row.getByRole("link", { name: /Set #\d+/ }).getAttribute("href"))!;
  const response = await page.request.get(`/api/measurements/${/(\d+)$/.exec(href)![1]}`);
  const stored = (await response.json()) as StoredSet;
  expect(stored.measurementSet.conditions).toMatchObject({ bandStartHz: 1.6e9, bandStopHz: 2.4e9 });
  const worstLoss = stored.measurementSet.parameters.find((p) => p.name === "insertion-loss" && p.conditions.statistic === "worst")!;
  expect(worstLoss.conditions).toMatchObject({ startHz: 1.6e9, stopHz: 2.4e9 });
});
