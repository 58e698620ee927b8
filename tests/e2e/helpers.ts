import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";

export const demoPassword = "bench-demo-2026";

export const demoUsers = {
  admin: { email: "mira.okafor@wrenfield-lab.example", name: "Mira Okafor", organization: "Wrenfield RF Test Laboratory" },
  engineer: { email: "tomas.lindqvist@wrenfield-lab.example", name: "Tomas Lindqvist", organization: "Wrenfield RF Test Laboratory" },
  reviewer: { email: "priya.raman@wrenfield-lab.example", name: "Priya Raman", organization: "Wrenfield RF Test Laboratory" },
  customer: { email: "anneli.vos@tarnby-radio.example", name: "Anneli Vos", organization: "Tarnby Radio Systems" },
} as const;

export type DemoRole = keyof typeof demoUsers;

/**
 * Signs in through next-auth's credentials callback with the page's own request context,
 * so the session cookie lands in the browser context the test then drives.
 */
export async function signInViaApi(page: Page, email: string, password = demoPassword): Promise<void> {
  const csrfResponse = await page.request.get("/api/auth/csrf");
  expect(csrfResponse.ok(), "GET /api/auth/csrf").toBeTruthy();
  const { csrfToken } = (await csrfResponse.json()) as { csrfToken: string };
  const response = await page.request.post("/api/auth/callback/credentials", {
    form: { csrfToken, email, password, json: "true" },
  });
  expect(response.status(), "credentials callback").toBeLessThan(400);
  const me = await page.request.get("/api/me");
  expect(me.status(), `signed in as ${email}`).toBe(200);
}

export async function signInAs(page: Page, role: DemoRole): Promise<void> {
  await signInViaApi(page, demoUsers[role].email);
}

/** The main navigation's link texts, in order. */
export function mainNavigationLinks(page: Page) {
  return page.getByRole("navigation", { name: "Main" }).getByRole("link");
}

export async function expectRefused(page: Page, path: string): Promise<void> {
  const response = await page.goto(path);
  expect(response?.status(), `${path} answers 403`).toBe(403);
  await expect(page).toHaveURL(new RegExp(`${path.replace(/\//g, "\\/")}$`));
  await expect(page.getByTestId("forbidden")).toBeVisible();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Your role does not open");
}

/**
 * WCAG 2.0/2.1 A and AA rules of axe-core on one region of the page (the main region unless named):
 * no violation. A scan of a long page can take tens of seconds on a loaded machine, so each scan adds
 * its own 30 s to the test's budget rather than eating into the steps around it.
 */
export async function expectAccessible(page: Page, what: string, scope = "main"): Promise<void> {
  test.info().setTimeout(test.info().timeout + 30_000);
  const results = await new AxeBuilder({ page }).include(scope).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  const found = results.violations.map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
  expect(found, `axe-core on ${what}`).toEqual([]);
}
