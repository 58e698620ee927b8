import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MeasurementSet, closeSequelize, getSequelize } from "@/models";
import type { UserRole } from "@/models/user";
import { TestClient } from "./helpers/client";
import { baseUrl } from "./helpers/loopback";
import { clientsByRole, everyone, makeDevice, makeOrganization, type Who } from "./helpers/factories";


let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let ownDeviceId: number;
let ownPartNumber: string;
let otherDeviceId: number;
let clients: Map<Who, TestClient>;

beforeAll(async () => {
  getSequelize();
  org = await makeOrganization();
  other = await makeOrganization();
  const ownDevice = await makeDevice(org.organization.id);
  ownDeviceId = ownDevice.id;
  ownPartNumber = ownDevice.partNumber;
  otherDeviceId = (await makeDevice(other.organization.id)).id;
  clients = await clientsByRole(org);
});
afterAll(() => closeSequelize());

function get(who: Who, path: string): Promise<Response> {
  return clients.get(who)!.request(path, { headers: { accept: "text/html" } });
}

// Each workspace page: the roles it opens for; every other signed-in role gets 403, signed out goes to /sign-in.
const pages: { name: string; path: () => string; allowed: UserRole[] }[] = [
  { name: "/devices", path: () => "/devices", allowed: ["engineer", "reviewer", "admin"] },
  { name: "/devices/:id", path: () => `/devices/${ownDeviceId}`, allowed: ["engineer", "reviewer", "admin"] },
  { name: "/sheets", path: () => "/sheets", allowed: ["engineer", "reviewer"] },
  { name: "/sheets/:id", path: () => `/sheets/${ownDeviceId}`, allowed: ["engineer", "reviewer"] },
  { name: "/review", path: () => "/review", allowed: ["reviewer"] },
  { name: "/admin/users", path: () => "/admin/users", allowed: ["admin"] },
  { name: "/admin/instruments", path: () => "/admin/instruments", allowed: ["admin"] },
  { name: "/admin/bench-tokens", path: () => "/admin/bench-tokens", allowed: ["admin"] },
  { name: "/subscriptions", path: () => "/subscriptions", allowed: ["customer"] },
];

// A page that calls forbidden() or notFound() is sent as an empty HTML shell with the React payload
// inlined, and the browser draws the refusal from it (tests/e2e check what is seen). Next sends the
// forbidden.tsx fallback with every page, so here the status is the proof of refusal; the words only
// show that the fallback is Benchfold's own page, written for the viewer's role.

describe("workspace pages answer with the status their refusal means", () => {
  for (const page of pages) {
    for (const who of everyone) {
      const expected = page.allowed.includes(who as UserRole) ? 200 : who === "signed-out" ? "sign-in" : 403;
      it(`${page.name}: ${who} → ${expected}`, async () => {
        const response = await get(who, page.path());
        if (expected === "sign-in") {
          expect([302, 303, 307]).toContain(response.status);
          expect(new URL(response.headers.get("location") ?? "", baseUrl).pathname).toBe("/sign-in");
          return;
        }
        expect(response.status).toBe(expected);
        if (expected === 403) expect(await response.text()).toContain("Your role does not open this page");
      });
    }
  }

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
  const cases: { name: string; who: UserRole; path: () => string }[] = [
    { name: "another organization's device", who: "engineer", path: () => `/devices/${otherDeviceId}` },
    { name: "another organization's device, to a reviewer", who: "reviewer", path: () => `/devices/${otherDeviceId}` },
    { name: "another organization's sheet draft", who: "engineer", path: () => `/sheets/${otherDeviceId}` },
    { name: "a device that does not exist", who: "engineer", path: () => "/devices/2147483000" },
    { name: "a device id that is not a number", who: "engineer", path: () => "/devices/abc" },
    { name: "a measurement set that does not exist", who: "engineer", path: () => `/devices/${ownDeviceId}/measurements/2147483000` },
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
