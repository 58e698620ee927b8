import { readFileSync } from "node:fs";
import path from "node:path";
import { expect as baseExpect, test, type Page } from "@playwright/test";
import { expectAccessible, signInAs } from "./helpers";

// The upload form's measurement settings (issue 12): a phase-noise file uploaded with "Other band…"
// 1 kHz – 100 kHz; the set page prints that band beside rms jitter and rms phase, with who set it, and
// its per-point tables. axe-core (WCAG 2.1 A/AA) on the form and on the set page.
test.describe.configure({ timeout: 180_000 });
const expect = baseExpect.configure({ timeout: 45_000 });
const fixtures = path.join(__dirname, "..", "..", "fixtures");

test("an engineer states the integration band in the upload form and reads it beside the jitter", async ({ page }) => {
  await signInAs(page, "engineer");
  const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();
  const created = await page.request.post("/api/devices", {
    data: { partNumber: `E2E-PN-${tag}`, deviceClass: "frequency-multiplier", title: "Browser-test doubler for phase noise", keyConditions: { multiplicationFactor: 2 } },
  });
  expect(created.status()).toBe(201);
  const { device } = (await created.json()) as { device: { id: number } };
  await page.goto(`/devices/${device.id}`);

  const panel = page.getByTestId("upload-panel");
  const settings = panel.getByTestId("upload-settings");
  await expect(settings.getByLabel("Integration band (rms phase, jitter)")).toContainText("12 kHz – 20 MHz");
  await settings.getByLabel("Integration band (rms phase, jitter)").selectOption("custom");
  await settings.getByLabel("Band start offset", { exact: true }).fill("1");
  await settings.getByLabel("Band start offset unit").selectOption("kHz");
  await settings.getByLabel("Band stop offset", { exact: true }).fill("100");
  await settings.getByLabel("Band stop offset unit").selectOption("kHz");
  await settings.getByLabel("Impedance", { exact: true }).fill("75");
  await expectAccessible(page, "the device page's upload form with its settings");
  if (process.env.BENCHFOLD_E2E_SCREENS) await settings.screenshot({ path: path.join(process.env.BENCHFOLD_E2E_SCREENS, "upload-settings.png") });

  const bytes = Buffer.from(readFileSync(path.join(fixtures, "examples", "phase-noise-doubler.csv"), "utf8").replace("# serial: BFD-0001", `# serial: PN-${tag}`));
  await panel.getByTestId("upload-file-input").setInputFiles({ name: "phase-noise-doubler.csv", mimeType: "text/csv", buffer: bytes });
  await panel.getByRole("button", { name: "Upload", exact: true }).click();
  const row = panel.getByTestId("upload-row").filter({ hasText: "phase-noise-doubler.csv" });
  await expect(row).toHaveAttribute("data-phase", "done");
  await page.goto((await row.getByRole("link", { name: /Set #\d+/ }).getAttribute("href"))!);

  const parameters = page.getByTestId("set-parameters");
  const jitter = parameters.getByRole("row").filter({ hasText: "RMS jitter" });
  await expect(jitter).toContainText("from 1\u00a0kHz");
  await expect(jitter).toContainText("to 100\u00a0kHz");
  await expect(jitter).toContainText("band set by the upload");
  await expect(parameters.getByRole("row").filter({ hasText: "RMS phase error" })).toContainText("band set by the upload");
  // The impedance the form stated is kept with the set's conditions.
  await expect(page.getByTestId("set-conditions")).toContainText("Impedance");
  await expect(page.getByTestId("set-conditions")).toContainText("75\u00a0Ω");
  await expectAccessible(page, "the phase-noise set page");
  if (process.env.BENCHFOLD_E2E_SCREENS) await page.screenshot({ path: path.join(process.env.BENCHFOLD_E2E_SCREENS, "set-page-band.png"), fullPage: true });
});

test("an engineer states the analyzer bandwidth in the upload form and reads the spurs in dBc", async ({ page }) => {
  await signInAs(page, "engineer");
  const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();
  const created = await page.request.post("/api/devices", {
    data: { partNumber: `E2E-SP-${tag}`, deviceClass: "frequency-multiplier", title: "Browser-test doubler for spurs", keyConditions: { multiplicationFactor: 2 } },
  });
  expect(created.status()).toBe(201);
  const { device } = (await created.json()) as { device: { id: number } };
  await page.goto(`/devices/${device.id}`);

  const panel = page.getByTestId("upload-panel");
  const settings = panel.getByTestId("upload-settings");
  await settings.getByLabel("Analyzer bandwidth stated as").selectOption("noise");
  await settings.getByLabel("Analyzer bandwidth (spurs in dBc)", { exact: true }).fill("10");
  await settings.getByLabel("Analyzer bandwidth (spurs in dBc) unit").selectOption("Hz");

  // The example without its own RBW column (offset, L, L_input), so the form's bandwidth is the one used.
  const text = readFileSync(path.join(fixtures, "examples", "phase-noise-doubler.csv"), "utf8")
    .replace("# serial: BFD-0001", `# serial: SP-${tag}`)
    .split("\n")
    .map((line) => (line.startsWith("#") || line === "" ? line : line.split(",").filter((_, i) => i !== 2).join(",")))
    .join("\n");
  await panel.getByTestId("upload-file-input").setInputFiles({ name: "phase-noise-doubler.csv", mimeType: "text/csv", buffer: Buffer.from(text) });
  await panel.getByRole("button", { name: "Upload", exact: true }).click();
  const row = panel.getByTestId("upload-row").filter({ hasText: "phase-noise-doubler.csv" });
  await expect(row).toHaveAttribute("data-phase", "done");
  await page.goto((await row.getByRole("link", { name: /Set #\d+/ }).getAttribute("href"))!);

  const parameters = page.getByTestId("set-parameters");
  // −121.3 dBc/Hz plotted at 150 Hz through a 10 Hz noise bandwidth: −121.3 + 10 = −111.3 dBc.
  const spur = parameters.getByRole("row").filter({ hasText: "Discrete spur" }).filter({ hasText: "150\u00a0Hz" });
  await expect(spur).toContainText("bandwidth set by the upload");
  await expect(spur).toContainText("−111.3\u00a0dBc");
  await expect(parameters.getByRole("row").filter({ hasText: "Spur as plotted" })).toHaveCount(0);
});
