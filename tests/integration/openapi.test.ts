import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { closeDb } from "@/models";
import { openApiValidator } from "../helpers/openapi-validator";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { releaseTwoRevisions } from "./helpers/reviews";
import { fixtureUpload } from "./helpers/uploads";

// The running server's answers, successes and refusals alike, against the OpenAPI document it
// serves at /api/v1/openapi.json, validated by Ajv (JSON Schema 2020-12) with ajv-formats: the
// document is generated from the schemas the handlers are typed with, and this holds them to
// what the handlers really send.

let org: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
let revA: RevisionSummary;
let revB: RevisionSummary;
let partNumber: string;
let validator: ReturnType<typeof openApiValidator>;
const anyone = new TestClient();
const as = (who: Who) => clients.get(who)!;

/** The answer's body against the document's schema for that path, method and status. */
async function expectDocumented(pathTemplate: string, method: string, response: Response): Promise<unknown> {
  const text = await response.text();
  const type = response.headers.get("content-type") ?? "";
  expect(type, `${method} ${pathTemplate} ${response.status}: ${text.slice(0, 300)}`).toMatch(/^application\/json/);
  const body = JSON.parse(text) as unknown;
  expect(validator.check(pathTemplate, method, response.status, body), `${method} ${pathTemplate} → ${response.status}: ${text.slice(0, 300)}`).toBeNull();
  return body;
}

beforeAll(async () => {
  org = await makeOrganization();
  clients = await clientsByRole(org);
  ({ partNumber, revA, revB } = await releaseTwoRevisions(org.organization.id, as("engineer"), as("reviewer")));
  const withdrawn = await as("reviewer").request(`/api/sheet-revisions/${revA.id}/withdraw`, { json: { reason: "Wrong lot printed on page 2." } });
  expect(withdrawn.status, await withdrawn.clone().text()).toBe(200);

  const served = await anyone.request("/api/v1/openapi.json");
  expect(served.status).toBe(200);
  validator = openApiValidator((await served.json()) as never);
}, 240_000);
afterAll(() => closeDb());

describe("GET /api/v1/openapi.json", () => {
  it("is public JSON, OpenAPI 3.1, revalidated by its ETag", async () => {
    const r = await anyone.request("/api/v1/openapi.json");
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toMatch(/^application\/json/);
    expect(r.headers.get("cache-control")).toBe("public, no-cache");
    const doc = (await r.json()) as { openapi: string; paths: Record<string, unknown> };
    expect(doc.openapi).toMatch(/^3\.1\./);
    expect(Object.keys(doc.paths)).toContain("/api/v1/sheets/{org}/{part}/{rev}");
    const again = await anyone.request("/api/v1/openapi.json", { headers: { "if-none-match": r.headers.get("etag")! } });
    expect(again.status).toBe(304);
  });

  it("the validator refuses what the document does not allow (it can fail)", () => {
    expect(validator.check("/api/v1/sheets", "get", 200, { apiVersion: 2, total: 0, page: 1, pageSize: 25, hits: [], facets: { deviceClass: [], organization: [] } })).not.toBeNull();
    expect(validator.check("/api/v1/sheets", "get", 500, { error: { code: "internal", message: "x" } })).toMatch(/not documented/);
  });
});

