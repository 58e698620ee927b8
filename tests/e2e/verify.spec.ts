import { createHash, randomBytes } from "node:crypto";
import { closeSync, mkdtempSync, openSync, rmSync, writeSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { expect, test } from "@playwright/test";
import { demoUsers, signInAs } from "./helpers";

// The demo releases KDX-2G4 of Kestrine as A, then B (scripts/seed-demo-releases.ts, run before the tests).
const demoPdf = (letter: string) => `/api/v1/sheets/kestrine/KDX-2G4/${letter}/pdf`;

test("a dropped older printout is named in one sentence, with a word and a mark: superseded by B", async ({ page }) => {
  const pdf = await (await page.request.get(demoPdf("A"))).body();
  await page.goto("/verify");
  await page.getByTestId("verify-file").setInputFiles({ name: "KDX-2G4-rev-A.pdf", mimeType: "application/pdf", buffer: pdf });
  const sentence = page.getByTestId("verify-sentence");
  await expect(sentence).toContainText("Revision A of KDX-2G4");
  await expect(sentence).toContainText("superseded by revision B");
  await expect(sentence).toContainText("Superseded");
  await expect(sentence).toContainText("↻");
  // The browser hashed the same bytes node does (the outside reference), and sent only the hash.
  await expect(page.getByTestId("verify-result")).toContainText(createHash("sha256").update(pdf).digest("hex"));
  await expect(page.getByTestId("verify-result")).toContainText("Released since revision A");
});

test("a pasted footer reference answers current; unknown text is refused in words", async ({ page }) => {
  const current = await page.request.get(demoPdf("B"));
  const reference = (await (await page.request.get(`/api/v1/verify?sha256=${current.headers()["etag"]!.replaceAll('"', "")}`)).json()).verification.reference as string;
  await page.goto("/verify");
  await page.getByLabel("SHA-256 or verification reference").fill(`Verify: ${reference} at http://localhost/r/${reference}`);
  await page.getByRole("button", { name: "Verify", exact: true }).click();
  await expect(page.getByTestId("verify-sentence")).toContainText("Revision B of KDX-2G4");
  await expect(page.getByTestId("verify-sentence")).toContainText("Current");
  await page.getByLabel("SHA-256 or verification reference").fill("not a hash");
  await page.getByRole("button", { name: "Verify", exact: true }).click();
  await expect(page.getByTestId("verify-result").getByRole("alert")).toContainText("Paste the PDF's SHA-256");
});

test("a 200 MB file is hashed in the browser in slices while the page keeps drawing, then named not released", async ({ page }) => {
  test.setTimeout(180_000);
  const dir = mkdtempSync(path.join(tmpdir(), "benchfold-verify-"));
  const file = path.join(dir, "huge.pdf");
  const hash = createHash("sha256");
  const fd = openSync(file, "w");
  const block = randomBytes(1024 * 1024);
  for (let i = 0; i < 200; i++) {
    block[0] = i;
    writeSync(fd, block);
    hash.update(block);
  }
  closeSync(fd);
  const expected = hash.digest("hex");
  try {
    await page.goto("/verify");
    await page.getByTestId("verify-file").setInputFiles(file);
    // The progress is drawn slice by slice: the page is not frozen while it hashes.
    const progress = page.getByRole("progressbar", { name: "Hashing progress" });
    await expect(progress).toBeVisible();
    const seen = new Set<string>();
    await expect
      .poll(async () => {
        const value = await progress.getAttribute("value").catch(() => null);
        if (value) seen.add(value);
        return seen.size;
      }, { timeout: 120_000 })
      .toBeGreaterThanOrEqual(3);
    const sentence = page.getByTestId("verify-sentence");
    await expect(sentence).toContainText("This is not a released Benchfold sheet.", { timeout: 120_000 });
    await expect(sentence).toContainText("Unknown");
    await expect(page.getByTestId("verify-result")).toContainText(expected);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
});

test("a visitor is offered sign-in; the demo customer follows KDX-2G4 from its public page and sees it on the change-notices page", async ({ page }) => {
  await page.goto("/datasheets/kestrine/KDX-2G4/current");
  await expect(page.getByTestId("follow-sign-in")).toContainText("Sign in as a customer");
  await signInAs(page, "customer");
  await page.goto("/datasheets/kestrine/KDX-2G4/current");
  await page.getByRole("button", { name: "Follow this part" }).click();
  await expect(page.getByRole("button", { name: "✓ Following this part" })).toBeDisabled();
  await page.goto("/subscriptions");
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Change notices");
  await expect(page.getByTestId("follows")).toContainText("KDX-2G4 of");
  await expect(page.getByText(demoUsers.customer.organization).first()).toBeVisible();
});

test("staff see no follow button on a released sheet", async ({ page }) => {
  await signInAs(page, "engineer");
  await page.goto("/datasheets/kestrine/KDX-2G4/current");
  await expect(page.getByTestId("released-sheet")).toBeVisible();
  await expect(page.getByTestId("follow")).toHaveCount(0);
  await expect(page.getByTestId("follow-sign-in")).toHaveCount(0);
});

test("a file dropped on the drop area (not chosen) is hashed and answered the same way", async ({ page }) => {
  const pdf = await (await page.request.get(demoPdf("A"))).body();
  await page.goto("/verify");
  const transfer = await page.evaluateHandle((bytes) => {
    const dt = new DataTransfer();
    dt.items.add(new File([new Uint8Array(bytes)], "KDX-2G4-rev-A.pdf", { type: "application/pdf" }));
    return dt;
  }, [...pdf]);
  await page.getByTestId("verify-drop").dispatchEvent("dragover", { dataTransfer: transfer });
  await page.getByTestId("verify-drop").dispatchEvent("drop", { dataTransfer: transfer });
  await expect(page.getByTestId("verify-sentence")).toContainText("superseded by revision B");
});
