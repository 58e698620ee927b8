import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { apiResources, type ApiRoute, type Resource } from "@/lib/access/matrix";
import { verdictFor } from "./helpers/access";
import { clientsByRole, everyone, factoryPassword, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";


let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let otherDeviceId: number;
let ownDeviceId: number;
let ownSetId: number;
let clients: Map<Who, TestClient>;

beforeAll(async () => {
  org = await makeOrganization();
  other = await makeOrganization();
  ownDeviceId = (await makeDevice(org.organization.id)).id;
  otherDeviceId = (await makeDevice(other.organization.id)).id;
  clients = await clientsByRole(org);
  const upload = await clients.get("engineer")!.request(`/api/devices/${ownDeviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv") });
  expect(upload.status).toBe(201);
  ownSetId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
});
afterAll(() => closeDb());

/**
 * One request per row of the access matrix (lib/access/matrix.ts), keyed like it, so a new route
 * without a probe does not type-check. A write is probed with a body its schema refuses, so a role
 * the matrix admits gets 422 (the permission check comes first) and nothing is written.
 */
type Probe = {
  path: () => string;
  json?: () => unknown;
  form?: Record<string, string>;
  allowedStatus: number;
  /** Sent from a session of its own (signing out ends the session that sends it). */
  ownSession?: true;
};
const missing = 2147483000;
const probes: Record<ApiRoute, Probe> = {
  "GET /api/auth/[...nextauth]": { path: () => "/api/auth/csrf", allowedStatus: 200 },
  // next-auth refuses a credentials post without its CSRF token by sending the browser back to sign in.
  "POST /api/auth/[...nextauth]": { path: () => "/api/auth/callback/credentials", form: {}, allowedStatus: 302 },
  "POST /api/auth/sign-out": { path: () => "/api/auth/sign-out", form: {}, allowedStatus: 303, ownSession: true },
  "POST /api/accounts": { path: () => "/api/accounts", json: () => ({}), allowedStatus: 422 },
  "POST /api/accounts/confirm": { path: () => "/api/accounts/confirm", json: () => ({}), allowedStatus: 422 },
  "GET /api/invitations/[token]": { path: () => "/api/invitations/no-such-token", allowedStatus: 404 },
  "POST /api/invitations/accept": { path: () => "/api/invitations/accept", json: () => ({}), allowedStatus: 422 },
  "POST /api/password-resets": { path: () => "/api/password-resets", json: () => ({}), allowedStatus: 422 },
  "POST /api/password-resets/complete": { path: () => "/api/password-resets/complete", json: () => ({}), allowedStatus: 422 },
  // The mailbox answers only this machine's own requests, never one a proxy relayed; the test clients
  // come through the loopback proxy, so it is not found for any of them (mailbox.test.ts shows it open).
  "GET /api/dev/mailbox": { path: () => "/api/dev/mailbox", allowedStatus: 404 },
  "GET /api/me": { path: () => "/api/me", allowedStatus: 200 },
  "GET /api/devices": { path: () => "/api/devices", allowedStatus: 200 },
  "GET /api/devices/[id]": { path: () => `/api/devices/${ownDeviceId}`, allowedStatus: 200 },
  "GET /api/devices/[id]/measurements": { path: () => `/api/devices/${ownDeviceId}/measurements`, allowedStatus: 200 },
  "GET /api/measurements/[id]": { path: () => `/api/measurements/${ownSetId}`, allowedStatus: 200 },
  "GET /api/measurements/[id]/file": { path: () => `/api/measurements/${ownSetId}/file`, allowedStatus: 200 },
  "GET /api/instruments": { path: () => "/api/instruments", allowedStatus: 200 },
  "POST /api/devices": { path: () => "/api/devices", json: () => ({}), allowedStatus: 422 },
  "PATCH /api/devices/[id]": { path: () => `/api/devices/${ownDeviceId}`, json: () => ({}), allowedStatus: 422 },
  "POST /api/devices/[id]/measurements": { path: () => `/api/devices/${ownDeviceId}/measurements`, json: () => ({}), allowedStatus: 415 },
  "GET /api/column-mappings": { path: () => "/api/column-mappings", allowedStatus: 200 },
  "POST /api/column-mappings": { path: () => "/api/column-mappings", json: () => ({}), allowedStatus: 422 },
  "GET /api/measurements/pending": { path: () => "/api/measurements/pending", allowedStatus: 200 },
  "POST /api/measurements/[id]/review": { path: () => `/api/measurements/${ownSetId}/review`, json: () => ({}), allowedStatus: 422 },
  "GET /api/devices/[id]/sheet": { path: () => `/api/devices/${ownDeviceId}/sheet`, allowedStatus: 200 },
  "GET /api/devices/[id]/sheet/pdf": { path: () => `/api/devices/${ownDeviceId}/sheet/pdf`, allowedStatus: 200 },
  "PUT /api/devices/[id]/sheet-content": { path: () => `/api/devices/${ownDeviceId}/sheet-content`, json: () => ({ prose: 5 }), allowedStatus: 422 },
  "PUT /api/devices/[id]/spec-limits": { path: () => `/api/devices/${ownDeviceId}/spec-limits`, json: () => ({}), allowedStatus: 422 },
  "PUT /api/devices/[id]/design-data": { path: () => `/api/devices/${ownDeviceId}/design-data`, json: () => ({}), allowedStatus: 422 },
  "POST /api/devices/[id]/package-outline": { path: () => `/api/devices/${ownDeviceId}/package-outline`, json: () => ({}), allowedStatus: 415 },
  "DELETE /api/devices/[id]/package-outline": { path: () => `/api/devices/${missing}/package-outline`, allowedStatus: 404 },
  "GET /api/devices/[id]/review": { path: () => `/api/devices/${ownDeviceId}/review`, allowedStatus: 200 },
  "POST /api/devices/[id]/candidates": { path: () => `/api/devices/${ownDeviceId}/candidates`, json: () => ({ acknowledgements: 5 }), allowedStatus: 422 },
  "POST /api/sheet-candidates/[id]/release": { path: () => `/api/sheet-candidates/${missing}/release`, json: () => ({ note: 5 }), allowedStatus: 422 },
  "GET /api/sheet-candidates/pending": { path: () => "/api/sheet-candidates/pending", allowedStatus: 200 },
  "POST /api/sheet-candidates/[id]/decision": { path: () => `/api/sheet-candidates/${missing}/decision`, json: () => ({}), allowedStatus: 422 },
  "GET /api/sheet-candidates/[id]": { path: () => `/api/sheet-candidates/${missing}`, allowedStatus: 404 },
  "POST /api/sheet-candidates/[id]/comments": { path: () => `/api/sheet-candidates/${missing}/comments`, json: () => ({}), allowedStatus: 422 },
  "POST /api/sheet-comments/[id]/resolve": { path: () => `/api/sheet-comments/${missing}/resolve`, allowedStatus: 404 },
  "GET /api/devices/[id]/revisions": { path: () => `/api/devices/${ownDeviceId}/revisions`, allowedStatus: 200 },
  "POST /api/sheet-revisions/[id]/withdraw": { path: () => `/api/sheet-revisions/${missing}/withdraw`, json: () => ({}), allowedStatus: 422 },
  "GET /api/devices/[id]/conformity": { path: () => `/api/devices/${ownDeviceId}/conformity`, allowedStatus: 200 },
  "POST /api/conformity-alerts/[id]/close": { path: () => `/api/conformity-alerts/${missing}/close`, json: () => ({}), allowedStatus: 422 },
  "GET /api/v1/sheets/[org]/[part]/[rev]/pdf": { path: () => "/api/v1/sheets/no-such-org/NO-PART/A/pdf", allowedStatus: 404 },
  "GET /api/v1/verify": { path: () => `/api/v1/verify?sha256=${"0".repeat(64)}`, allowedStatus: 404 },
  "GET /api/v1/compare/csv": { path: () => "/api/v1/compare/csv?sheets=no-such-org/NO-PART/A,no-such-org/NO-PART/B", allowedStatus: 404 },
  "GET /api/subscriptions": { path: () => "/api/subscriptions", allowedStatus: 200 },
  "POST /api/subscriptions": { path: () => "/api/subscriptions", json: () => ({}), allowedStatus: 422 },
  "DELETE /api/subscriptions/[id]": { path: () => `/api/subscriptions/${missing}`, allowedStatus: 404 },
  "POST /api/unsubscribe": { path: () => "/api/unsubscribe", json: () => ({}), allowedStatus: 422 },
  "GET /api/v1/sheets": { path: () => "/api/v1/sheets?class=frequency-multiplier", allowedStatus: 200 },
  "GET /api/v1/sheets/[org]/[part]/[rev]": { path: () => "/api/v1/sheets/no-such-org/NO-PART/current", allowedStatus: 404 },
  "GET /api/v1/sheets/[org]/[part]/[rev]/csv": { path: () => "/api/v1/sheets/no-such-org/NO-PART/A/csv", allowedStatus: 404 },
  "GET /api/v1/sheets/[org]/[part]/[rev]/touchstone/[setId]": { path: () => "/api/v1/sheets/no-such-org/NO-PART/A/touchstone/1", allowedStatus: 404 },
  "GET /api/v1/sheets/[org]/[part]/[rev]/touchstone/median/[group]": { path: () => "/api/v1/sheets/no-such-org/NO-PART/A/touchstone/median/25C-s4p", allowedStatus: 404 },
  "GET /api/v1/sheets/[org]/[part]/[rev]/design-in": { path: () => "/api/v1/sheets/no-such-org/NO-PART/current/design-in?drive=10&frequency=1%20GHz", allowedStatus: 404 },
  "GET /api/admin/users": { path: () => "/api/admin/users", allowedStatus: 200 },
  "PATCH /api/admin/users/[id]": { path: () => `/api/admin/users/${org.users.reviewer.id}`, json: () => ({ role: "wizard" }), allowedStatus: 422 },
  "GET /api/admin/invitations": { path: () => "/api/admin/invitations", allowedStatus: 200 },
  "POST /api/admin/invitations": { path: () => "/api/admin/invitations", json: () => ({}), allowedStatus: 422 },
  "GET /api/admin/instruments": { path: () => "/api/admin/instruments", allowedStatus: 200 },
  "POST /api/admin/instruments": { path: () => "/api/admin/instruments", json: () => ({}), allowedStatus: 422 },
  "PATCH /api/admin/instruments/[id]": { path: () => `/api/admin/instruments/${missing}`, json: () => ({}), allowedStatus: 422 },
  "GET /api/admin/bench-tokens": { path: () => "/api/admin/bench-tokens", allowedStatus: 200 },
  "POST /api/admin/bench-tokens": { path: () => "/api/admin/bench-tokens", json: () => ({}), allowedStatus: 422 },
  "DELETE /api/admin/bench-tokens/[id]": { path: () => `/api/admin/bench-tokens/${missing}`, allowedStatus: 404 },
  "POST /api/v1/measurements": { path: () => "/api/v1/measurements", form: {}, allowedStatus: 201 },
  // A session is no bench token: every role gets 401, even for its own organization's set.
  "GET /api/v1/measurements/[id]": { path: () => `/api/v1/measurements/${ownSetId}`, allowedStatus: 200 },
  "GET /api/v1/openapi.json": { path: () => "/api/v1/openapi.json", allowedStatus: 200 },
  "GET /api/health/live": { path: () => "/api/health/live", allowedStatus: 200 },
  "GET /api/health/ready": { path: () => "/api/health/ready", allowedStatus: 200 },
};

/** A client of its own for one probe: signed in as the role's person when there is one. */
async function ownSessionOf(who: Who): Promise<TestClient> {
  const client = new TestClient();
  if (who !== "signed-out") expect((await client.signIn(org.users[who].email, factoryPassword)).ok).toBe(true);
  return client;
}

describe("every API method admits the roles its row in the access matrix names and refuses the rest", () => {
  for (const [key, resource] of Object.entries(apiResources) as [ApiRoute, Resource][]) {
    const probe = probes[key];
    const [method] = key.split(" ");
    for (const who of everyone) {
      const verdict = verdictFor(resource, who);
      it(`${key} (${resource}): ${who} → ${verdict === "allowed" ? probe.allowedStatus : verdict}`, async () => {
        const client = probe.ownSession ? await ownSessionOf(who) : clients.get(who)!;
        const response = await client.request(probe.path(), { method, json: probe.json?.(), form: probe.form });
        const text = await response.text();
        if (verdict === "allowed") {
          expect(response.status, text).toBe(probe.allowedStatus);
        } else {
          expect(response.status, text).toBe(verdict === "unauthenticated" ? 401 : 403);
          expect((JSON.parse(text) as { error?: { code: string } }).error?.code).toBe(verdict);
        }
      });
    }
  }

  it("has a probe for every row and no probe without a row", () => {
    expect(Object.keys(probes).sort()).toEqual(Object.keys(apiResources).sort());
  });

  it("sends nothing of a refused resource: an administrator's refused draft carries no sheet", async () => {
    const r = await clients.get("admin")!.request(`/api/devices/${ownDeviceId}/sheet`);
    expect(r.status).toBe(403);
    expect(await r.text()).not.toContain("specifications");
  });

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
