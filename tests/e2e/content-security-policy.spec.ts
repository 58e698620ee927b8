import { expect as baseExpect, test, type Page } from "@playwright/test";
import { signInAs, signInViaApi } from "./helpers";

// The main pages under the real Content-Security-Policy (proxy.ts): nothing the app ships may be
// refused. A refusal shows up twice: as a `securitypolicyviolation` event in the page and as a
// console message ("Refused to …"); both are collected from before the first script runs.
test.describe.configure({ timeout: 180_000 });
const expect = baseExpect.configure({ timeout: 60_000 });

// Kestrine Microwave's demo doubler has approved measurement sets (scripts/seed-demo-measurements.ts).
const kestrineEngineer = "elena.marchetti@kestrine.example";

type Watch = { violations: string[]; console: string[]; documents: { url: string; policy: string | undefined }[] };

async function watchPolicy(page: Page): Promise<Watch> {
  const watch: Watch = { violations: [], console: [], documents: [] };
  page.on("response", (response) => {
    if (response.request().resourceType() === "document" && response.frame() === page.mainFrame()) {
      watch.documents.push({ url: response.url(), policy: response.headers()["content-security-policy"] });
    }
  });
  // A binding, not a page global: it survives navigations and reaches every frame, the
  // sheet page's blob: PDF frame (which inherits the page's policy) included.
  await page.exposeFunction("__benchfoldPolicyViolation", (text: string) => watch.violations.push(text));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      const report = (window as unknown as { __benchfoldPolicyViolation: (text: string) => void }).__benchfoldPolicyViolation;
      report(`${e.effectiveDirective} blocked ${e.blockedURI || "(inline)"} at ${e.sourceFile || location.href}:${e.lineNumber}`);
    });
  });
  page.on("console", (message) => {
    if (/content security policy|refused to/i.test(message.text())) watch.console.push(`${message.type()}: ${message.text()}`);
  });
  page.on("pageerror", (error) => {
    if (/content security policy|unsafe-eval/i.test(error.message)) watch.console.push(`pageerror: ${error.message}`);
  });
  return watch;
}

function expectNoViolations(watch: Watch, what: string): void {
  // A page without the policy would have nothing to violate: each one loaded must carry it.
  expect(watch.documents.length, `${what}: pages loaded`).toBeGreaterThan(0);
  for (const { url, policy } of watch.documents) expect(policy, url).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic';/);
  expect(watch.violations, `${what}: securitypolicyviolation events`).toEqual([]);
  expect(watch.console, `${what}: console`).toEqual([]);
}

/** Waits for React to take over the page: the nonce'd bootstrap and its chunks ran. */
async function expectHydrated(page: Page): Promise<void> {
  await expect.poll(() => page.evaluate(() => Boolean(document.querySelector("#content")) && "__next_f" in window)).toBe(true);
  await page.waitForLoadState("networkidle");
}

async function demoDoubler(page: Page): Promise<{ id: number; setId: number }> {
  const devices = (await (await page.request.get("/api/devices")).json()) as { devices: { id: number; partNumber: string }[] };
  const id = devices.devices.find((d) => d.partNumber === "KDX-2G4")!.id;
  const sets = (await (await page.request.get(`/api/devices/${id}/measurements`)).json()) as { measurementSets: { id: number; kind: string }[] };
  const set = sets.measurementSets.find((s) => s.kind === "drive-sweep");
  expect(set, "a drive-sweep set of KDX-2G4").toBeTruthy();
  return { id, setId: set!.id };
}

test("the policy watch sees a refusal: a script injected into the page's HTML without the nonce does not run", async ({ page }) => {
  const watch = await watchPolicy(page);
  // The server's real answer, headers and all, with one inline script added as an injection would.
  await page.route("/", async (route) => {
    const response = await route.fetch();
    const html = (await response.text()).replace("</body>", "<script>window.__injected = true</script></body>");
    await route.fulfill({ response, body: html });
  });
  await page.goto("/");
  await expectHydrated(page);
  expect(await page.evaluate(() => (window as unknown as { __injected?: boolean }).__injected === true), "the injected script ran").toBe(false);
  await expect.poll(() => watch.violations).toEqual([expect.stringMatching(/^script-src-elem blocked inline/)]);
  await expect.poll(() => watch.console).toEqual([expect.stringMatching(/Content Security Policy/)]);
});

test("signed out: home, catalog and sign-in run under the policy", async ({ page }) => {
  const watch = await watchPolicy(page);
  for (const path of ["/", "/catalog", "/sign-in"]) {
    await page.goto(path);
    await expectHydrated(page);
  }
  // A client-side navigation loads the next page's chunks under the first page's policy.
  await page.goto("/");
  await expectHydrated(page);
  await page.getByRole("link", { name: "Sign in" }).first().click();
  await expect(page).toHaveURL(/\/sign-in$/);
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
  expectNoViolations(watch, "signed out");
});

test("customer: the catalog runs under the policy", async ({ page }) => {
  const watch = await watchPolicy(page);
  await signInAs(page, "customer");
  await page.goto("/catalog");
  await expectHydrated(page);
  expectNoViolations(watch, "customer catalog");
});

test("engineer: a measurement set's chart draws in the browser (Vega's interpreter, no eval)", async ({ page }) => {
  const watch = await watchPolicy(page);
  await signInViaApi(page, kestrineEngineer);
  const { id, setId } = await demoDoubler(page);

  await page.goto(`/devices/${id}`);
  await expectHydrated(page);

  await page.goto(`/devices/${id}/measurements/${setId}`);
  await expectHydrated(page);
  const figure = page.getByTestId("curve-figure").first();
  // The chart or its error line, whichever comes first: a refused chart fails at once.
  await expect(figure.locator("svg, p:has-text('could not be drawn')").first()).toBeVisible();
  await expect(figure).not.toContainText("could not be drawn");
  // Vega's SVG renderer puts each mark in a <g class="mark-… role-mark">: drawn lines and points.
  await expect.poll(() => figure.locator('svg g[class*="role-mark"] path').count()).toBeGreaterThan(0);
  expectNoViolations(watch, "measurement set page");
});

test("engineer: the sheet workspace, with its server-drawn charts and the PDF preview in a blob: frame", async ({ page }) => {
  const watch = await watchPolicy(page);
  await signInViaApi(page, kestrineEngineer);
  const { id } = await demoDoubler(page);
  // A one-page stand-in for the draft PDF: the frame and its blob: URL are what is checked here,
  // not the render (tests/integration/headers.test.ts reads the real PDF's headers).
  await page.route("**/api/devices/*/sheet/pdf*", (route) => route.fulfill({ status: 200, contentType: "application/pdf", body: minimalPdf }));

  await page.goto(`/sheets/${id}`);
  await expectHydrated(page);
  await expect.poll(() => page.locator('svg g[class*="role-mark"] path').count(), "server-drawn chart marks").toBeGreaterThan(0);
  const preview = page.getByTestId("pdf-preview");
  await preview.scrollIntoViewIfNeeded();
  await expect(preview).toHaveAttribute("data-phase", "ready");
  await expect(preview.locator("iframe")).toHaveAttribute("src", /^blob:/);
  await expect.poll(() => page.frames().some((frame) => frame.url().startsWith("blob:"))).toBe(true);
  await page.frames().find((frame) => frame.url().startsWith("blob:"))!.waitForLoadState();
  expectNoViolations(watch, "sheet workspace");
});

const minimalPdf = Buffer.from(
  "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n" +
    "3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 595 842]>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
);