describe("the server's answers fit the document", () => {
  it("GET /api/v1/sheets: a search with every kind of filter, and all revisions", async () => {
    const qs = new URLSearchParams([["q", partNumber], ["sort", "conversion-loss.typ"], ["rev", "all"]]);
    const body = (await expectDocumented("/api/v1/sheets", "get", await anyone.request(`/api/v1/sheets?${qs}`))) as { hits: { letter: string; figures: unknown[] }[] };
    expect(body.hits.map((h) => h.letter).sort()).toEqual(["A", "B"]);
    expect(body.hits[0].figures.length).toBeGreaterThan(0);
    const filters = new URLSearchParams([["class", "frequency-multiplier"], ["covers", "4 GHz"], ["f", "conversion-loss.max<=40 dB"], ["f", "drive<=+20 dBm"], ["sort", "drive"], ["limit", "5"]]);
    await expectDocumented("/api/v1/sheets", "get", await anyone.request(`/api/v1/sheets?${filters}`));
    await expectDocumented("/api/v1/sheets", "get", await anyone.request("/api/v1/sheets"));
    await expectDocumented("/api/v1/sheets", "get", await as("customer").request(`/api/v1/sheets?org=${org.organization.slug}&sort=released&dir=desc`));
  });

  it("GET /api/v1/sheets: gzip when asked for, the same document as without", async () => {
    const path = `/api/v1/sheets?q=${encodeURIComponent(partNumber)}&rev=all`;
    const zipped = await anyone.request(path, { headers: { "accept-encoding": "gzip" } });
    const plain = await anyone.request(path, { headers: { "accept-encoding": "identity" } });
    expect(zipped.headers.get("content-encoding")).toBe("gzip");
    expect(plain.headers.get("content-encoding")).toBeNull();
    expect(zipped.headers.get("vary")).toMatch(/accept-encoding/i);
    // fetch (undici) undoes one gzip itself: both must read as the same documented answer (a body
    // compressed twice would not parse).
    const body = await expectDocumented("/api/v1/sheets", "get", zipped);
    expect(await expectDocumented("/api/v1/sheets", "get", plain)).toEqual(body);
  });

  it("GET /api/v1/sheets: refusals (422) name the field", async () => {
    for (const qs of ["class=toaster", "f=conversion-loss<=ten dB", `q=${"x".repeat(201)}`, "page=0", "covers=2.4 parsecs"]) {
      const r = await anyone.request(`/api/v1/sheets?${qs}`);
      expect(r.status, qs).toBe(422);
      await expectDocumented("/api/v1/sheets", "get", r);
    }
  });

  it("GET /api/v1/sheets/{org}/{part}/{rev}: current, superseded-and-withdrawn, lettered; 304; 404", async () => {
    const path = (rev: string) => `/api/v1/sheets/${org.organization.slug}/${encodeURIComponent(partNumber)}/${rev}`;
    const current = (await expectDocumented("/api/v1/sheets/{org}/{part}/{rev}", "get", await anyone.request(path("current")))) as { revision: { letter: string }; history: { standing: string }[] };
    expect(current.revision.letter).toBe("B");
    expect(current.history.map((h) => h.standing)).toEqual(["current", "withdrawn"]);
    const a = await anyone.request(path("A"));
    const withdrawnA = (await expectDocumented("/api/v1/sheets/{org}/{part}/{rev}", "get", a)) as { revision: { withdrawal: { reason: string } | null } };
    expect(withdrawnA.revision.withdrawal?.reason).toMatch(/Wrong lot/);
    const again = await anyone.request(path("A"), { headers: { "if-none-match": a.headers.get("etag")! } });
    expect(again.status).toBe(304);
    for (const missing of [path("Z"), `/api/v1/sheets/no-such-org/${encodeURIComponent(partNumber)}/A`]) {
      const r = await anyone.request(missing);
      expect(r.status).toBe(404);
      await expectDocumented("/api/v1/sheets/{org}/{part}/{rev}", "get", r);
    }
  });

  it("GET …/pdf: the documented media type, and a JSON 404", async () => {
    const r = await anyone.request(revB.pdfPath.replace(/^\/datasheets/, "/api/v1/sheets"));
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toBe("application/pdf");
    expect(validator.check("/api/v1/sheets/{org}/{part}/{rev}/pdf", "get", 200, "", "application/pdf")).toBeNull();
    const missing = await anyone.request(`/api/v1/sheets/${org.organization.slug}/${encodeURIComponent(partNumber)}/Q/pdf`);
    expect(missing.status).toBe(404);
    await expectDocumented("/api/v1/sheets/{org}/{part}/{rev}/pdf", "get", missing);
  });

  it("GET /api/v1/verify: current, withdrawn, unknown (404), malformed (422)", async () => {
    const b = (await expectDocumented("/api/v1/verify", "get", await anyone.request(`/api/v1/verify?sha256=${revB.pdfSha256}`))) as { verification: { standing: string } };
    expect(b.verification.standing).toBe("current");
    const a = (await expectDocumented("/api/v1/verify", "get", await anyone.request(`/api/v1/verify?reference=${revA.reference}`))) as { verification: { standing: string } };
    expect(a.verification.standing).toBe("withdrawn");
    const unknown = await anyone.request(`/api/v1/verify?sha256=${"0".repeat(64)}`);
    expect(unknown.status).toBe(404);
    await expectDocumented("/api/v1/verify", "get", unknown);
    for (const qs of ["", "sha256=xyz", `sha256=${revB.pdfSha256}&reference=${revA.reference}`]) {
      const r = await anyone.request(`/api/v1/verify?${qs}`);
      expect(r.status, qs).toBe(422);
      await expectDocumented("/api/v1/verify", "get", r);
    }
  });

  it("POST /api/v1/measurements: 201 with a bench token; 401, 404, 409, 415, 422 refused as documented", async () => {
    const device = await makeDevice(org.organization.id);
    const created = await as("admin").request("/api/admin/bench-tokens", { json: { name: "OpenAPI bench" } });
    expect(created.status).toBe(201);
    const { token } = (await created.json()) as { token: string };
    const bench = new TestClient();
    const post = (init: { multipart?: FormData; raw?: { body: string; contentType: string }; token?: string | null }) =>
      bench.request("/api/v1/measurements", {
        multipart: init.multipart,
        raw: init.raw,
        headers: init.token === null ? {} : { authorization: `Bearer ${init.token ?? token}` },
        origin: null,
      });
    const upload = () => fixtureUpload("examples/two-tone-mixer.tsv", { device: device.partNumber, serial: "OA-1", temperatureC: "25" });

    const ok = await post({ multipart: upload() });
    expect(ok.status).toBe(201);
    const body = (await expectDocumented("/api/v1/measurements", "post", ok)) as { measurementSet: { source: string } };
    expect(body.measurementSet.source).toBe("bench-api");

    const refusals: [number, Response][] = [
      [409, await post({ multipart: upload() })],
      [401, await post({ multipart: upload(), token: null })],
      [401, await post({ multipart: upload(), token: "not-a-token" })],
      [404, await post({ multipart: fixtureUpload("examples/two-tone-mixer.tsv", { device: "NO-SUCH-PART" }) })],
      [415, await post({ raw: { body: "{}", contentType: "application/json" } })],
      [422, await post({ multipart: fixtureUpload("examples/two-tone-mixer.tsv", {}) })],
      [422, await post({ multipart: fixtureUpload("malformed/drive-text-in-number.csv", { device: device.partNumber }) })],
      [422, await post({ multipart: fixtureUpload("examples/two-tone-mixer.tsv", { device: device.partNumber, temperatureC: "0x10" }) })],
    ];
    for (const [status, response] of refusals) {
      expect(response.status, await response.clone().text()).toBe(status);
      await expectDocumented("/api/v1/measurements", "post", response);
    }
  });
});

