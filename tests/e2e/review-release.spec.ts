import { mkdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { expect as baseExpect, test, type Browser, type Locator, type Page } from "@playwright/test";
import { demoPassword, demoUsers, expectAccessible, signInViaApi } from "./helpers";

// Two people take one fresh sheet from draft to revision A and on to revision B: each submission
// freezes the model, each release renders and stores a PDF, and the pages draw the sheet and its
// charts on the server. One test, in order; a busy test server needs time.
test.describe.configure({ mode: "serial", timeout: 600_000 });
const expect = baseExpect.configure({ timeout: 60_000 });

const fixtures = path.join(__dirname, "..", "..", "fixtures");
const screensDir = process.env.BENCHFOLD_E2E_SCREENS;

function randomTag(): string {
  return `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
}

/** The example drive sweep with a note line, so each run uploads new bytes (a duplicate file is refused). */
function uniqueDriveSweep(): Buffer {
  const lines = readFileSync(path.join(fixtures, "examples", "drive-sweep-doubler.csv"), "utf8").split("\n");
  const header = lines.findIndex((l) => !l.startsWith("#"));
  lines.splice(header, 0, `# note: ${randomTag()}`);
  return Buffer.from(lines.join("\n").replace(/\n*$/, "\n"));
}

/**
 * A person in a browser context of their own. The test server trusts loopback as its proxy, so the
 * address each context sends is the one the per-address sign-in limit counts: the one wrong password
 * at signing never adds to other tests' failures from 127.0.0.1 (the per-account limit, five in a
 * quarter of an hour, still counts it).
 */
async function personPage(browser: Browser, email: string): Promise<Page> {
  const address = `10.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 256)}.${1 + Math.floor(Math.random() * 254)}`;
  const context = await browser.newContext({ extraHTTPHeaders: { "x-forwarded-for": address } });
  const page = await context.newPage();
  await signInViaApi(page, email);
  return page;
}

/** With BENCHFOLD_E2E_SCREENS set: the top of the page, and each part named, as PNGs to look at. */
async function screenshot(page: Page, name: string, parts: Record<string, Locator> = {}): Promise<void> {
  if (!screensDir) return;
  mkdirSync(screensDir, { recursive: true });
  await page.screenshot({ path: path.join(screensDir, `${name}.png`) });
  for (const [part, locator] of Object.entries(parts)) await locator.screenshot({ path: path.join(screensDir, `${name}-${part}.png`) });
}

/** A click that lands before hydration does nothing: try again until what it opens is there. */
async function clickUntil(target: Locator, shown: Locator): Promise<void> {
  await expect(async () => {
    await target.click();
    await expect(shown).toBeVisible({ timeout: 2_000 });
  }).toPass();
}

type Group = { groupId: string; parameter: string; conditionsKey: string; unit: string; label: string; mean: { value: number | null }; max: { value: number | null } };

async function sheetGroups(page: Page, deviceId: number): Promise<Group[]> {
  const response = await page.request.get(`/api/devices/${deviceId}/sheet`);
  expect(response.status()).toBe(200);
  return ((await response.json()) as { sheet: { statistics: { groups: Group[] } } }).sheet.statistics.groups;
}

async function putLimit(page: Page, deviceId: number, group: Group, maxValue: number): Promise<void> {
  const response = await page.request.put(`/api/devices/${deviceId}/spec-limits`, {
    data: { limits: [{ parameter: group.parameter, conditionsKey: group.conditionsKey, max: maxValue, unit: group.unit, basis: "characterization" }] },
  });
  expect(response.status(), await response.text()).toBe(200);
}

/** Fills a reason for every open issue in the submission form, then submits; the new candidate's id. */
async function submitFromWorkspace(page: Page, deviceId: number, note: string): Promise<number> {
  await page.goto(`/sheets/${deviceId}`);
  const panel = page.getByTestId("review-release-panel");
  const form = panel.getByTestId("submit-sheet-form");
  await clickUntil(panel.getByText(/^Submit (for review|the sheet again)…$/), form);
  const acknowledgements = form.getByTestId("issue-acknowledgement");
  const count = await acknowledgements.count();
  for (let i = 0; i < count; i++) {
    await acknowledgements.nth(i).getByLabel("Why it may stand").fill(`Stands for this browser test, issue ${i + 1} of ${count}.`);
  }
  await form.getByLabel(/Note to the reviewer/).fill(note);
  await form.getByRole("button", { name: "Submit for review" }).click();
  const done = panel.getByTestId("review-action-done");
  await expect(done).toContainText("Submitted as candidate #");
  const id = Number((await done.textContent())!.match(/candidate #(\d+)/)![1]);
  await expect(panel.getByTestId("review-state")).toHaveText(/In review/);
  return id;
}

test("two people take a sheet through review to revision A, then to revision B with its changes", async ({ browser }) => {
  const engineer = await personPage(browser, demoUsers.engineer.email);
  const reviewer = await personPage(browser, demoUsers.reviewer.email);

  // A fresh device with one approved drive sweep, through the API as the bench and the queue would.
  const partNumber = `RR-${randomTag().toUpperCase()}`;
  const created = await engineer.request.post("/api/devices", {
    data: { partNumber, deviceClass: "frequency-multiplier", title: "Review-path doubler", keyConditions: { multiplicationFactor: 2, driveLevelDbm: 13 } },
  });
  expect(created.status()).toBe(201);
  const deviceId = ((await created.json()) as { device: { id: number } }).device.id;
  const upload = await engineer.request.post(`/api/devices/${deviceId}/measurements`, {
    multipart: { file: { name: "drive-sweep-doubler.csv", mimeType: "text/csv", buffer: uniqueDriveSweep() }, measuredOn: "2026-11-20" },
  });
  expect(upload.status()).toBe(201);
  const setId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
  expect((await reviewer.request.post(`/api/measurements/${setId}/review`, { data: { decision: "approve" } })).status()).toBe(200);
  const group = (await sheetGroups(engineer, deviceId)).find((g) => g.mean.value !== null)!;
  expect(group, "a statistics group with a mean").toBeTruthy();
  await putLimit(engineer, deviceId, group, Math.ceil(group.mean.value! + 6));

  // The engineer sees a draft, and submits it with a reason for every open issue.
  await engineer.goto(`/sheets/${deviceId}`);
  const panel = engineer.getByTestId("review-release-panel");
  await expect(panel.getByTestId("review-state")).toHaveText(/Draft/);
  await expect(panel.getByTestId("revision-history")).toContainText("No revision of this sheet has been released yet");
  const first = await submitFromWorkspace(engineer, deviceId, "First release of the review-path doubler.");
  await expect(panel.getByTestId("open-review")).toHaveAttribute("href", `/review/sheets/${first}`);
  await screenshot(engineer, "1-workspace-in-review", { panel });
  await expectAccessible(engineer, "the workspace's review-and-release panel", '[data-testid="review-release-panel"]');

  // The reviewer finds it in the queue, reads it beside "first release", comments on a row and asks for changes.
  await reviewer.goto("/review");
  const row = reviewer.getByTestId(`sheet-review-row-${first}`);
  await expect(row).toContainText(partNumber);
  await expect(row).toContainText("Nothing (first release)");
  await screenshot(reviewer, "2a-review-queue", { queue: reviewer.getByTestId("sheet-review-queue") });
  await row.getByRole("link", { name: `#${first}` }).click();
  await expect(reviewer).toHaveURL(new RegExp(`/review/sheets/${first}$`));
  const review = reviewer.getByTestId("candidate-review");
  await expect(review.getByTestId("diff-first-release")).toBeVisible();
  await expect(review.getByTestId("engineer-note")).toHaveText("First release of the review-path doubler.");
  await expect(review.getByTestId("acknowledgements")).toContainText("Stands for this browser test, issue 1");
  await expect(review.getByTestId("candidate-sheet").getByRole("heading", { name: "Electrical specifications" })).toBeVisible();
  await expect(review.getByTestId("signed-digest")).toContainText(/[0-9a-f]{64}/);

  const comments = review.getByTestId("comment-threads");
  const commentForm = comments.getByTestId("new-comment-form");
  await commentForm.getByLabel("About").selectOption(`row:${group.groupId}`);
  await commentForm.getByLabel("Comment").fill("Please state the test fixture's loss in the prose.");
  await commentForm.getByRole("button", { name: "Add comment" }).click();
  const thread = comments.getByTestId("comment-thread").first();
  await expect(thread).toContainText("Please state the test fixture's loss in the prose.");
  await expect(thread).toHaveAttribute("data-anchor", `row:${group.groupId}`);
  await expect(thread).toContainText(group.label);
  await expect(thread.getByTestId("thread-state")).toHaveText(/Open/);

  const changes = review.getByTestId("request-changes-form");
  await changes.getByRole("button", { name: "Request changes" }).click();
  await expect(changes.getByText("Say what must change (at least 10 characters).")).toBeVisible();
  await changes.getByLabel("What must change").fill("Describe the test fixture and its loss before release.");
  await changes.getByRole("button", { name: "Request changes" }).click();
  await expect(review.getByTestId("decision-done")).toContainText("Changes requested");
  await expect(review.getByTestId("change-request")).toContainText("Describe the test fixture");

  // The engineer reads why, fixes the prose and submits again; the open thread carries over.
  await engineer.goto(`/sheets/${deviceId}`);
  await expect(panel.getByTestId("review-state")).toHaveText(/Changes requested/);
  await expect(panel.getByTestId("change-request")).toContainText("Describe the test fixture and its loss before release.");
  await screenshot(engineer, "2-workspace-changes-requested", { panel });
  const prose = await engineer.request.put(`/api/devices/${deviceId}/sheet-content`, {
    data: { prose: { "test-fixture": "Measured in a 50 Ω fixture; its 0.4 dB loss is de-embedded." }, absoluteMaximumRatings: [], measurementUncertainty: {} },
  });
  expect(prose.status(), await prose.text()).toBe(200);
  const second = await submitFromWorkspace(engineer, deviceId, "Test fixture described, as asked.");
  expect(second).not.toBe(first);

  // The engineer reads the new candidate's review: no decision for them, but they may answer the thread.
  await engineer.goto(`/review/sheets/${second}`);
  const engineerView = engineer.getByTestId("candidate-review");
  await expect(engineerView.getByTestId("comment-threads")).toBeVisible();
  await expect(engineerView.getByTestId("decision")).toHaveCount(0);
  await expect(engineerView.getByTestId("sign-form")).toHaveCount(0);
  const engineerThread = engineerView.getByTestId("comment-thread").first();
  await expect(engineerThread.getByRole("button", { name: "Resolve thread" })).toHaveCount(0);
  await clickUntil(engineerThread.getByRole("button", { name: "Reply" }), engineerThread.getByLabel("Your reply"));
  await engineerThread.getByLabel("Your reply").fill("Described under Test fixture, with the loss.");
  await engineerThread.getByRole("button", { name: "Send reply" }).click();
  await expect(engineerThread.getByTestId("comment")).toHaveCount(2);

  // The reviewer resolves the thread, then signs: first with a wrong password, then with the right one.
  await reviewer.goto(`/review/sheets/${second}`);
  const carried = comments.getByTestId("comment-thread").first();
  await expect(carried).toContainText("(written on an earlier submission)");
  await expect(carried).toContainText("Described under Test fixture, with the loss.");
  await carried.getByRole("button", { name: "Resolve thread" }).click();
  await expect(carried.getByTestId("thread-state")).toHaveText(/Resolved by/);
  await expect(carried.getByTestId("comment")).toHaveCount(2);
  await screenshot(reviewer, "3-review-page-first-release", { notes: review.getByTestId("engineer-notes"), comments, changes: review.getByTestId("review-changes"), decision: review.getByTestId("decision") });
  await expectAccessible(reviewer, "the review page", '[data-testid="candidate-review"]');

  const sign = review.getByTestId("sign-form");
  await sign.getByLabel("Reviewed and approved for release").check();
  await sign.getByLabel("Your password").fill("not-the-password");
  await sign.getByRole("button", { name: "Sign and approve" }).click();
  await expect(sign.getByRole("alert")).toContainText("The password is not correct");
  await expect(sign.getByLabel("Your password")).toHaveAttribute("aria-invalid", "true");
  await expect(sign.getByLabel("Your password")).toHaveAttribute("autocomplete", "current-password");
  await sign.getByLabel("Your password").fill(demoPassword);
  await sign.getByRole("button", { name: "Sign and approve" }).click();
  await expect(review.getByTestId("decision-done")).toContainText("Signed and approved");
  await expect(review.getByTestId("signatures").getByTestId("signature")).toContainText(demoUsers.reviewer.name);

  // The engineer releases: revision A, with its signature on the public page.
  await engineer.goto(`/sheets/${deviceId}`);
  await expect(panel.getByTestId("review-state")).toHaveText(/Approved/);
  await screenshot(engineer, "4-workspace-approved", { panel });
  const releaseForm = panel.getByTestId("release-form");
  await releaseForm.getByLabel(/Release note/).fill("Characterized on the first lot.");
  await releaseForm.getByRole("button", { name: "Release the sheet" }).click();
  await expect(panel.getByTestId("review-action-done")).toContainText("Released as Rev. A");
  const historyA = panel.getByTestId("revision-history");
  await expect(historyA.getByTestId("revision-A")).toContainText("Current");
  await expect(historyA.getByTestId("revision-A")).toContainText(demoUsers.reviewer.name);
  await expect(historyA.getByTestId("revision-A")).toContainText("Characterized on the first lot.");

  await engineer.getByTestId("review-action-done").getByRole("link", { name: "Its public page" }).click();
  await expect(engineer).toHaveTitle(new RegExp(`^${partNumber} Rev\\. A`));
  const publicSheet = engineer.getByTestId("released-sheet");
  await expect(publicSheet.getByTestId("sheet-release")).toContainText(demoUsers.reviewer.name);
  await expect(publicSheet.getByTestId("sheet-signature")).toContainText("Reviewed and approved for release");
  await expect(publicSheet.getByTestId("download-pdf")).toHaveAttribute("href", /\/api\/v1\/sheets\/.+\/A\/pdf\?download=1$/);
  const canonical = await engineer.locator('link[rel="canonical"]').getAttribute("href");
  expect(new URL(canonical!).pathname).toMatch(/\/datasheets\/.+\/A$/);
  await screenshot(engineer, "5-public-rev-A", { history: publicSheet.getByTestId("revision-history"), release: publicSheet.getByTestId("sheet-release") });
  await expectAccessible(engineer, "the public released sheet", '[data-testid="released-sheet"]');

  // Revision B: one limit tightened; the review page lists it against Rev. A.
  await putLimit(engineer, deviceId, group, Math.ceil(group.mean.value! + 3));
  const third = await submitFromWorkspace(engineer, deviceId, "Tightened after more units.");
  await reviewer.goto(`/review/sheets/${third}`);
  const diff = review.getByTestId("sheet-diff");
  await expect(diff.getByRole("heading", { name: "Changes since Rev. A" })).toBeVisible();
  const tightened = diff.locator('[data-testid="diff-spec-row"][data-kind="tightened"]');
  await expect(tightened).toHaveCount(1);
  await expect(tightened).toContainText(group.label);
  await screenshot(reviewer, "6-review-page-rev-B", { changes: review.getByTestId("review-changes") });
  // "Comment" beside a change points the comment form at that row.
  await expect(async () => {
    await tightened.getByRole("button", { name: /^Comment on / }).click();
    await expect(commentForm.getByLabel("About")).toHaveValue(`row:${group.groupId}`, { timeout: 2_000 });
  }).toPass();
  await expect(commentForm.getByLabel("Comment")).toBeFocused();
  await review.getByTestId("sign-form").getByLabel("Reviewed and approved for release").check();
  await review.getByTestId("sign-form").getByLabel("Your password").fill(demoPassword);
  await review.getByTestId("sign-form").getByRole("button", { name: "Sign and approve" }).click();
  await expect(review.getByTestId("decision-done")).toContainText("Signed and approved");

  await engineer.goto(`/sheets/${deviceId}`);
  await panel.getByTestId("release-form").getByRole("button", { name: "Release the sheet" }).click();
  await expect(panel.getByTestId("review-action-done")).toContainText("Released as Rev. B");
  await expect(panel.getByTestId("revision-B")).toContainText("Current");
  await expect(panel.getByTestId("revision-A")).toContainText("Superseded");

  // The device page and the public pages show the history, newest first; "current" is B.
  await engineer.goto(`/devices/${deviceId}`);
  await expect(engineer.getByTestId("revision-history-table").locator("tbody tr").first()).toHaveAttribute("data-testid", "revision-B");
  await screenshot(engineer, "7-device-history", { history: engineer.getByTestId("revision-history") });
  const publicA = await engineer.getByTestId("revision-A").getByRole("link", { name: "Public page" }).getAttribute("href");
  await engineer.goto(publicA!.replace(/\/A$/, "/current"));
  await expect(engineer).toHaveTitle(new RegExp(`^${partNumber} Rev\\. B`));
  await engineer.goto(publicA!);
  await expect(engineer.getByTestId("superseded-notice")).toContainText("The current revision is Rev. B");
  await expect(engineer.getByTestId("revision-picker").getByRole("link", { name: "Rev. B" })).toBeVisible();
  await screenshot(engineer, "8-public-rev-A-superseded");

  // The PDF's verification reference leads to the revision's page.
  const reference = (await engineer.getByTestId("revision-A").getByText(/^ref\. /).textContent())!.replace("ref. ", "");
  await engineer.goto(`/r/${reference}`);
  await expect(engineer).toHaveURL((url) => url.pathname === publicA);

  // The reviewer withdraws Rev. A with a reason: it keeps its place and its page, with the notice.
  await reviewer.goto(`/devices/${deviceId}`);
  const rowA = reviewer.getByTestId("revision-A");
  const withdraw = rowA.getByTestId("withdraw-revision");
  await clickUntil(withdraw.getByText("Withdraw…"), withdraw.getByLabel("Why Rev. A is withdrawn"));
  await withdraw.getByLabel("Why Rev. A is withdrawn").fill("The fixture loss was de-embedded twice in this revision.");
  await withdraw.getByRole("button", { name: "Withdraw Rev. A" }).click();
  await expect(rowA).toContainText("Withdrawn");
  await expect(rowA.getByTestId("withdrawal-reason")).toContainText("de-embedded twice");
  await reviewer.goto(publicA!);
  await expect(reviewer.getByTestId("released-web-sheet").getByTestId("sheet-withdrawn")).toContainText("de-embedded twice");
  await screenshot(reviewer, "9-public-rev-A-withdrawn");
  await expectAccessible(reviewer, "a withdrawn revision's public page", '[data-testid="released-sheet"]');
});
