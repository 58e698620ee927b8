import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeSequelize } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, everyone, makeDevice, makeOrganization, type Who } from "./helpers/factories";


let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let otherDeviceId: number;
let ownDeviceId: number;
let clients: Map<Who, TestClient>;

beforeAll(async () => {
  org = await makeOrganization();
  other = await makeOrganization();
  ownDeviceId = (await makeDevice(org.organization.id)).id;
  otherDeviceId = (await makeDevice(other.organization.id)).id;
  clients = await clientsByRole(org);
});
afterAll(() => closeSequelize());

// Each route: who is allowed; everyone else gets 401 (signed out) or 403 (signed in, wrong role).
const matrix: { name: string; method: string; path: () => string; json?: () => unknown; allowed: Who[]; okStatus?: number }[] = [
  { name: "who am I", method: "GET", path: () => "/api/me", allowed: ["customer", "engineer", "reviewer", "admin"] },
  { name: "list devices", method: "GET", path: () => "/api/devices", allowed: ["engineer", "reviewer", "admin"] },
  { name: "read a device", method: "GET", path: () => `/api/devices/${ownDeviceId}`, allowed: ["engineer", "reviewer", "admin"] },
  { name: "list people", method: "GET", path: () => "/api/admin/users", allowed: ["admin"] },
  { name: "list invitations", method: "GET", path: () => "/api/admin/invitations", allowed: ["admin"] },
  {
    name: "change a role", method: "PATCH", path: () => `/api/admin/users/${org.users.reviewer.id}`,
    json: () => ({ role: "reviewer" }), allowed: ["admin"],
  },
];

describe("every API route admits its roles and refuses the rest", () => {
  for (const route of matrix) {
    for (const who of everyone) {
      const allowed = route.allowed.includes(who);
      it(`${route.name}: ${who} → ${allowed ? "allowed" : who === "signed-out" ? "401" : "403"}`, async () => {
        const response = await clients.get(who)!.request(route.path(), { method: route.method, json: route.json?.() });
        const body = (await response.json()) as { error?: { code: string } };
        if (allowed) {
          expect(response.status, JSON.stringify(body)).toBe(route.okStatus ?? 200);
        } else {
          expect(response.status).toBe(who === "signed-out" ? 401 : 403);
          expect(body.error?.code).toBe(who === "signed-out" ? "unauthenticated" : "forbidden");
        }
      });
    }
  }

  it("invite: only an admin, and the others are refused before anything is written", async () => {
    for (const who of everyone) {
      if (who === "admin") continue;
      const r = await clients.get(who)!.request("/api/admin/invitations", { json: { email: `nobody-${who}@factory.example`, role: "engineer" } });
      expect(r.status).toBe(who === "signed-out" ? 401 : 403);
    }
    const list = await clients.get("admin")!.request("/api/admin/invitations");
    const { invitations } = (await list.json()) as { invitations: { email: string }[] };
    expect(invitations.filter((i) => i.email.startsWith("nobody-"))).toEqual([]);
  });
});

describe("organizations never see each other's data", () => {
  it("another organization's device is not found (404) and nothing of it is returned", async () => {
    const r = await clients.get("engineer")!.request(`/api/devices/${otherDeviceId}`);
    expect(r.status).toBe(404);
    const text = await r.text();
    expect(text).not.toContain(other.organization.name);
  });

  it("the device list holds only the caller's organization", async () => {
    const r = await clients.get("reviewer")!.request("/api/devices");
    const { devices } = (await r.json()) as { devices: { id: number }[] };
    expect(devices.map((d) => d.id)).toEqual([ownDeviceId]);
  });

  it("the people list holds only the caller's organization", async () => {
    const r = await clients.get("admin")!.request("/api/admin/users");
    const { users } = (await r.json()) as { users: { email: string }[] };
    const emails = users.map((u) => u.email);
    expect(emails).toContain(org.users.engineer.email);
    expect(emails).not.toContain(other.users.engineer.email);
  });

  it("an admin cannot change a person of another organization (404, unchanged)", async () => {
    const r = await clients.get("admin")!.request(`/api/admin/users/${other.users.engineer.id}`, { method: "PATCH", json: { disabled: true } });
    expect(r.status).toBe(404);
    await other.users.engineer.reload();
    expect(other.users.engineer.disabledAt).toBeNull();
  });
});

describe("input and origin checks", () => {
  it("refuses a cross-origin state-changing request with 403", async () => {
    const r = await clients.get("admin")!.request(`/api/admin/users/${org.users.reviewer.id}`, {
      method: "PATCH", json: { role: "engineer" }, origin: "https://evil.example",
    });
    expect(r.status).toBe(403);
    expect(((await r.json()) as { error: { message: string } }).error.message).toMatch(/Cross-site/);
    await org.users.reviewer.reload();
    expect(org.users.reviewer.role).toBe("reviewer");
  });

  it("refuses a cross-origin sign-up with 403", async () => {
    const r = await new TestClient().request("/api/accounts", {
      json: { name: "X", email: "cross@factory.example", password: "long-enough-pw", company: "Cross Co" }, origin: "http://localhost:9999",
    });
    expect(r.status).toBe(403);
  });

  it("answers invalid input with 422 naming the field", async () => {
    const r = await clients.get("admin")!.request("/api/admin/invitations", { json: { email: "not-an-email", role: "engineer" } });
    expect(r.status).toBe(422);
    const body = (await r.json()) as { error: { code: string; message: string; details: { fields: { field: string }[] } } };
    expect(body.error.code).toBe("invalid");
    expect(body.error.details.fields[0].field).toBe("email");
  });

  it("answers a non-JSON body with 415", async () => {
    const r = await clients.get("admin")!.request("/api/admin/invitations", { form: { email: "a@b.example", role: "engineer" } });
    expect(r.status).toBe(415);
  });
});
