import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/models";
import type { CandidateDetail, RevisionSummary } from "@/lib/domain/reviews";
import { TestClient } from "./helpers/client";
import { baseUrl } from "./helpers/loopback";
import { clientsByRole, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { addApprovedSet, deviceWithApprovedData, release, releaseSheet, requestChanges, sign, submitDraft } from "./helpers/reviews";

// The pages of review and release over HTTP: what each shows, to whom, and what answers 404.
// (Who may open each page at all is pages.test.ts's, from the access matrix.)

let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
let otherClients: Map<Who, TestClient>;
let releasedDevicePart: string;
let revisionA: RevisionSummary;
let pending: CandidateDetail;
let foreignCandidateId: number;
let draftOnlyPart: string;

beforeAll(async () => {
  org = await makeOrganization();
  other = await makeOrganization();
  clients = await clientsByRole(org);
  otherClients = await clientsByRole(other);
  const engineer = clients.get("engineer")!;
  const reviewer = clients.get("reviewer")!;

  // Revision A released; then a second submission of the same sheet waits in review against it.
  const deviceId = await deviceWithApprovedData(org.organization.id, engineer, reviewer);
  const first = await submitDraft(engineer, deviceId, "First release, from one unit.");
  expect((await sign(reviewer, first.id)).status).toBe(200);
  const released = await release(engineer, first.id, "Characterized on one unit.");
  expect(released.status).toBe(201);
  revisionA = ((await released.json()) as { revision: RevisionSummary }).revision;
  releasedDevicePart = first.partNumber;
  const prose = await engineer.request(`/api/devices/${deviceId}/sheet-content`, {
    method: "PUT",
    json: { prose: { "test-fixture": "A 50 Ω fixture, its loss de-embedded." }, absoluteMaximumRatings: [], measurementUncertainty: {} },
  });
  expect(prose.status).toBe(200);
  pending = await submitDraft(engineer, deviceId, "The fixture is described now.");

  const otherDevice = await deviceWithApprovedData(other.organization.id, otherClients.get("engineer")!, otherClients.get("reviewer")!);
  foreignCandidateId = (await submitDraft(otherClients.get("engineer")!, otherDevice)).id;
  draftOnlyPart = (await makeDevice(org.organization.id)).partNumber;
});
afterAll(() => closeDb());

/** A page contains the text (the failure names the text, not the whole page). */
function expectHas(html: string, text: string): void {
  expect(html.includes(text), `page contains ${JSON.stringify(text)}`).toBe(true);
}

function expectHasNot(html: string, text: string): void {
  expect(html.includes(text), `page does not contain ${JSON.stringify(text)}`).toBe(false);
}

async function page(who: Who, path: string): Promise<{ status: number; html: string; location: string | null }> {
  const response = await clients.get(who)!.request(path, { headers: { accept: "text/html" } });
  return { status: response.status, html: await response.text(), location: response.headers.get("location") };
}

describe("the review page", () => {
  it("shows the reviewer the candidate, its changes since Rev. A, the engineer's note and the signing block with the digest", async () => {
    const { status, html } = await page("reviewer", `/review/sheets/${pending.id}`);
    expect(status).toBe(200);
    expectHas(html, `candidate #${pending.id}`);
    expectHas(html, "Changes since Rev. A");
    expectHas(html, "The fixture is described now.");
    expectHas(html, "Sign and approve");
    expect(/<input[^>]*type="password"[^>]*autocomplete="current-password"/i.test(html), "a password field for the current password").toBe(true);
    expectHas(html, pending.digest);
  });

  it("shows the engineer who submitted it no decision, and says nothing of signing", async () => {
    const { status, html } = await page("engineer", `/review/sheets/${pending.id}`);
    expect(status).toBe(200);
    expectHas(html, "Changes since Rev. A");
    expectHasNot(html, "Sign and approve");
    expectHasNot(html, "Request changes");
  });

  it("answers 404 for another organization's candidate, a missing one and a malformed id", async () => {
    for (const path of [`/review/sheets/${foreignCandidateId}`, "/review/sheets/2147483000", "/review/sheets/abc"]) {
      const { status, html } = await page("reviewer", path);
      expect(status, path).toBe(404);
      expectHasNot(html, other.organization.name);
    }
  });
});

describe("a comment thread across a resubmission", () => {
  it("stays whole on the new candidate once answered there and resolved: opener and reply", async () => {
    const engineer = clients.get("engineer")!;
    const reviewer = clients.get("reviewer")!;
    const deviceId = await deviceWithApprovedData(org.organization.id, engineer, reviewer);
    const first = await submitDraft(engineer, deviceId);
    const opened = await reviewer.request(`/api/sheet-candidates/${first.id}/comments`, { json: { anchor: { kind: "sheet" }, body: "Describe the fixture." } });
    expect(opened.status).toBe(201);
    const openerId = ((await opened.json()) as { comments: { id: number }[] }).comments[0].id;
    expect((await requestChanges(reviewer, first.id)).status).toBe(200);
    const prose = await engineer.request(`/api/devices/${deviceId}/sheet-content`, {
      method: "PUT",
      json: { prose: { "test-fixture": "A 50 Ω fixture." }, absoluteMaximumRatings: [], measurementUncertainty: {} },
    });
    expect(prose.status).toBe(200);
    const second = await submitDraft(engineer, deviceId);
    const replied = await engineer.request(`/api/sheet-candidates/${second.id}/comments`, { json: { anchor: { kind: "sheet" }, body: "Described.", parentId: openerId } });
    expect(replied.status).toBe(201);
    expect((await reviewer.request(`/api/sheet-comments/${openerId}/resolve`, { method: "POST", json: {} })).status).toBe(200);
    const { candidate } = (await (await reviewer.request(`/api/sheet-candidates/${second.id}`)).json()) as { candidate: CandidateDetail };
    expect(candidate.comments.map((c) => [c.body, c.parentId === null, c.resolvedAt !== null || c.parentId !== null])).toEqual([
      ["Describe the fixture.", true, true],
      ["Described.", false, true],
    ]);
  });
});

describe("the review queue", () => {
  it("lists the candidate in review for a reviewer of the organization, with what it is compared with", async () => {
    const { status, html } = await page("reviewer", "/review");
    expect(status).toBe(200);
    expectHas(html, `/review/sheets/${pending.id}`);
    expectHas(html, "Rev. A");
    expectHasNot(html, `/review/sheets/${foreignCandidateId}`);
  });
});

describe("the public released sheet", () => {
  it("draws revision A from its frozen model, titled by part and letter, with its canonical address, PDF and signer", async () => {
    const { status, html } = await page("signed-out", revisionA.publicPath);
    expect(status).toBe(200);
    expectHas(html, `<title>${releasedDevicePart} Rev. A · Benchfold</title>`);
    expectHas(html, `<link rel="canonical" href="${new URL(revisionA.publicPath, baseUrl).toString()}"`);
    expectHas(html, `${revisionA.pdfPath}?download=1`);
    expectHas(html, org.users.reviewer.name);
    // The candidate in review changed the prose; the released page shows what was released.
    expectHasNot(html, "its loss de-embedded");
  });

  it("names the current revision through /current, canonically by its letter", async () => {
    const { status, html } = await page("signed-out", revisionA.publicPath.replace(/\/A$/, "/current"));
    expect(status).toBe(200);
    expectHas(html, `<title>${releasedDevicePart} Rev. A · Benchfold</title>`);
    expectHas(html, `<link rel="canonical" href="${new URL(revisionA.publicPath, baseUrl).toString()}"`);
  });

  it("answers 404 for a letter never released and for a device with a draft only", async () => {
    expect((await page("signed-out", revisionA.publicPath.replace(/\/A$/, "/B"))).status).toBe(404);
    const draftOnly = revisionA.publicPath.replace(encodeURIComponent(releasedDevicePart), encodeURIComponent(draftOnlyPart));
    const { status, html } = await page("signed-out", draftOnly);
    expect(status).toBe(404);
    expectHasNot(html, draftOnlyPart + " Rev.");
  });

  it("sends a verification reference to its revision's page (308) and an unknown one to a 404", async () => {
    const known = await page("signed-out", `/r/${revisionA.reference}`);
    expect(known.status).toBe(308);
    expect(new URL(known.location ?? "", baseUrl).pathname).toBe(revisionA.publicPath);
    expect((await page("signed-out", `/r/${revisionA.reference.toLowerCase()}`)).status).toBe(308);
    expect((await page("signed-out", "/r/00000-00000")).status).toBe(404);
  });
});

describe("a part number with a slash", () => {
  it("has a public page and a PDF at its encoded address, and its reference leads there", async () => {
    const engineer = clients.get("engineer")!;
    const reviewer = clients.get("reviewer")!;
    const device = await makeDevice(org.organization.id, `KX/2-${Date.now().toString(36)}`);
    await addApprovedSet(device.id, engineer, reviewer);
    const revision = await releaseSheet(engineer, reviewer, device.id);
    expect(revision.publicPath).toContain(encodeURIComponent(device.partNumber));
    const { status, html } = await page("signed-out", revision.publicPath);
    expect(status).toBe(200);
    expectHas(html, `<title>${device.partNumber} Rev. A · Benchfold</title>`);
    const pdf = await clients.get("signed-out")!.request(revision.pdfPath);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    const redirect = await page("signed-out", `/r/${revision.reference}`);
    expect(redirect.status).toBe(308);
    expect(new URL(redirect.location ?? "", baseUrl).pathname).toBe(revision.publicPath);
  });
});

describe("the device page and the sheet workspace", () => {
  it("list revision A with its signer, standing, PDF and public page", async () => {
    for (const path of [`/devices/${revisionA.deviceId}`, `/sheets/${revisionA.deviceId}`]) {
      const { status, html } = await page("engineer", path);
      expect(status, path).toBe(200);
      expectHas(html, "Revision history");
      expectHas(html, org.users.reviewer.name);
      expectHas(html, revisionA.pdfPath);
      expectHas(html, revisionA.publicPath);
    }
  });

  it("shows the sheet's state in words: in review, with a link to the candidate's review page", async () => {
    for (const path of [`/sheets/${revisionA.deviceId}`, `/devices/${revisionA.deviceId}`]) {
      const { html } = await page("reviewer", path);
      expect(/data-state="in-review"[^>]*>(<span[^>]*>[^<]*<\/span>)?In review/.test(html), `${path} says "In review"`).toBe(true);
      expectHas(html, `/review/sheets/${pending.id}`);
    }
  });
});
