import { readFileSync } from "node:fs";
import path from "node:path";
import { expect as baseExpect, test, type Browser, type Page } from "@playwright/test";
import { signInAs } from "./helpers";

// Uploads parse, derive and store in one request, and the set page loads the chart chunk: allow a busy dev server time.
test.describe.configure({ timeout: 180_000 });
const expect = baseExpect.configure({ timeout: 45_000 });

const fixtures = path.join(__dirname, "..", "..", "fixtures");

function randomTag(): string {
  return `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
}

/**
 * The example drive sweep with a `# note:` line after its metadata, so every run uploads new
 * bytes (identical bytes are refused as a duplicate). `padLines` adds comment lines after the
 * data so the upload lasts long enough, under throttling, to watch its progress.
 */
function uniqueDriveSweep(padLines = 0): Buffer {
  const lines = readFileSync(path.join(fixtures, "examples", "drive-sweep-doubler.csv"), "utf8").split("\n");
  const header = lines.findIndex((l) => !l.startsWith("#"));
  lines.splice(header, 0, `# note: ${randomTag()}`);
  const text = lines.join("\n").replace(/\n*$/, "\n");
  const padding = Array.from({ length: padLines }, (_, i) => `# padding line ${i} ${"x".repeat(90)}`).join("\n");
  return Buffer.from(padLines ? `${text}${padding}\n` : text);
}

/** A fresh device of the engineer's organization, made through the API with a random part number. */
async function createDevice(page: Page): Promise<{ id: number; partNumber: string }> {
  const partNumber = `E2E-${randomTag().toUpperCase()}`;
  const response = await page.request.post("/api/devices", {
    data: {
      partNumber,
      deviceClass: "frequency-multiplier",
      title: "Browser-test doubler, 1–3 GHz output",
      keyConditions: { inputFrequencyHz: { min: 5e8, max: 1.5e9 }, multiplicationFactor: 2, driveLevelDbm: 13 },
    },
  });
  expect(response.status(), "POST /api/devices").toBe(201);
  const { device } = (await response.json()) as { device: { id: number; partNumber: string } };
  return device;
}

async function uploadThroughApi(page: Page, deviceId: number): Promise<number> {
  const response = await page.request.post(`/api/devices/${deviceId}/measurements`, {
    multipart: { file: { name: "drive-sweep-doubler.csv", mimeType: "text/csv", buffer: uniqueDriveSweep() }, measuredOn: "2026-11-20" },
  });
  expect(response.status(), "upload through the API").toBe(201);
  return ((await response.json()) as { measurementSet: { id: number } }).measurementSet.id;
}

async function pageAs(browser: Browser, role: "engineer" | "reviewer" | "admin"): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signInAs(page, role);
  return page;
}

