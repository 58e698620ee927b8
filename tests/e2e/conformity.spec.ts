import { mkdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { expect as baseExpect, test, type Browser, type Page } from "@playwright/test";
import { demoPassword, demoUsers, expectAccessible, signInViaApi } from "./helpers";

// A fresh doubler released from four units, then a fifth unit far above its guaranteed conversion-loss
// limit: the device page shows the conformity section (limits, the control chart, the open alert), it
// passes axe-core, and the engineer closes the alert with a reason in the browser.
test.describe.configure({ mode: "serial", timeout: 600_000 });
const expect = baseExpect.configure({ timeout: 60_000 });

const fixtures = path.join(__dirname, "..", "..", "fixtures");
const screensDir = process.env.BENCHFOLD_E2E_SCREENS;
const tag = `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;

/** The example drive sweep as a unit of its own, every output lowered by `offsetDb` (conversion loss + offset). */
function unitFile(serial: string, offsetDb: number): Buffer {
  const lines = readFileSync(path.join(fixtures, "examples", "drive-sweep-doubler.csv"), "utf8").split("\n");
  return Buffer.from(
    lines
      .map((line) => {
        if (line.startsWith("# serial:")) return `# serial: ${serial}`;
        if (!/^-?\d/.test(line)) return line;
        const [input, ...outputs] = line.split(",");
        return [input, ...outputs.map((v) => (Number(v) - offsetDb).toFixed(2))].join(",");
      })
      .join("\n"),
  );
}

async function personPage(browser: Browser, email: string): Promise<Page> {
  const address = `10.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 256)}.${1 + Math.floor(Math.random() * 254)}`;
  const context = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": address } });
  const page = await context.newPage();
  await signInViaApi(page, email);
  return page;
}

async function approvedUnit(engineer: Page, reviewer: Page, deviceId: number, serial: string, offsetDb: number): Promise<number> {
  const upload = await engineer.request.post(`/api/devices/${deviceId}/measurements`, {
    multipart: { file: { name: `${serial}.csv`, mimeType: "text/csv", buffer: unitFile(serial, offsetDb) }, measuredOn: "2026-11-20" },
  });
  expect(upload.status(), await upload.text()).toBe(201);
  const setId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
  const review = await reviewer.request.post(`/api/measurements/${setId}/review`, { data: { decision: "approve" } });
  expect(review.status(), await review.text()).toBe(200);
  return setId;
}