describe("GET /api/v1/measurements/{id}", () => {
  it("200 with the set and its tables for the token's organization; 401 without a token; 404 for another organization's set or an unknown id", async () => {
    const device = await makeDevice(org.organization.id);
    const created = await as("admin").request("/api/admin/bench-tokens", { json: { name: "Read-back bench" } });
    const { token } = (await created.json()) as { token: string };
    const bench = new TestClient();
    const get = (path: string, bearer: string | null = token) =>
      bench.request(path, { headers: bearer === null ? {} : { authorization: `Bearer ${bearer}` }, origin: null });
    const posted = await bench.request("/api/v1/measurements", {
      multipart: fixtureUpload("examples/drive-sweep-doubler.csv", { device: device.partNumber, serial: "RB-1", impedanceOhm: "75" }),
      headers: { authorization: `Bearer ${token}` },
      origin: null,
    });
    expect(posted.status, await posted.clone().text()).toBe(201);
    const upload = (await posted.json()) as { measurementSet: { id: number }; tables: unknown[] };
    const id = upload.measurementSet.id;

    const ok = await get(`/api/v1/measurements/${id}`);
    expect(ok.status).toBe(200);
    const body = (await expectDocumented("/api/v1/measurements/{id}", "get", ok)) as typeof upload & { measurementSet: { state: string } };
    expect(body.measurementSet.id).toBe(id);
    expect(body.measurementSet.state).toBe("submitted");
    expect(body.tables).toEqual(upload.tables);
    expect(body.tables.length).toBeGreaterThan(0);

    // Another organization's token does not see this set: the same 404 as an id that does not exist.
    const other = await makeOrganization();
    const otherAdmin = (await clientsByRole(other)).get("admin")!;
    const otherToken = ((await (await otherAdmin.request("/api/admin/bench-tokens", { json: { name: "Other bench" } })).json()) as { token: string }).token;
    const refusals: [number, Response][] = [
      [401, await get(`/api/v1/measurements/${id}`, null)],
      [401, await get(`/api/v1/measurements/${id}`, "not-a-token")],
      [404, await get(`/api/v1/measurements/${id}`, otherToken)],
      [404, await get("/api/v1/measurements/2147483000")],
      [404, await get("/api/v1/measurements/0x10")],
    ];
    for (const [status, response] of refusals) {
      const text = await response.clone().text();
      expect(response.status, text).toBe(status);
      expect(text).not.toContain("RB-1");
      await expectDocumented("/api/v1/measurements/{id}", "get", response);
    }
  });
});

describe("GET /api/health/live", () => {
  it("answers constant JSON, never cached, with no session", async () => {
    const r = await anyone.request("/api/health/live");
    expect(r.status).toBe(200);
    expect(r.headers.get("cache-control")).toBe("no-store");
    expect(await r.json()).toEqual({ status: "ok" });
  });
});
