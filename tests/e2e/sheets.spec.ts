import { expect as baseExpect, test, type Page } from "@playwright/test";
import { signInViaApi } from "./helpers";
import { xssPayloads } from "./xss-payloads";

// A sheet page builds the model and draws its charts on the server; a busy dev server needs time.
// The tests share the demo device and change its limits and prose for a moment: one at a time.
test.describe.configure({ mode: "serial", timeout: 420_000 });
const expect = baseExpect.configure({ timeout: 60_000 });

// Kestrine Microwave's demo doubler has approved measurement sets (scripts/seed-demo-measurements.ts).
const kestrine = {
  engineer: "elena.marchetti@kestrine.example",
  reviewer: "hiroshi.tanabe@kestrine.example",
} as const;
const customer = "anneli.vos@tarnby-radio.example";

async function demoDoublerId(page: Page): Promise<number> {
  const response = await page.request.get("/api/devices");
  expect(response.status(), "GET /api/devices").toBe(200);
  const { devices } = (await response.json()) as { devices: { id: number; partNumber: string }[] };
  const device = devices.find((d) => d.partNumber === "KDX-2G4");
  expect(device, "the demo device KDX-2G4").toBeTruthy();
  return device!.id;
}

/**
 * The draft PDF takes many seconds of server CPU to render and would slow every other request of these
 * tests; where a test is not about the PDF, the frame gets a one-page stand-in instead.
 */
async function stubDraftPdf(page: Page, gate?: Promise<void>): Promise<string[]> {
  const requested: string[] = [];
  await page.route("**/api/devices/*/sheet/pdf*", async (route) => {
    requested.push(new URL(route.request().url()).pathname);
    await (gate ?? new Promise((resolve) => setTimeout(resolve, 1_500)));
    await route.fulfill({ status: 200, contentType: "application/pdf", body: minimalPdf });
  });
  return requested;
}

const minimalPdf = Buffer.from(
  "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n" +
    "3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 595 842]>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
);

/** Opens a workspace tab; a click that lands before hydration is simply tried again. */
async function openTab(page: Page, name: string, testId: string) {
  await expect(async () => {
    await page.getByRole("tab", { name }).click();
    await expect(page.getByTestId(testId)).toBeVisible({ timeout: 2_000 });
  }).toPass();
}

type GroupJson = { groupId: string; n: number; cpk: { text: string }; cpkAbsentReason?: string };