test.describe("measurement upload on the device page", () => {
  test("an engineer uploads a drive sweep: the row shows its progress, then a link to the new set", async ({ page }) => {
    await signInAs(page, "engineer");
    const device = await createDevice(page);
    await page.goto(`/devices/${device.id}`);
    await expect(page.getByRole("heading", { level: 1 })).toHaveText(device.partNumber);
    await expect(page.getByTestId("no-measurement-sets")).toBeVisible();

    // Throttle uploads so the progress bar is on screen long enough to see (≈ 400 kB at 200 kB/s).
    const cdp = await page.context().newCDPSession(page);
    await cdp.send("Network.enable");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 200 * 1024 });

    const panel = page.getByTestId("upload-panel");
    await panel.getByLabel("Lot").fill("L-E2E");
    await panel.getByTestId("upload-file-input").setInputFiles({ name: "drive-sweep-doubler.csv", mimeType: "text/csv", buffer: uniqueDriveSweep(4000) });
    const row = panel.getByTestId("upload-row").filter({ hasText: "drive-sweep-doubler.csv" });
    await expect(row).toHaveAttribute("data-phase", "ready");
    await panel.getByRole("button", { name: "Upload", exact: true }).click();

    await expect(row.getByTestId("upload-progress")).toBeVisible();
    await expect(row).toHaveAttribute("data-phase", "done");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    const link = row.getByRole("link", { name: /Set #\d+/ });
    await expect(link).toBeVisible();

    // The table is re-read from the server after the batch.
    const table = page.getByTestId("measurement-sets-table");
    await expect(table).toContainText("drive-sweep-doubler.csv");
    await expect(table).toContainText("BFD-0001");
    await expect(table).toContainText("Awaiting review");

    const href = await link.getAttribute("href");
    expect(href).toMatch(new RegExp(`^/devices/${device.id}/measurements/\\d+$`));
    await page.goto(href!);
    await expect(page.getByRole("heading", { level: 1 })).toContainText("Drive sweep · set #");
    await expect(page.getByTestId("set-parameters")).toContainText("Optimum drive");
    await expect(page.getByTestId("set-conditions")).toContainText("1\u00a0GHz");
    // The chart chunk loads in the browser and draws an SVG with unit-bearing axis titles.
    const figure = page.locator('[data-curve="conversion-loss-vs-drive"]');
    await expect(figure.locator("svg").first()).toBeVisible();
    await expect(figure).toContainText("Per-port drive (dBm)");
    await expect(figure).toContainText("Conversion loss (dB)");
  });

  test("a malformed file shows the engine's message with line and column; the same bytes twice are refused as a duplicate", async ({ page }) => {
    await signInAs(page, "engineer");
    const device = await createDevice(page);
    await page.goto(`/devices/${device.id}`);
    const panel = page.getByTestId("upload-panel");
    const good = uniqueDriveSweep();
    await panel.getByTestId("upload-file-input").setInputFiles([
      { name: "drive-text-in-number.csv", mimeType: "text/csv", buffer: readFileSync(path.join(fixtures, "malformed", "drive-text-in-number.csv")) },
      { name: "first.csv", mimeType: "text/csv", buffer: good },
    ]);
    await panel.getByRole("button", { name: "Upload 2 files" }).click();

    const bad = panel.getByTestId("upload-row").filter({ hasText: "drive-text-in-number.csv" });
    await expect(bad).toHaveAttribute("data-phase", "failed");
    await expect(bad.getByTestId("upload-error")).toContainText('drive-text-in-number.csv line 10, column 3 ("p2_out [dBm]"): expected a number in dBm, found "n/a"');
    await expect(bad.getByTestId("upload-row-status")).toContainText("422");
    await expect(panel.getByTestId("upload-row").filter({ hasText: "first.csv" })).toHaveAttribute("data-phase", "done");

    await panel.getByTestId("upload-file-input").setInputFiles({ name: "second.csv", mimeType: "text/csv", buffer: good });
    await panel.getByRole("button", { name: "Upload", exact: true }).click();
    const duplicate = panel.getByTestId("upload-row").filter({ hasText: "second.csv" });
    await expect(duplicate).toHaveAttribute("data-phase", "failed");
    await expect(duplicate.getByTestId("upload-error")).toContainText("identical (same SHA-256) to measurement set #");
    await expect(duplicate.getByTestId("upload-row-status")).toContainText("409");
    await expect(duplicate.getByRole("link", { name: /Open set #\d+/ })).toBeVisible();
  });

  test("a foreign CSV goes through the column mapping step, then uploads with the saved mapping", async ({ page }) => {
    await signInAs(page, "engineer");
    const device = await createDevice(page);
    await page.goto(`/devices/${device.id}`);
    // A bench script's own headers; the extra column makes the header row new on every run.
    const tag = randomTag().replace(/-/g, "_");
    const csv = [
      `# serial: FX-${tag}`,
      `Pin_dBm,Harm1 (dBm),Harm2 (dBm),Bench_${tag}`,
      ...[-5, -3, -1, 1, 3, 5, 7, 9, 11, 13, 15].map((p, i) => `${p},${(-60 + 1.6 * i).toFixed(2)},${(-37 + 4.1 * i - 0.09 * i * i).toFixed(2)},b${i}`),
    ].join("\n");
    const panel = page.getByTestId("upload-panel");
    await panel.getByTestId("upload-file-input").setInputFiles({ name: "bench-script-output.csv", mimeType: "text/csv", buffer: Buffer.from(`${csv}\n`) });
    await panel.getByRole("button", { name: "Upload", exact: true }).click();

    const row = panel.getByTestId("upload-row").filter({ hasText: "bench-script-output.csv" });
    await expect(row).toHaveAttribute("data-phase", "needs-mapping");
    const mapping = panel.getByTestId("mapping-panel");
    await expect(mapping).toBeVisible();
    await mapping.getByLabel("Kind of measurement").selectOption("drive-sweep");
    await mapping.getByLabel("Quantity in column Pin_dBm").selectOption("input_power");
    await mapping.getByLabel("Unit of column Pin_dBm").selectOption("dBm");
    await mapping.getByLabel("Quantity in column Harm1 (dBm)").selectOption("p1_out");
    await mapping.getByLabel("Quantity in column Harm2 (dBm)").selectOption("p2_out");
    await mapping.getByLabel(`Quantity in column Bench_${tag}`).selectOption("");
    // The preview shows the file's rows under the headings they will be read as.
    await expect(mapping.getByTestId("mapping-table")).toContainText("input_power [dBm]");
    await expect(mapping.getByTestId("mapping-table")).toContainText("p2_out [dBm]");
    await expect(mapping.getByTestId("mapping-table")).toContainText("-37");
    await mapping.getByLabel("Input frequency").fill("1");
    await mapping.getByLabel("Wanted output order").fill("2");
    await mapping.getByLabel("Name of the mapping").fill(`Bench script ${tag}`);
    await mapping.getByRole("button", { name: "Save mapping and upload again" }).click();

    await expect(row).toHaveAttribute("data-phase", "done");
    await page.goto((await row.getByRole("link", { name: /Set #\d+/ }).getAttribute("href"))!);
    await expect(page.getByTestId("set-conditions")).toContainText(`FX-${tag}`);
    await expect(page.getByTestId("set-parameters")).toContainText("Optimum drive");
  });
});

test("a reviewer finds the set in the queue and approves it; the page becomes read-only", async ({ browser }) => {
  const engineer = await pageAs(browser, "engineer");
  const device = await createDevice(engineer);
  const setId = await uploadThroughApi(engineer, device.id);
  await engineer.goto(`/devices/${device.id}/measurements/${setId}`);
  // Engineers do not review: no decision buttons on their own upload.
  await expect(engineer.getByTestId("review-actions")).toHaveCount(0);

  const reviewer = await pageAs(browser, "reviewer");
  await reviewer.goto("/review");
  const queueRow = reviewer.getByTestId(`review-row-${setId}`);
  await expect(queueRow).toContainText(device.partNumber);
  await expect(queueRow).toContainText("Drive sweep");
  const setLink = queueRow.getByRole("link", { name: `#${setId}` });
  await expect(setLink).toHaveAttribute("href", `/devices/${device.id}/measurements/${setId}`);
  await reviewer.goto(`/devices/${device.id}/measurements/${setId}`);

  await expect(reviewer.getByRole("heading", { level: 1 })).toContainText(`set #${setId}`);
  const actions = reviewer.getByTestId("review-actions");
  const approved = reviewer.waitForResponse((r) => r.url().endsWith(`/api/measurements/${setId}/review`) && r.request().method() === "POST");
  await actions.getByRole("button", { name: "Approve set" }).click();
  expect((await approved).status()).toBe(200);
  // The page re-reads itself from the server (router.refresh); a loaded dev server can take a while.
  await expect(reviewer.getByText("This set is read-only")).toBeVisible({ timeout: 90_000 });
  await expect(reviewer.getByTestId("review-actions")).toHaveCount(0);
  await expect(reviewer.locator('[data-state="approved"]').first()).toHaveText(/Approved/);
  await expect(reviewer.getByTestId("set-history")).toContainText("Approved by Priya Raman");

  await reviewer.goto("/review");
  await expect(reviewer.getByTestId(`review-row-${setId}`)).toHaveCount(0);
  await reviewer.context().close();
  await engineer.context().close();
});

test("a reviewer rejects a set with a reason, which the history shows", async ({ browser }) => {
  const engineer = await pageAs(browser, "engineer");
  const device = await createDevice(engineer);
  const setId = await uploadThroughApi(engineer, device.id);
  const reviewer = await pageAs(browser, "reviewer");
  await reviewer.goto(`/devices/${device.id}/measurements/${setId}`);
  const actions = reviewer.getByTestId("review-actions");
  await actions.getByRole("button", { name: "Reject…" }).click();
  await actions.getByLabel("Reason for rejecting").fill("Cable loss not de-embedded: the 0.6 dB is missing from the setup note.");
  const rejected = reviewer.waitForResponse((r) => r.url().endsWith(`/api/measurements/${setId}/review`) && r.request().method() === "POST");
  await actions.getByRole("button", { name: "Reject set" }).click();
  expect((await rejected).status()).toBe(200);
  await expect(reviewer.getByTestId("set-history")).toContainText("Rejected by Priya Raman", { timeout: 90_000 });
  await expect(reviewer.getByTestId("set-history")).toContainText("Cable loss not de-embedded");
  await expect(reviewer.locator('[data-state="rejected"]').first()).toHaveText(/Rejected/);
  await reviewer.context().close();
  await engineer.context().close();
});

test("the device list searches, sorts and pages from the query string", async ({ page }) => {
  await signInAs(page, "engineer");
  const device = await createDevice(page);
  await page.goto("/devices");
  await page.getByLabel("Search part number or title").fill(device.partNumber);
  await page.getByRole("button", { name: "Search" }).click();
  await expect(page).toHaveURL(new RegExp(`q=${device.partNumber}`));
  const table = page.getByTestId("devices-table");
  await expect(table.locator("tbody tr")).toHaveCount(1);
  await expect(table).toContainText(device.partNumber);

  await page.goto("/devices?sort=updated");
  await expect(page.getByRole("columnheader", { name: /updated/i })).toHaveAttribute("aria-sort", "descending");
  await expect(page.getByTestId("devices-table").locator("tbody tr").first()).toContainText("E2E-");

  await page.goto("/devices?q=no-such-part-anywhere");
  await expect(page.getByTestId("devices-no-match")).toBeVisible();
});

test("an engineer creates a device with frequencies entered in MHz and GHz, then edits it", async ({ page }) => {
  await signInAs(page, "engineer");
  await page.goto("/devices");
  const form = page.getByTestId("new-device-form");
  const partNumber = `E2E-NEW-${randomTag().toUpperCase()}`;
  await form.getByLabel("Part number").fill(partNumber);
  await form.getByLabel("Title").fill("Doubler, 2–6 GHz output");
  await form.getByLabel("Input frequency range, from").fill("1000");
  await form.getByLabel("Input frequency range, to").fill("3000");
  await form.getByLabel("Input frequency range, unit").selectOption("MHz");
  await form.getByLabel("Output frequency range, from").fill("2");
  await form.getByLabel("Output frequency range, to").fill("6");
  await form.getByLabel("Drive level").fill("15");
  await form.getByRole("button", { name: "Create device" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(partNumber);
  const conditions = page.getByTestId("device-key-conditions");
  await expect(conditions).toContainText("1–3\u00a0GHz");
  await expect(conditions).toContainText("2–6\u00a0GHz");
  await expect(conditions).toContainText("+15\u00a0dBm");

  // The same form edits the device: values come back in their units, changes show at once.
  await page.getByTestId("edit-device").getByText("Edit device").click();
  const edit = page.getByTestId("edit-device-form");
  await expect(edit.getByLabel("Input frequency range, from")).toHaveValue("1");
  await expect(edit.getByLabel("Input frequency range, unit")).toHaveValue("GHz");
  await edit.getByLabel("Title").fill("Doubler, 2–6 GHz output, revised");
  await edit.getByLabel("Drive level").fill("17");
  await edit.getByRole("button", { name: "Save device" }).click();
  await expect(page.getByTestId("device-key-conditions")).toContainText("+17\u00a0dBm", { timeout: 15_000 });
  await expect(page.getByText("Doubler, 2–6 GHz output, revised").first()).toBeVisible();
});