test("a unit outside a released limit raises an alert on the device page, which the engineer closes with a reason", async ({ browser }) => {
  const engineer = await personPage(browser, demoUsers.engineer.email);
  const reviewer = await personPage(browser, demoUsers.reviewer.email);
  const partNumber = `CW-${tag.toUpperCase()}`;
  const created = await engineer.request.post("/api/devices", {
    data: { partNumber, deviceClass: "frequency-multiplier", title: "Conformity-watch doubler", keyConditions: { multiplicationFactor: 2 } },
  });
  expect(created.status()).toBe(201);
  const deviceId = ((await created.json()) as { device: { id: number } }).device.id;
  for (const [i, offset] of [0, 0.2, -0.15, 0.1].entries()) await approvedUnit(engineer, reviewer, deviceId, `${partNumber}-U${i}`, offset);

  // A guaranteed max 0.8 dB above the mean with U = 0.1 dB, then Rev. A through the API.
  const sheet = (await (await engineer.request.get(`/api/devices/${deviceId}/sheet`)).json()) as {
    sheet: { statistics: { groups: { groupId: string; parameter: string; conditionsKey: string; mean: { value: number } }[] } };
  };
  const group = sheet.sheet.statistics.groups.find((g) => g.groupId.startsWith("conversion-loss-at-drive:"))!;
  expect((await engineer.request.put(`/api/devices/${deviceId}/sheet-content`, { data: { measurementUncertainty: { "conversion-loss": 0.1 } } })).status()).toBe(200);
  const limits = await engineer.request.put(`/api/devices/${deviceId}/spec-limits`, {
    data: { limits: [{ parameter: "conversion-loss", conditionsKey: group.conditionsKey, max: Math.round((group.mean.value + 0.8) * 100) / 100, unit: "dB", basis: "test" }] },
  });
  expect(limits.status()).toBe(200);
  const draft = (await (await engineer.request.get(`/api/devices/${deviceId}/sheet`)).json()) as { sheet: { issues: { message: string }[] } };
  const submitted = await engineer.request.post(`/api/devices/${deviceId}/candidates`, {
    data: { acknowledgements: draft.sheet.issues.map((i) => ({ issue: i.message, reason: "Stands as stated for this test." })), note: "" },
  });
  expect(submitted.status(), await submitted.text()).toBe(201);
  const candidateId = ((await submitted.json()) as { candidate: { id: number } }).candidate.id;
  const signed = await reviewer.request.post(`/api/sheet-candidates/${candidateId}/decision`, { data: { decision: "approve", meaning: "approved-for-release", password: demoPassword } });
  expect(signed.status(), await signed.text()).toBe(200);
  expect((await engineer.request.post(`/api/sheet-candidates/${candidateId}/release`, { data: { note: "" } })).status()).toBe(201);

  // After the release: one unit in control, one far above the limit.
  await approvedUnit(engineer, reviewer, deviceId, `${partNumber}-U4`, 0.05);
  const outSet = await approvedUnit(engineer, reviewer, deviceId, `${partNumber}-U5`, 1.2);

  await engineer.goto(`/devices/${deviceId}`);
  const section = engineer.getByTestId("conformity");
  await expect(section.getByRole("heading", { name: "Conformity since release" })).toBeVisible();
  await expect(section.getByTestId("conformity-lead")).toContainText("Rev. A");
  await expect(section.getByTestId("conformity-limit-row")).toHaveCount(1);
  await expect(section.getByTestId("conformity-limit-row")).toContainText("1 of 2");
  const alerts = section.getByTestId("conformity-alerts");
  await expect(alerts).toContainText("⚠ Open");
  await expect(alerts).toContainText(`set #${outSet}`);
  await expect(section.getByTestId("conformity-signals")).toContainText("Nelson test 1");
  // The chart is drawn in the browser by Vega from the lib/charts spec.
  await expect(section.getByTestId("conformity-chart").locator("svg").first()).toBeVisible();
  await expectAccessible(engineer, "the conformity section with an open alert", "#conformity");
  if (screensDir) {
    mkdirSync(screensDir, { recursive: true });
    await section.screenshot({ path: path.join(screensDir, "conformity-open.png") });
  }

  const closeForm = section.locator("[data-testid^='close-alert-']");
  await expect(async () => {
    await closeForm.locator("summary").click();
    await expect(closeForm.getByRole("textbox")).toBeVisible({ timeout: 2_000 });
  }).toPass();
  await closeForm.getByRole("textbox").fill("short");
  await closeForm.getByRole("button", { name: /Close alert/ }).click();
  await expect(closeForm).toContainText("at least 10 characters");
  await closeForm.getByRole("textbox").fill("New lot, limit revision planned");
  await closeForm.getByRole("button", { name: /Close alert/ }).click();
  await expect(alerts).toContainText("✓ Closed");
  await expect(section.getByTestId("alert-close-reason")).toContainText("New lot, limit revision planned");
  await expectAccessible(engineer, "the conformity section with a closed alert", "#conformity");
  if (screensDir) await section.screenshot({ path: path.join(screensDir, "conformity-closed.png") });

  // The reviewer reads the same section, without the close form.
  await reviewer.goto(`/devices/${deviceId}`);
  await expect(reviewer.getByTestId("conformity-alerts")).toContainText("✓ Closed");
  await expect(reviewer.locator("[data-testid^='close-alert-']")).toHaveCount(0);
});