test("engineer: the sheet list, the preview with its banner and spec table, and the data behind a figure", async ({ page }) => {
  await signInViaApi(page, kestrine.engineer);
  const id = await demoDoublerId(page);

  await page.goto("/sheets?q=KDX-2G4");
  const row = page.getByTestId("sheet-row-KDX-2G4");
  await expect(row.getByRole("link", { name: "KDX-2G4" })).toHaveAttribute("href", `/sheets/${id}`);
  await expect(row.getByTestId("limits-set")).toHaveText(/^[1-9]\d*$/);
  await expect(row.getByTestId("approved-sets")).toHaveText(/^[1-9]\d*$/);

  // The stand-in is held back until the test has seen the frame say it is rendering (a fixed delay
  // raced the scroll on a loaded machine).
  let sendPdf = () => {};
  const pdfRequests = await stubDraftPdf(page, new Promise<void>((resolve) => (sendPdf = resolve)));
  await page.goto(`/sheets/${id}`);
  const webSheet = page.getByTestId("web-sheet");
  await expect(webSheet.getByRole("status").filter({ hasText: "PRELIMINARY" })).toBeVisible();
  await expect(webSheet.getByRole("heading", { name: "Electrical specifications" })).toBeVisible();
  const specTable = page.getByTestId("spec-data-table");
  await expect(specTable).toBeVisible();
  await expect(page.getByTestId("sheet-issues")).toBeVisible();

  const value = specTable.getByTestId("spec-value").first();
  const groupId = await value.locator("xpath=ancestor::tr[1]").getAttribute("data-group-id");
  const panel = page.getByRole("dialog", { name: /./ });
  // A click that lands before hydration does nothing: try again until the panel opens.
  await expect(async () => {
    await value.click();
    await expect(panel).toBeVisible({ timeout: 2_000 });
  }).toPass();

  const model = (await (await page.request.get(`/api/devices/${id}/sheet`)).json()) as { sheet: { statistics: { groups: GroupJson[] } } };
  const group = model.sheet.statistics.groups.find((g) => g.groupId === groupId)!;
  expect(group, "the clicked row's statistics group").toBeTruthy();
  await expect(panel.getByTestId("panel-n")).toHaveText(String(group.n));
  await expect(panel.getByTestId("panel-cpk")).toContainText(group.cpk.text || "—");
  await expect(panel.getByTestId("panel-cpk")).toContainText("threshold");
  // Below the organization's minimum of units the panel says why Cpk is blank (lib/sheet/statistics.ts).
  if (group.cpkAbsentReason) await expect(panel.getByTestId("panel-cpk")).toContainText(group.cpkAbsentReason);
  await expect(panel.getByTestId("panel-units").locator("tbody tr")).toHaveCount(group.n);
  await expect(panel.getByTestId("panel-units").getByRole("link").first()).toHaveAttribute("href", new RegExp(`^/devices/${id}/measurements/\\d+$`));

  await page.keyboard.press("Escape");
  await expect(panel).toBeHidden();
  await expect(value).toBeFocused();

  // The PDF is asked for only when its frame comes near the screen, and says it is rendering meanwhile.
  const pdf = page.getByTestId("pdf-preview");
  await pdf.scrollIntoViewIfNeeded();
  await expect(pdf.getByText("Rendering PDF…")).toBeVisible();
  sendPdf();
  await expect(pdf.locator("iframe")).toBeVisible();
  expect(pdfRequests.length).toBeGreaterThan(0);
  expect(new Set(pdfRequests)).toEqual(new Set([`/api/devices/${id}/sheet/pdf`]));
});

test("engineer: a limit entered in the editor is judged (Cpk and flags), then taken out again", async ({ page }) => {
  await signInViaApi(page, kestrine.engineer);
  const id = await demoDoublerId(page);
  await stubDraftPdf(page);
  await page.goto(`/sheets/${id}`);
  await openTab(page, "Spec limits", "spec-limits-editor");
  const editor = page.getByTestId("spec-limits-editor");
  // The demo sheet states only a typical optimum drive: a line with no min or max, put back as found.
  const line = editor.getByTestId("limit-row").filter({ hasText: "Optimum drive" }).first();
  const max = line.getByRole("textbox", { name: /^max / });
  const typ = line.getByRole("textbox", { name: /^typ / });
  await expect(line.getByRole("textbox", { name: /^min / })).toHaveValue("");
  await expect(max).toHaveValue("");
  const typBefore = await typ.inputValue();
  const statistics = line.getByTestId("limit-statistics");
  const minText = (await statistics.locator("dt", { hasText: /^min$/ }).locator("xpath=following-sibling::dd[1]").textContent())!;
  const units = Number(await statistics.locator("dt", { hasText: /^n$/ }).locator("xpath=following-sibling::dd[1]").textContent());
  expect(units, "units behind the first optimum-drive line").toBeLessThan(10);

  try {
    // A maximum below the smallest unit: every unit fails and Cpk is negative, far below any threshold.
    const tight = (Number(minText.replace("\u2212", "-")) - 1).toFixed(2);
    await max.fill(tight);
    await editor.getByRole("button", { name: "Save limits" }).click();
    await expect(editor.getByRole("status").filter({ hasText: "Saved" })).toBeVisible();
    await expect(line.getByTestId("flag-list")).toContainText("Cpk below threshold");
    await expect(line.getByTestId("flag-list")).toContainText("Unit outside the guard-banded limit");
    // The demo's optimum-drive lines have fewer units than the organization's 10 behind a printed Cpk: blank, yet still judged.
    await expect(statistics.locator("dd").last()).toHaveText("\u2014");

    await page.getByRole("tab", { name: "Preview" }).click();
    await page.getByTestId("spec-data-table").getByRole("button", { name: /^Data for Optimum drive/ }).first().click();
    const panel = page.getByTestId("statistics-panel");
    await expect(panel.getByTestId("panel-cpk")).toContainText(`Cpk is not stated: ${units} units were measured`);
    await expect(panel.getByTestId("panel-units")).toContainText("fail");
    await page.keyboard.press("Escape");

    // A typed error comes back as words, and nothing is sent.
    await page.getByRole("tab", { name: "Spec limits" }).click();
    await line.getByRole("textbox", { name: /^min / }).fill("twelve");
    await editor.getByRole("button", { name: "Save limits" }).click();
    await expect(line.getByRole("alert")).toContainText("Min: not a number");
    await line.getByRole("textbox", { name: /^min / }).fill("");
  } finally {
    // Wherever a failed step left the page, the line is put back as found.
    await page.keyboard.press("Escape");
    await openTab(page, "Spec limits", "spec-limits-editor");
    await max.fill("");
    await typ.fill(typBefore);
    await editor.getByRole("button", { name: "Save limits" }).click();
    await expect(editor.getByRole("status").filter({ hasText: "Saved" })).toBeVisible();
  }
  await expect(line.getByTestId("flag-list")).toHaveCount(0);
});

