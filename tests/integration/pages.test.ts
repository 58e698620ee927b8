import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MeasurementSet, closeSequelize, getSequelize } from "@/models";
import type { UserRole } from "@/models/user";
import { TestClient } from "./helpers/client";
import { baseUrl } from "./helpers/loopback";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";

type Who = UserRole | "signed-out";
const everyone: Who[] = ["signed-out", "customer", "engineer", "reviewer", "admin"];

let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let ownDeviceId: number;
let otherDeviceId: number;
const clients = new Map<Who, TestClient>();

beforeAll(async () => {
  getSequelize();
  org = await makeOrganization();
  other = await makeOrganization();
  ownDeviceId = (await makeDevice(org.organization.id)).id;
  otherDeviceId = (await makeDevice(other.organization.id)).id;
  for (const who of everyone) {
    const client = new TestClient();
    if (who !== "signed-out") expect((await client.signIn(org.users[who].email, factoryPassword)).ok).toBe(true);
    clients.set(who, client);
  }
});
afterAll(() => closeSequelize());

function get(who: Who, path: string): Promise<Response> {
  return clients.get(who)!.request(path, { headers: { accept: "text/html" } });
}

// Each workspace page: the roles it opens for; every other signed-in role gets 403, signed out goes to /sign-in.
const pages: { path: () => string; allowed: UserRole[] }[] = [
  { path: () => "/devices", allowed: ["engineer", "reviewer", "admin"] },
  { path: () => `/devices/${ownDeviceId}`, allowed: ["engineer", "reviewer", "admin"] },
  { path: () => "/sheets", allowed: ["engineer", "reviewer"] },
  { path: () => `/sheets/${ownDeviceId}`, allowed: ["engineer", "reviewer"] },
  { path: () => "/review", allowed: ["reviewer"] },
  { path: () => "/admin/users", allowed: ["admin"] },
  { path: () => "/admin/instruments", allowed: ["admin"] },
  { path: () => "/admin/bench-tokens", allowed: ["admin"] },
  { path: () => "/subscriptions", allowed: ["customer"] },
];

describe("workspace pages answer with the status their refusal means", () => {
  for (const page of pages) {
    for (const who of everyone) {
      const expected = page.allowed.includes(who as UserRole) ? 200 : who === "signed-out" ? "sign-in" : 403;
      it(`${page.path().replace(/\d+/g, ":id")}: ${who} → ${expected}`, async () => {
        const response = await get(who, page.path());
        if (expected === "sign-in") {
          expect([302, 303, 307]).toContain(response.status);
          expect(new URL(response.headers.get("location") ?? "", baseUrl).pathname).toBe("/sign-in");
          return;
        }
        const html = await response.text();
        expect(response.status).toBe(expected);
        if (expected === 403) {
          expect(html).toContain('data-testid="forbidden"');
          expect(html).toContain("Your role does not open this page");
        } else {
          expect(html).not.toContain('data-testid="forbidden"');
        }
      });
    }
  }

  it("a signed-out visitor is sent to sign in and comes back to the page afterwards", async () => {
    const response = await get("signed-out", "/review");
    const location = new URL(response.headers.get("location") ?? "", baseUrl);
    expect(location.pathname).toBe("/sign-in");
    // The workspace layout (plain /sign-in) and the page (?next=) both guard; whichever answers, nothing else is sent.
    if (location.search) expect(location.searchParams.get("next")).toBe("/review");
  });

  it("the refusal tells a customer what their account is for and links to what it opens", async () => {
    const html = await (await get("customer", "/admin/users")).text();
    expect(html).toContain("You are signed in as a customer.");
    expect(html).toContain('href="/catalog"');
    expect(html).not.toContain(org.users.admin.email);
  });

  it("the refusal tells a reviewer to ask the administrator", async () => {
    const html = await (await get("reviewer", "/admin/bench-tokens")).text();
    expect(html).toContain("You are signed in as a reviewer.");
    expect(html).toContain("ask your administrator");
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
