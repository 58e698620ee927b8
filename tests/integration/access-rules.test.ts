import bcrypt from "bcryptjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, factoryPassword, makeDevice, makeOrganization, uniqueEmail, type Who } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";

// Two rules a page once held alone and its API route did not: an administrator does not read sheet
// drafts (the page refused, the JSON and PDF answered), and a reviewer never sees their own upload in
// the review queue (the page filtered it out, GET /api/measurements/pending did not).

let org: Awaited<ReturnType<typeof makeOrganization>>;
let deviceId: number;
let clients: Map<Who, TestClient>;

beforeAll(async () => {
  org = await makeOrganization();
  deviceId = (await makeDevice(org.organization.id)).id;
  clients = await clientsByRole(org);
});
afterAll(() => closeDb());

describe("an administrator reads no sheet draft, on the page or through the API", () => {
  for (const path of [() => `/sheets/${deviceId}`, () => `/api/devices/${deviceId}/sheet`, () => `/api/devices/${deviceId}/sheet/pdf`]) {
    it(`${path().replace(String(deviceId), ":id")}: admin → 403, engineer and reviewer → 200`, async () => {
      const refused = await clients.get("admin")!.request(path(), { headers: { accept: "text/html" } });
      expect(refused.status).toBe(403);
      if (path().startsWith("/api/")) expect(((await refused.json()) as { error: { code: string } }).error.code).toBe("forbidden");
      for (const who of ["engineer", "reviewer"] as const) {
        expect((await clients.get(who)!.request(path(), { headers: { accept: "text/html" } })).status, who).toBe(200);
      }
    });
  }
});

describe("four eyes: a reviewer's own upload is never in their queue", () => {
  const { User } = db();
  let setId: number;
  let promoted: TestClient;

  beforeAll(async () => {
    // An engineer uploads a set, then the administrator makes them a reviewer.
    const person = await User.create({
      organizationId: org.organization.id,
      email: uniqueEmail("promoted"),
      name: "Promoted Engineer",
      role: "engineer",
      passwordHash: bcrypt.hashSync(factoryPassword, 4),
    });
    const asEngineer = new TestClient();
    expect((await asEngineer.signIn(person.email, factoryPassword)).ok).toBe(true);
    const upload = await asEngineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv") });
    expect(upload.status).toBe(201);
    setId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
    const change = await clients.get("admin")!.request(`/api/admin/users/${person.id}`, { method: "PATCH", json: { role: "reviewer" } });
    expect(change.status).toBe(200);
    promoted = new TestClient();
    expect((await promoted.signIn(person.email, factoryPassword)).ok).toBe(true);
  });

  it("GET /api/measurements/pending leaves it out for its uploader and lists it for another reviewer", async () => {
    const ids = async (client: TestClient) => {
      const r = await client.request("/api/measurements/pending");
      expect(r.status).toBe(200);
      return ((await r.json()) as { measurementSets: { id: number }[] }).measurementSets.map((s) => s.id);
    };
    expect(await ids(promoted)).not.toContain(setId);
    expect(await ids(clients.get("reviewer")!)).toContain(setId);
  });

  it("the /review page leaves it out for its uploader and lists it for another reviewer", async () => {
    const html = async (client: TestClient) => (await client.request("/review", { headers: { accept: "text/html" } })).text();
    expect(await html(promoted)).not.toContain(`review-row-${setId}`);
    expect(await html(clients.get("reviewer")!)).toContain(`review-row-${setId}`);
  });

  it("the uploader's decision is refused (403) and the set stays submitted", async () => {
    const r = await promoted.request(`/api/measurements/${setId}/review`, { json: { decision: "approve" } });
    expect(r.status).toBe(403);
    const set = await clients.get("reviewer")!.request(`/api/measurements/${setId}`);
    expect(((await set.json()) as { measurementSet: { state: string } }).measurementSet.state).toBe("submitted");
  });
});