test("engineer: prose full of script payloads is shown as text and runs nothing; the prose is put back", async ({ page }) => {
  expect(xssPayloads.length).toBeGreaterThanOrEqual(20);
  const dialogs: string[] = [];
  page.on("dialog", async (dialog) => {
    dialogs.push(dialog.message());
    await dialog.dismiss();
  });
  await signInViaApi(page, kestrine.engineer);
  const id = await demoDoublerId(page);

  await stubDraftPdf(page);
  await page.goto(`/sheets/${id}`);
  await openTab(page, "Prose and ratings", "prose-editor");
  const editor = page.getByTestId("prose-editor");
  const applications = editor.getByTestId("prose-applications");
  await expect(applications).toBeVisible();
  // A run stopped half-way leaves its corpus behind: that is not what to put back.
  const shown = await applications.inputValue();
  const original = shown.startsWith("xss-corpus-") ? "" : shown;
  const marker = `xss-corpus-${Date.now().toString(36)}`;

  try {
    await applications.fill([marker, ...xssPayloads].join("\n\n"));
    await editor.getByRole("button", { name: "Save text and ratings" }).click();
    await expect(editor.getByRole("status").filter({ hasText: "Saved" })).toBeVisible();

    await page.goto(`/sheets/${id}`);
    const webSheet = page.getByTestId("web-sheet");
    await expect(webSheet).toContainText(marker);
    await expect(webSheet).toContainText("click me (markdown)");
    // Give event handlers, autofocus, meta refresh and frames time to fire if any survived.
    await page.waitForTimeout(2_000);

    expect(dialogs, "no alert, confirm or prompt opened").toEqual([]);
    expect(await page.evaluate(() => (window as unknown as { __xss?: unknown }).__xss), "window.__xss stays unset").toBeUndefined();
    await expect(page).toHaveURL(new RegExp(`/sheets/${id}$`));

    const found = await webSheet.evaluate((root) => {
      const sheet = root.querySelector("article.sheet-view")!;
      const handlers = Array.from(sheet.querySelectorAll("*")).filter((el) => Array.from(el.attributes).some((a) => /^on/i.test(a.name)));
      // The package outline is the server's own PNG (signature checked, or rasterised from a checked SVG), carried as a
      // data URI in the frozen model: the one data: source allowed, and only as a PNG in that section.
      const ownOutline = (el: Element) =>
        el.matches('section[aria-labelledby="sheet-package-outline"] img') && /^data:image\/png;base64,[A-Za-z0-9+/=]+$/.test(el.getAttribute("src") ?? "");
      const badLinks = Array.from(sheet.querySelectorAll("[href], [src], [action], [data], [srcdoc]")).filter(
        (el) => !ownOutline(el) && ["href", "src", "action", "data", "srcdoc"].some((name) => /^\s*(javascript|data|vbscript):|<script/i.test(el.getAttribute(name) ?? "")),
      );
      return {
        scripts: sheet.querySelectorAll("script").length,
        frames: sheet.querySelectorAll("iframe, object, embed, form, input, meta, style:not(:first-child)").length,
        styleAttributes: Array.from(sheet.querySelectorAll("[style]")).filter((el) => /expression|javascript/i.test(el.getAttribute("style") ?? "")).length,
        handlers: handlers.map((el) => el.outerHTML.slice(0, 80)),
        badLinks: badLinks.map((el) => el.outerHTML.slice(0, 80)),
      };
    });
    expect(found).toEqual({ scripts: 0, frames: 0, styleAttributes: 0, handlers: [], badLinks: [] });
    // Anywhere on the page: no script element carries a payload (the framework's own data scripts hold it only as escaped JSON).
    const payloadScripts = await page.evaluate(() =>
      Array.from(document.querySelectorAll("script")).filter((s) => !s.textContent?.includes("self.__next_f") && /__xss|alert\(/.test(s.textContent ?? "") || /^data:/i.test(s.getAttribute("src") ?? "")).length,
    );
    expect(payloadScripts).toBe(0);
  } finally {
    await page.goto(`/sheets/${id}`);
    await openTab(page, "Prose and ratings", "prose-editor");
    await applications.fill(original);
    await editor.getByRole("button", { name: "Save text and ratings" }).click();
    await expect(editor.getByRole("status").filter({ hasText: "Saved" })).toBeVisible();
  }
  await page.goto(`/sheets/${id}`);
  await expect(page.getByTestId("web-sheet")).not.toContainText(marker);
  expect(dialogs).toEqual([]);
});

test("reviewer reads the sheets without editors; a customer is refused", async ({ browser }) => {
  const reviewerContext = await browser.newContext();
  const reviewer = await reviewerContext.newPage();
  await signInViaApi(reviewer, kestrine.reviewer);
  const id = await demoDoublerId(reviewer);
  await stubDraftPdf(reviewer);
  await reviewer.goto("/sheets?q=KDX-2G4");
  await expect(reviewer.getByTestId("sheet-row-KDX-2G4")).toBeVisible();
  await reviewer.goto(`/sheets/${id}`);
  await expect(reviewer.getByTestId("spec-data-table")).toBeVisible();
  await expect(reviewer.getByTestId("sheet-issues")).toBeVisible();
  await expect(reviewer.getByRole("tab")).toHaveCount(0);
  await expect(reviewer.getByTestId("spec-limits-editor")).toHaveCount(0);
  await expect(reviewer.getByTestId("prose-editor")).toHaveCount(0);
  await expect(reviewer.getByRole("textbox")).toHaveCount(0);
  const put = await reviewer.request.put(`/api/devices/${id}/sheet-content`, { data: { prose: {} } });
  expect(put.status(), "the route refuses a reviewer's write too").toBe(403);
  await reviewerContext.close();

  const customerContext = await browser.newContext();
  const page = await customerContext.newPage();
  await signInViaApi(page, customer);
  for (const path of ["/sheets", `/sheets/${id}`]) {
    expect((await page.goto(path))?.status(), `${path} answers 403`).toBe(403);
    await expect(page.getByTestId("forbidden")).toBeVisible();
    await expect(page.getByTestId("sheet-workspace")).toHaveCount(0);
  }
  await customerContext.close();
});
