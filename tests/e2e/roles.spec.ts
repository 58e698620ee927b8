import { expect, test } from "@playwright/test";
import { demoUsers, expectRefused, mainNavigationLinks, signInAs } from "./helpers";

test.describe("each role sees its own workspace", () => {
  test("administrator: devices, people, instruments, bench tokens and catalog; manages people; no sheet drafts", async ({ page }) => {
    await signInAs(page, "admin");
    await page.goto("/admin/users");
    await expect(mainNavigationLinks(page)).toHaveText(["Devices", "People", "Instruments", "Bench tokens", "Catalog"]);
    await expect(page.getByTestId("session-name")).toHaveText(demoUsers.admin.name);
    await expect(page.getByTestId("session-role")).toHaveText("Administrator");
    await expect(page.getByTestId("session-organization")).toHaveText(demoUsers.admin.organization);

    const people = page.getByTestId("people-table");
    await expect(people.getByRole("row", { name: /Tomas Lindqvist/ })).toBeVisible();
    await expect(people.getByLabel("Role of Tomas Lindqvist")).toHaveValue("engineer");
    await expect(people).not.toContainText("anneli.vos@tarnby-radio.example");
    await expect(page.getByTestId("invite-form")).toBeVisible();

    await expectRefused(page, "/sheets");
  });

  test("engineer: devices, sheets and catalog; reads the device table; no people admin", async ({ page }) => {
    await signInAs(page, "engineer");
    // Searched, so the seeded parts are on the first page however many devices other tests have made.
    await page.goto("/devices?q=WL-C26");
    await expect(mainNavigationLinks(page)).toHaveText(["Devices", "Sheets", "Catalog"]);
    await expect(page.getByTestId("session-role")).toHaveText("Engineer");

    const table = page.getByTestId("devices-table");
    const doubler = table.getByRole("row", { name: /WL-C2611-KDX/ });
    await expect(doubler).toContainText("Frequency multiplier");
    await expect(doubler).toContainText("0.5–1.5\u00a0GHz");
    await expect(doubler).toContainText("+10\u00a0dBm");
    await expect(table.getByRole("row", { name: /WL-C2614-PM13/ })).toContainText("10–3000\u00a0MHz");
    // Another organization's parts never show, not even to a search that would match them.
    await page.goto("/devices?q=KDX");
    await expect(page.getByTestId("devices-table")).toContainText("WL-C2611-KDX");
    await expect(page.getByTestId("devices-table")).not.toContainText("KDX-2G4");

    // Searched, as the device list is: the sheets index pages the same way.
    await page.goto("/sheets?q=KDX");
    await expect(page.getByTestId("sheets-table")).toContainText("WL-C2611-KDX");
    await expect(page.getByTestId("sheets-table")).not.toContainText("KDX-2G4");

    await expectRefused(page, "/admin/users");
  });

  test("reviewer: devices, review queue and catalog; reads sheet drafts; no people admin", async ({ page }) => {
    await signInAs(page, "reviewer");
    await page.goto("/review");
    await expect(mainNavigationLinks(page)).toHaveText(["Devices", "Sheets", "Review queue", "Catalog"]);
    await expect(page.getByTestId("session-role")).toHaveText("Reviewer");
    await expect(page.getByRole("heading", { level: 1 })).toHaveText("Review queue");
    // Pending sheets and measurement sets, or a plain statement that none is waiting.
    await expect(page.getByTestId("sheet-review-table").or(page.getByTestId("sheet-review-empty"))).toBeVisible();
    await expect(page.getByTestId("review-queue-table").or(page.getByTestId("review-empty"))).toBeVisible();

    // Reviewers read the drafts they will sign off; they cannot edit them.
    await page.goto("/sheets?q=WL-C26");
    await expect(page.getByTestId("sheets-table")).toContainText("WL-C2611-KDX");
    await expectRefused(page, "/admin/users");
  });

  test("customer: catalog and change notices only; refused workspace pages", async ({ page }) => {
    await signInAs(page, "customer");
    await page.goto("/subscriptions");
    await expect(mainNavigationLinks(page)).toHaveText(["Catalog", "Change notices"]);
    await expect(page.getByTestId("session-organization")).toHaveText(demoUsers.customer.organization);
    await expect(page.getByRole("heading", { level: 1 })).toHaveText("Change notices");

    await expectRefused(page, "/admin/users");
    await expectRefused(page, "/devices");
  });
});

test("signed out: the catalog is open, the workspace sends you to sign in", async ({ page }) => {
  // Searched by part number: the integration tests before this release many parts of their own.
  await page.goto("/catalog?q=KDX-2G4");
  await expect(mainNavigationLinks(page)).toHaveText(["Catalog"]);
  await expect(page.getByTestId("catalog-results").getByRole("link", { name: "KDX-2G4" })).toBeVisible();

  await page.goto("/devices");
  // The workspace layout and the page both guard; either may answer first, with or without `next`.
  await expect(page).toHaveURL(/\/sign-in(\?next=%2Fdevices)?$/);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Sign in");
});
