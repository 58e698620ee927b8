import { expect, test, type Page } from "@playwright/test";
import { expectAccessible } from "./helpers";

// The public catalog as a signed-out visitor uses it: conditions typed as an engineer writes them,
// the search kept in the address, the facets, and a clear message for a condition it cannot read.
// The demo's released sheets (scripts/seed-demo-releases.ts) are what it finds.

test("finds the demo doubler by what it does, and the address holds the search", async ({ page }) => {
  await page.goto("/catalog");
  const form = page.getByRole("search", { name: "Search the catalog" });
  await form.getByLabel("Device class").selectOption("frequency-multiplier");
  await form.getByLabel("Covers the frequency").fill("2 GHz");
  await form.getByLabel("Condition 1").fill("conversion-loss <= 12 dB");
  await form.getByRole("button", { name: "Search" }).click();

  await expect(page).toHaveURL(/class=frequency-multiplier/);
  const url = new URL(page.url());
  expect(url.searchParams.get("covers")).toBe("2 GHz");
  expect(url.searchParams.getAll("f").filter(Boolean)).toEqual(["conversion-loss <= 12 dB"]);

  const results = page.getByTestId("catalog-results");
  const doubler = results.getByRole("link", { name: "KDX-2G4" });
  await expect(doubler).toHaveAttribute("href", "/datasheets/kestrine/KDX-2G4/B");
  // The chosen class is marked in its facet (with a word, not colour alone) and links back to all classes.
  await expect(page.getByTestId("catalog-facets").getByRole("link", { name: /Frequency multiplier, selected/ })).toBeVisible();

  // The same address opened again gives the same results.
  await page.goto(url.toString());
  await expect(page.getByTestId("catalog-results").getByRole("link", { name: "KDX-2G4" })).toBeVisible();
});

test("says which condition it cannot read, and keeps what was typed", async ({ page }) => {
  await page.goto("/catalog");
  const form = page.getByRole("search", { name: "Search the catalog" });
  await form.getByLabel("Condition 1").fill("conversion-loss <= 10 furlongs");
  await form.getByRole("button", { name: "Search" }).click();
  await expect(page.getByTestId("catalog-issues").getByRole("alert")).toContainText('unknown unit "furlongs"');
  await expect(form.getByLabel("Condition 1")).toHaveValue("conversion-loss <= 10 furlongs");
});

test("sorts by a figure through the column header, with the order announced", async ({ page }) => {
  await page.goto("/catalog?class=frequency-multiplier");
  const header = page.getByTestId("catalog-results").getByRole("columnheader", { name: /CL/ });
  await header.getByRole("link").click();
  await expect(page).toHaveURL(/sort=conversion-loss\.max/);
  await expect(page.getByTestId("catalog-results").getByRole("columnheader", { name: /CL/ })).toHaveAttribute("aria-sort", "ascending");
});

test("one vendor's demo parts, counted per class in the facet; a hybrid found by the frequency it covers", async ({ page }) => {
  // The demo catalog (scripts/seed-demo-catalog.ts): Pellacourt released PX-80, PM-7L, PS-900 and, in the story, PS-2W.
  await page.goto("/catalog?org=pellacourt");
  const results = page.getByTestId("catalog-results");
  for (const part of ["PM-7L", "PS-2W", "PS-900", "PX-80"]) await expect(results.getByRole("link", { name: part, exact: true })).toBeVisible();
  const classes = page.getByTestId("catalog-facets").getByRole("navigation", { name: "Device class" });
  const countOf = (label: string) => classes.getByRole("listitem").filter({ hasText: label }).locator("span.figure");
  await expect(countOf("Quadrature hybrid or power splitter")).toHaveText("2");
  await expect(countOf("Double-balanced mixer")).toHaveText("1");
  await expect(countOf("Frequency multiplier")).toHaveText("1");

  const form = page.getByRole("search", { name: "Search the catalog" });
  await page.goto("/catalog");
  await form.getByLabel("Device class").selectOption("quadrature-hybrid");
  await form.getByLabel("Covers the frequency").fill("3.5 GHz");
  await form.getByRole("button", { name: "Search" }).click();
  await expect(page).toHaveURL(/covers=3\.5/);
  await expect(page.getByTestId("catalog-results").getByRole("link", { name: "KQH-3G5", exact: true })).toHaveAttribute("href", "/datasheets/kestrine/KQH-3G5/A");
  await expect(page.getByTestId("catalog-results").getByRole("link", { name: "KQH-2G", exact: true })).toHaveCount(0);
});

test("is accessible: the search form, the facets, a class's result table, and a refused query", async ({ page }) => {
  await page.goto("/catalog");
  await expectAccessible(page, "the catalog");
  await page.goto("/catalog?class=frequency-multiplier&sort=conversion-loss.max&dir=desc");
  await expect(page.getByTestId("catalog-results")).toBeVisible();
  await expectAccessible(page, "a class's results");
  await page.goto("/catalog?f=warp-factor%3C%3D9");
  await expect(page.getByTestId("catalog-issues")).toBeVisible();
  await expectAccessible(page, "a refused query");
});
