/**
 * The fault suite's malformed-input part: property-based cases (fast-check) over every JSON and
 * multipart endpoint that writes. Each case must answer 4xx with a message in the product's
 * words — never 5xx — and leave every table as it was (row counts compared after each endpoint).
 */
import fc from "fast-check";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";

type Role = "engineer" | "reviewer" | "admin" | "customer" | "signed-out" | "bench";
type Endpoint = { method: "POST" | "PUT" | "PATCH"; path: () => string; as: Role; fields: string[]; kind: "json" | "multipart" };

const ids = { device: 0, part: "", set: 0, user: 0, instrument: 0 };
let benchToken = "";

/** Every writing endpoint with a JSON or multipart body, the role allowed to call it, and its body's fields. */
const endpoints: Endpoint[] = [
  { method: "POST", path: () => "/api/devices", as: "engineer", kind: "json", fields: ["partNumber", "deviceClass", "title", "description", "keyConditions"] },
  { method: "PATCH", path: () => `/api/devices/${ids.device}`, as: "engineer", kind: "json", fields: ["partNumber", "deviceClass", "title", "keyConditions"] },
  { method: "PUT", path: () => `/api/devices/${ids.device}/spec-limits`, as: "engineer", kind: "json", fields: ["limits"] },
  { method: "PUT", path: () => `/api/devices/${ids.device}/sheet-content`, as: "engineer", kind: "json", fields: ["prose", "absoluteMaximumRatings", "measurementUncertainty"] },
  { method: "PUT", path: () => `/api/devices/${ids.device}/design-data`, as: "engineer", kind: "json", fields: ["pinFunctions", "ordering", "recommendedOperatingConditions", "packageOutlineCaption"] },
  { method: "POST", path: () => "/api/column-mappings", as: "engineer", kind: "json", fields: ["name", "kind", "headers", "mapping", "metadata"] },
  { method: "POST", path: () => `/api/measurements/${ids.set}/review`, as: "reviewer", kind: "json", fields: ["decision", "reason"] },
  // No alert is needed: the body is read (and refused) before the alert is looked up.
  { method: "POST", path: () => "/api/conformity-alerts/2147483000/close", as: "engineer", kind: "json", fields: ["reason"] },
  { method: "PATCH", path: () => `/api/admin/users/${ids.user}`, as: "admin", kind: "json", fields: ["role", "disabled"] },
  { method: "POST", path: () => "/api/admin/invitations", as: "admin", kind: "json", fields: ["email", "role"] },
  { method: "POST", path: () => "/api/admin/instruments", as: "admin", kind: "json", fields: ["kind", "model", "serial", "calibratedOn", "calibrationDueOn", "uncertainty"] },
  { method: "PATCH", path: () => `/api/admin/instruments/${ids.instrument}`, as: "admin", kind: "json", fields: ["kind", "model", "serial", "calibratedOn", "calibrationDueOn"] },
  { method: "POST", path: () => "/api/admin/bench-tokens", as: "admin", kind: "json", fields: ["name"] },
  { method: "POST", path: () => "/api/accounts", as: "signed-out", kind: "json", fields: ["name", "email", "password", "organizationName"] },
  { method: "POST", path: () => "/api/accounts/confirm", as: "signed-out", kind: "json", fields: ["token"] },
  { method: "POST", path: () => "/api/invitations/accept", as: "signed-out", kind: "json", fields: ["token", "name", "password"] },
  { method: "POST", path: () => "/api/password-resets", as: "signed-out", kind: "json", fields: ["email"] },
  { method: "POST", path: () => "/api/password-resets/complete", as: "signed-out", kind: "json", fields: ["token", "password"] },
  { method: "POST", path: () => "/api/subscriptions", as: "customer", kind: "json", fields: ["organization", "partNumber", "deviceClass"] },
  { method: "POST", path: () => "/api/unsubscribe", as: "signed-out", kind: "json", fields: ["token"] },
  { method: "POST", path: () => `/api/devices/${ids.device}/measurements`, as: "engineer", kind: "multipart", fields: [] },
  { method: "POST", path: () => "/api/v1/measurements", as: "bench", kind: "multipart", fields: [] },
  { method: "POST", path: () => `/api/devices/${ids.device}/package-outline`, as: "engineer", kind: "multipart", fields: [] },
];

const RUNS_PER_ENDPOINT = 14;

/** A value no field of ours accepts: an array of objects, or an object nested inside an object. */
const wrongValue = fc.oneof(
  fc.array(fc.dictionary(fc.string({ maxLength: 8 }), fc.integer(), { minKeys: 1, maxKeys: 3 }), { minLength: 1, maxLength: 3 }),
  fc.record({ nested: fc.record({ deeper: fc.array(fc.integer(), { maxLength: 3 }) }) }),
);

/** A JSON body that cannot be right: broken JSON, a top-level non-object, or the endpoint's own fields with wrong values. */
function jsonBody(fields: string[]) {
  return fc.oneof(
    fc.string({ maxLength: 40 }).map((s) => ({ raw: `{"${s.replace(/"/g, "")}": ` })),
    fc.oneof(fc.constant(null), fc.integer(), fc.string({ maxLength: 20 }), fc.array(fc.anything({ maxDepth: 2 }), { maxLength: 4 })).map((value) => ({ json: value })),
    fc
      .tuple(fc.subarray(fields, { minLength: 1 }), fc.array(wrongValue, { minLength: fields.length, maxLength: fields.length }))
      .map(([picked, values]) => ({ json: Object.fromEntries(picked.map((field, i) => [field, values[i]])) })),
  );
}

