import path from "node:path";
import { expect, test, type Locator, type Page } from "@playwright/test";
import { outlineSvg } from "../unit/sheet/design-data/outline-fixture";
import { expectAccessible, signInAs } from "./helpers";

// Issue 13, layout: the whole specifications table reads without sideways scrolling at 1360 px, on
// every released demo sheet's page and in the workspace preview of every demo draft; and the
// design-in tab of the workspace. BENCHFOLD_E2E_SCREENS=<dir> saves screenshots.

const screens = process.env.BENCHFOLD_E2E_SCREENS;
test.use({ viewport: { width: 1360, height: 900 } });

/** The scrolling region around a specifications table: nothing hidden to its right. */
async function expectNoSidewaysScroll(region: Locator, what: string): Promise<void> {
  await expect(region).toBeVisible();
  const { scrollWidth, clientWidth } = await region.evaluate((el) => ({ scrollWidth: el.scrollWidth, clientWidth: el.clientWidth }));
  expect(scrollWidth, `${what}: the table is ${scrollWidth} px wide in ${clientWidth} px`).toBeLessThanOrEqual(clientWidth);
}

test("every released demo sheet's specifications read without sideways scrolling at 1360 px", async ({ page }) => {
  test.setTimeout(240_000);
  const { hits } = (await (await page.request.get("/api/v1/sheets?pageSize=50")).json()) as { hits: { path: string; partNumber: string }[] };
  expect(hits.length).toBeGreaterThanOrEqual(4);
  for (const hit of hits) {
    await page.goto(hit.path);
    await expectNoSidewaysScroll(page.getByRole("region", { name: "Electrical specifications, scrolls sideways on narrow screens" }), hit.partNumber);
    if (screens) await page.screenshot({ path: path.join(screens, `sheet-1360-${hit.partNumber}.png`) });
  }
});

test("every demo draft's preview shows its specifications without sideways scrolling at 1360 px", async ({ page }) => {
  test.setTimeout(240_000);
  await signInAs(page, "engineer");
  const { devices } = (await (await page.request.get("/api/devices")).json()) as { devices: { id: number; partNumber: string }[] };
  expect(devices.length).toBeGreaterThan(0);
  for (const device of devices) {
    await page.goto(`/sheets/${device.id}`);
    const region = page.getByRole("region", { name: "Electrical specifications, scrolls sideways on narrow screens" });
    if ((await region.count()) === 0) continue; // a draft without approved data has no table yet
    await expectNoSidewaysScroll(region.first(), `preview of ${device.partNumber}`);
  }
});

test("an engineer states pins, ordering, operating conditions and the outline drawing, and the preview prints them", async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, "engineer");
  const tag = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();
  const created = await page.request.post("/api/devices", {
    data: { partNumber: `E2E-DI-${tag}`, deviceClass: "quadrature-hybrid", title: "Browser-test hybrid for design-in data", keyConditions: {} },
  });
  expect(created.status()).toBe(201);
  const { device } = (await created.json()) as { device: { id: number } };
  await page.goto(`/sheets/${device.id}#design-in`);
  const editor = page.getByTestId("design-in-editor");
  await expect(editor).toBeVisible();
  // The class's usual ports are offered.
  await expect(editor.getByLabel("Pin 1, function")).toHaveValue("Input");

  await editor.getByLabel("Drawing file (SVG or PNG)").setInputFiles({ name: "outline.svg", mimeType: "image/svg+xml", buffer: Buffer.from(outlineSvg) });
  await editor.getByTestId("upload-outline").click();
  await expect(editor.getByText("The drawing is on the sheet.")).toBeVisible();
  await editor.getByLabel("Drawing file (SVG or PNG)").setInputFiles({ name: "bad.svg", mimeType: "image/svg+xml", buffer: Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg"><script>1</script></svg>`) });
  await editor.getByTestId("upload-outline").click();
  await expect(editor.getByText(/contains a script element/)).toBeVisible();

  await editor.getByLabel("Condition 1, max").fill("2.0");
  await editor.getByRole("button", { name: "Add a part number" }).click();
  await editor.getByLabel("Part number 1, part number").fill(`E2E-DI-${tag}-TR`);
  await editor.getByLabel("Part number 1, packing").fill("Tape and reel, 500 pieces");
  await editor.getByLabel("Caption of the outline").fill("Dimensions in mm");
  await expectAccessible(page, "the design-in tab");
  if (screens) await editor.screenshot({ path: path.join(screens, "design-in-editor.png") });
  await editor.getByTestId("save-design-in").click();
  await expect(editor.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();

  await page.getByRole("tab", { name: "Preview" }).click();
  const sheet = page.locator("#sheet-panel-preview, [data-testid=sheet-workspace]").first();
  await expect(sheet.getByRole("heading", { name: "Pin functions" })).toBeVisible();
  await expect(sheet.getByRole("heading", { name: "Ordering information" })).toBeVisible();
  await expect(sheet.getByRole("img", { name: "Package outline: Dimensions in mm" })).toBeVisible();
  await expect(sheet.getByText("Tape and reel, 500 pieces")).toBeVisible();
});
