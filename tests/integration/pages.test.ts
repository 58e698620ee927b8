import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import type { UserRole } from "@/models/user";
import { isPublic, pageResources, type PageRoute, type Resource } from "@/lib/access/matrix";
import { verdictFor } from "./helpers/access";
import { TestClient } from "./helpers/client";
import { baseUrl } from "./helpers/loopback";
import { clientsByRole, everyone, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";
import { deviceWithApprovedData, releaseSheet } from "./helpers/reviews";


let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let ownDeviceId: number;
let ownSetId: number;
let secondOwnDeviceId: number;
let ownPartNumber: string;
let otherDeviceId: number;
let clients: Map<Who, TestClient>;
let released: { candidateId: number; publicPath: string; reference: string };

beforeAll(async () => {
  org = await makeOrganization();
  other = await makeOrganization();
  const ownDevice = await makeDevice(org.organization.id);
  ownDeviceId = ownDevice.id;
  ownPartNumber = ownDevice.partNumber;
  otherDeviceId = (await makeDevice(other.organization.id)).id;
  secondOwnDeviceId = (await makeDevice(org.organization.id)).id;
  clients = await clientsByRole(org);
  const upload = await clients.get("engineer")!.request(`/api/devices/${ownDeviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv") });
  expect(upload.status).toBe(201);
  ownSetId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
  // A released revision, for the review page of its candidate and the public pages.
  const releasedDeviceId = await deviceWithApprovedData(org.organization.id, clients.get("engineer")!, clients.get("reviewer")!);
  const revision = await releaseSheet(clients.get("engineer")!, clients.get("reviewer")!, releasedDeviceId);
  const candidate = await db().SheetCandidate.findOne({ where: { deviceId: releasedDeviceId }, attributes: ["id"] });
  released = { candidateId: candidate!.id, publicPath: revision.publicPath, reference: revision.reference };
});
afterAll(() => closeDb());

function get(who: Who, path: string): Promise<Response> {
  return clients.get(who)!.request(path, { headers: { accept: "text/html" } });
}

// One address per page of the access matrix (lib/access/matrix.ts), keyed like it, so a new page
// without one does not type-check; who gets 200, 403 or /sign-in comes from the page's row.
const pagePaths: Record<PageRoute, () => string> = {
  "/": () => "/",
  "/catalog": () => "/catalog",
  "/sign-in": () => "/sign-in",
  "/sign-up": () => "/sign-up",
  "/sign-up/confirm/[token]": () => "/sign-up/confirm/no-such-token",
  "/password-reset": () => "/password-reset",
  "/password-reset/[token]": () => "/password-reset/no-such-token",
  "/invitations/[token]": () => "/invitations/no-such-token",
  "/dev/mailbox": () => "/dev/mailbox",
  "/devices": () => "/devices",
  "/devices/[id]": () => `/devices/${ownDeviceId}`,
  "/devices/[id]/measurements/[setId]": () => `/devices/${ownDeviceId}/measurements/${ownSetId}`,
  "/review": () => "/review",
  "/sheets": () => "/sheets",
  "/sheets/[deviceId]": () => `/sheets/${ownDeviceId}`,
  "/review/sheets/[candidateId]": () => `/review/sheets/${released.candidateId}`,
  "/datasheets/[org]/[part]/[rev]": () => released.publicPath,
  "/r/[reference]": () => `/r/${released.reference}`,
  "/verify": () => "/verify",
  "/compare": () => `/compare?sheets=${released.publicPath.replace("/datasheets/", "")},kestrine/KDX-2G4/B`,
  "/unsubscribe/[token]": () => "/unsubscribe/not-a-token",
  "/admin/users": () => "/admin/users",
  "/admin/instruments": () => "/admin/instruments",
  "/admin/bench-tokens": () => "/admin/bench-tokens",
  "/subscriptions": () => "/subscriptions",
};

// A page that calls forbidden() or notFound() is sent as an empty HTML shell with the React payload
// inlined, and the browser draws the refusal from it (tests/e2e check what is seen). Next sends the
// forbidden.tsx fallback with every page, so here the status is the proof of refusal; the words only
// show that the fallback is Benchfold's own page, written for the viewer's role.

describe("every page answers with the status its row in the access matrix means", () => {
  for (const [route, resource] of Object.entries(pageResources) as [PageRoute, Resource][]) {
    for (const who of everyone) {
      const verdict = verdictFor(resource, who);
      const expected = verdict === "allowed" ? "opens" : verdict === "unauthenticated" ? "sign-in" : 403;
      it(`${route} (${resource}): ${who} → ${expected}`, async () => {
        const response = await get(who, pagePaths[route]());
        const location = response.headers.get("location");
        if (expected === "sign-in") {
          expect([302, 303, 307]).toContain(response.status);
          expect(new URL(location ?? "", baseUrl).pathname).toBe("/sign-in");
          return;
        }
        if (expected === 403) {
          expect(response.status).toBe(403);
          expect(await response.text()).toContain("Your role does not open this page");
          return;
        }
        if (route === "/r/[reference]") {
          // A verification reference answers with a permanent redirect to its revision's public page.
          expect(response.status).toBe(308);
          expect(new URL(location ?? "", baseUrl).pathname).toBe(released.publicPath);
          return;
        }
        if (route === "/dev/mailbox") {
          // Only this machine's own requests, never one a proxy relayed, see the caught mail; the test clients
          // come through the loopback proxy (mailbox.test.ts shows it open to a direct request).
          expect(response.status).toBe(404);
          return;
        }
        if (isPublic(resource) && who !== "signed-out") {
          // A public page may send a signed-in visitor on (the sign-in page does), never to sign in or away refused.
          expect([200, 307]).toContain(response.status);
          if (location) expect(new URL(location, baseUrl).pathname).not.toBe("/sign-in");
          return;
        }
        expect(response.status).toBe(200);
      });
    }
  }

  it("has an address for every page row and none without a row", () => {
    expect(Object.keys(pagePaths).sort()).toEqual(Object.keys(pageResources).sort());
  });

  it("a signed-out visitor is redirected to /sign-in and is sent nothing of the page", async () => {
    const response = await get("signed-out", `/devices/${ownDeviceId}`);
    expect(response.status).toBe(307);
    const location = new URL(response.headers.get("location") ?? "", baseUrl);
    expect(location.pathname).toBe("/sign-in");
    // The workspace layout (plain /sign-in) and the page (?next=) both guard; whichever answers first, nothing else is sent.
    if (location.search) expect(location.searchParams.get("next")).toBe(`/devices/${ownDeviceId}`);
    const body = await response.text();
    expect(body).not.toContain(ownPartNumber);
    expect(body).not.toContain(org.organization.name);
  });

  it("the refusal tells a customer what their account is for and links to what it opens", async () => {
    const html = await (await get("customer", "/admin/users")).text();
    expect(html).toContain("You are signed in as a customer.");
    expect(html).toContain("Go to catalog");
    expect(html).not.toContain(org.users.admin.email);
  });

  it("the refusal tells a reviewer to ask the administrator", async () => {
    const html = await (await get("reviewer", "/admin/bench-tokens")).text();
    expect(html).toContain("You are signed in as a reviewer.");
    expect(html).toContain("ask your administrator");
    expect(html).toContain("Go to devices");
  });
});

describe("a record that is missing or belongs to another organization answers 404", () => {
  const { MeasurementSet } = db();
  const cases: { name: string; who: UserRole; path: () => string }[] = [
    { name: "another organization's device", who: "engineer", path: () => `/devices/${otherDeviceId}` },
    { name: "another organization's device, to a reviewer", who: "reviewer", path: () => `/devices/${otherDeviceId}` },
    { name: "another organization's sheet draft", who: "engineer", path: () => `/sheets/${otherDeviceId}` },
    { name: "a device that does not exist", who: "engineer", path: () => "/devices/2147483000" },
    { name: "a device id that is not a number", who: "engineer", path: () => "/devices/abc" },
    { name: "a measurement set that does not exist", who: "engineer", path: () => `/devices/${ownDeviceId}/measurements/2147483000` },
    { name: "a set addressed under another device of the organization", who: "reviewer", path: () => `/devices/${secondOwnDeviceId}/measurements/${ownSetId}` },
  ];
  for (const c of cases) {
    it(`${c.name} → 404`, async () => {
      const response = await get(c.who, c.path());
      const html = await response.text();
      expect(response.status).toBe(404);
      expect(html).not.toContain(other.organization.name);
    });
  }

  it("another organization's measurement set, addressed under its own device → 404", async () => {
    // The demo loader's sets belong to the seeded organizations, never to this file's.
    const foreign = await MeasurementSet.findOne({ order: [["id", "ASC"]] });
    expect(foreign, "the demo measurement sets are loaded before the integration tests").not.toBeNull();
    expect(foreign!.organizationId).not.toBe(org.organization.id);
    const response = await get("engineer", `/devices/${foreign!.deviceId}/measurements/${foreign!.id}`);
    expect(response.status).toBe(404);
  });

  it("a customer is refused a device page before anything is looked up (403, not 404)", async () => {
    expect((await get("customer", `/devices/${otherDeviceId}`)).status).toBe(403);
  });
});