/** A bench file of random bytes, with condition fields that are impossible or not numbers. */
const multipartBody = fc.record({
  bytes: fc.uint8Array({ minLength: 0, maxLength: 2048 }),
  name: fc.constantFrom("x.csv", "x.s2p", "x.ts", "x.tsv", "x.bin", ""),
  fields: fc.record(
    {
      measuredOn: fc.constantFrom("2026-02-30", "2026-13-01", "0000-00-00", "yesterday", ""),
      temperatureC: fc.constantFrom("0x10", "1e999", "NaN", " ", "twenty"),
      inputFrequencyHz: fc.constantFrom("-1", "Infinity", "0b101", "1_000"),
      instrumentIds: fc.constantFrom("0x1", "1,,2", "-3", "abc"),
    },
    { requiredKeys: [] },
  ),
});

async function rowCounts(): Promise<Record<string, number>> {
  const { sequelize } = db();
  const tables = (await sequelize.query<Record<string, string>>("SHOW TABLES", { type: QueryTypes.SELECT })).map((row) => Object.values(row)[0]);
  const counts: Record<string, number> = {};
  for (const table of tables.filter((t) => !t.startsWith("benchfold_") && t !== "sign_in_attempts")) {
    const [row] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${table}\``, { type: QueryTypes.SELECT });
    counts[table] = Number(row.n);
  }
  return counts;
}

const clients = new Map<Role, TestClient>();
const tried = { cases: 0, byStatus: new Map<number, number>() };

beforeAll(async () => {
  const made = await makeOrganization();
  for (const role of ["engineer", "reviewer", "admin", "customer"] as const) {
    const client = new TestClient();
    expect((await client.signIn(made.users[role].email, factoryPassword)).ok).toBe(true);
    clients.set(role, client);
  }
  clients.set("signed-out", new TestClient());
  const device = await makeDevice(made.organization.id);
  ids.device = device.id;
  ids.part = device.partNumber;
  ids.user = made.users.customer.id;
  const upload = await clients.get("engineer")!.request(`/api/devices/${device.id}/measurements`, {
    multipart: fixtureUpload("examples/drive-sweep-doubler.csv", { serial: "BFD-FUZZ-1" }),
  });
  expect(upload.status).toBe(201);
  ids.set = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
  const instrument = await clients.get("admin")!.request("/api/admin/instruments", {
    json: { kind: "spectrum analyzer", model: "Fuzz SA-1", serial: "FZ-1", calibratedOn: "2026-01-01", calibrationDueOn: "2027-01-01", uncertainty: [] },
  });
  expect(instrument.status).toBe(201);
  ids.instrument = ((await instrument.json()) as { instrument: { id: number } }).instrument.id;
  const token = await clients.get("admin")!.request("/api/admin/bench-tokens", { json: { name: "Fuzz bench" } });
  benchToken = ((await token.json()) as { token: string }).token;
  const bench = new TestClient();
  clients.set("bench", bench);
});

afterAll(() => {
  const summary = [...tried.byStatus].sort((a, b) => a[0] - b[0]).map(([status, n]) => `${status}×${n}`).join(", ");
  console.log(`[malformed input] ${tried.cases} cases over ${endpoints.length} endpoints: ${summary}`);
});

async function send(endpoint: Endpoint, body: { raw?: string; json?: unknown; bytes?: Uint8Array; name?: string; fields?: Record<string, string> }): Promise<Response> {
  const client = clients.get(endpoint.as)!;
  if (endpoint.kind === "multipart") {
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(body.bytes!)]), body.name);
    for (const [key, value] of Object.entries(body.fields ?? {})) form.set(key, value);
    if (endpoint.as === "bench") form.set("device", ids.part);
    return client.request(endpoint.path(), { method: endpoint.method, multipart: form, headers: endpoint.as === "bench" ? { authorization: `Bearer ${benchToken}` } : {} });
  }
  if (body.raw !== undefined) return client.request(endpoint.path(), { method: endpoint.method, raw: { body: body.raw, contentType: "application/json" } });
  return client.request(endpoint.path(), { method: endpoint.method, json: body.json });
}

describe("malformed input answers 4xx with a message, never 5xx, and writes nothing", () => {
  it.each(endpoints.map((e) => [`${e.method} ${e.path().replace(/\d+/g, ":id")}`, e] as const))("%s", async (_name, endpoint) => {
    const before = await rowCounts();
    const arbitrary = endpoint.kind === "json" ? jsonBody(endpoint.fields) : multipartBody;
    await fc.assert(
      fc.asyncProperty(arbitrary, async (body) => {
        const response = await send(endpoint, body as Parameters<typeof send>[1]);
        tried.cases++;
        tried.byStatus.set(response.status, (tried.byStatus.get(response.status) ?? 0) + 1);
        const text = await response.text();
        expect(response.status, text.slice(0, 300)).toBeGreaterThanOrEqual(400);
        expect(response.status, text.slice(0, 300)).toBeLessThan(500);
        const parsed = JSON.parse(text) as { error?: { message?: string } };
        expect(parsed.error?.message, text.slice(0, 300)).toMatch(/\S/);
      }),
      { numRuns: RUNS_PER_ENDPOINT, seed: 20261202 + endpoints.indexOf(endpoint) },
    );
    expect(await rowCounts()).toEqual(before);
  }, 120_000);
});
