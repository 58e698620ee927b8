import { expect, test } from "@playwright/test";
import { demoPassword, demoUsers, mainNavigationLinks, signInViaApi } from "./helpers";

test("signing in through the form lands on the role's first page, and signing out ends the session", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").fill(demoUsers.engineer.email);
  await page.getByLabel("Password").fill(demoPassword);
  await page.getByRole("button", { name: "Sign in" }).click();

  // Two hops: the form goes to /sign-in, which forwards a signed-in engineer to /devices.
  await expect(page).toHaveURL(/\/devices$/, { timeout: 15_000 });
  await expect(page.getByTestId("session-name")).toHaveText(demoUsers.engineer.name);
  await expect(mainNavigationLinks(page)).toHaveText(["Devices", "Sheets", "Catalog"]);

  const signedInCookies = await page.context().cookies();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("banner").getByRole("link", { name: "Sign in" })).toBeVisible();
  expect((await page.request.get("/api/me")).status()).toBe(401);
  // The server ended the session: the old cookie, put back, is refused.
  await page.context().addCookies(signedInCookies);
  expect((await page.request.get("/api/me")).status()).toBe(401);
});

test.describe("before the page's scripts have run", () => {
  // A click that lands before React hydrates the header must still sign out: Sign out is a plain
  // form. (A script-only button ignored such a click, and the header kept the person signed in.)
  test.use({ javaScriptEnabled: false });

  test("Sign out ends the session", async ({ page }) => {
    await signInViaApi(page, demoUsers.reviewer.email);
    await page.goto("/devices");
    await expect(page.getByTestId("session-name")).toHaveText(demoUsers.reviewer.name);
    await page.getByRole("button", { name: "Sign out" }).click();
    await expect(page.getByRole("banner").getByRole("link", { name: "Sign in" })).toBeVisible();
    await expect(page).toHaveURL(/\/$/);
    expect((await page.request.get("/api/me")).status()).toBe(401);
  });
});

test("a wrong password is refused with a message, and the person stays signed out", async ({ page }) => {
  // A fresh address, so this test never counts against a demo account's attempt limit.
  const email = `nobody-${Date.now()}-${Math.random().toString(36).slice(2, 8)}@benchfold-tests.example`;
  await page.goto("/sign-in?next=%2Fdevices");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();

  await expect(page.getByTestId("sign-in-form").getByRole("alert")).toContainText("do not match an active account");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fdevices$/);
  expect((await page.request.get("/api/me")).status()).toBe(401);
});
