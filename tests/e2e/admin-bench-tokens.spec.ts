import { expect as baseExpect, test } from "@playwright/test";
import { signInAs } from "./helpers";

test.describe.configure({ timeout: 120_000 });
const expect = baseExpect.configure({ timeout: 30_000 });

test("an administrator creates a bench token, sees it once with a curl example, and revokes it", async ({ page }) => {
  await signInAs(page, "admin");
  await page.goto("/admin/bench-tokens");
  const name = `Bench ${Date.now().toString(36)} doubler script`;
  await page.getByTestId("bench-token-form").getByLabel("Name").fill(name);
  await page.getByRole("button", { name: "Create token" }).click();

  const created = page.getByTestId("created-token");
  const token = (await created.getByTestId("created-token-value").textContent())?.trim() ?? "";
  expect(token).toMatch(/^bfd_[A-Za-z0-9_-]{20,}$/);
  await expect(created).toContainText(`Authorization: Bearer ${token}`);
  await expect(created).toContainText("/api/v1/measurements");

  const row = page.getByTestId("bench-tokens-table").getByRole("row", { name: new RegExp(name) });
  await expect(row).toContainText(token.slice(0, 10));
  await expect(row).toContainText("never");
  await expect(row).toContainText("Active");
  // The plaintext is not in the list.
  await expect(page.getByTestId("bench-tokens-table")).not.toContainText(token);

  // The bench API knows the token until it is revoked (an empty body is refused, but not as unauthenticated).
  const before = await page.request.post("/api/v1/measurements", { headers: { authorization: `Bearer ${token}` } });
  expect(before.status()).not.toBe(401);

  page.once("dialog", (dialog) => void dialog.accept());
  await row.getByRole("button", { name: /Revoke/ }).click();
  await expect(row).toContainText("Revoked");
  await expect(page.getByTestId("created-token")).toHaveCount(0);

  const after = await page.request.post("/api/v1/measurements", { headers: { authorization: `Bearer ${token}` } });
  expect(after.status()).toBe(401);
});
