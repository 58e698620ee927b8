import { createHash } from "node:crypto";
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import { contentKey } from "@/lib/server/storage/object-key";
import { TestClient } from "./helpers/client";
import { runStore } from "./helpers/object-store";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload, fixturesDir, uploadRowCounts } from "./helpers/uploads";

let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let deviceId: number;
let otherDeviceId: number;
const as: Record<string, TestClient> = {};

beforeAll(async () => {
  org = await makeOrganization();
  other = await makeOrganization();
  deviceId = (await makeDevice(org.organization.id)).id;
  otherDeviceId = (await makeDevice(other.organization.id)).id;
  for (const [key, email] of [
    ["engineer", org.users.engineer.email],
    ["reviewer", org.users.reviewer.email],
    ["admin", org.users.admin.email],
    ["customer", org.users.customer.email],
    ["otherEngineer", other.users.engineer.email],
    ["otherReviewer", other.users.reviewer.email],
  ] as const) {
    as[key] = new TestClient();
    expect((await as[key].signIn(email, factoryPassword)).ok).toBe(true);
  }
});
afterAll(() => closeDb());


describe("upload", () => {
  const { StoredFile } = db();
  it("stores a good file raw with its SHA-256, parsed, with derived parameters, as submitted", async () => {
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv") });
    const body = (await r.json()) as { measurementSet: { id: number; state: string; sha256: string; kind: string; parameters: { name: string }[]; conditions: { serial: string } } };
    expect(r.status, JSON.stringify(body)).toBe(201);
    const bytes = readFileSync(path.join(fixturesDir, "examples/drive-sweep-doubler.csv"));
    expect(body.measurementSet).toMatchObject({ state: "submitted", kind: "drive-sweep", sha256: createHash("sha256").update(bytes).digest("hex") });
    expect(body.measurementSet.conditions.serial).toBe("BFD-0001");
    expect(body.measurementSet.parameters.map((p) => p.name)).toContain("conversion-loss");
    const stored = await StoredFile.unscoped().findOne({ where: { sha256: body.measurementSet.sha256, organizationId: org.organization.id } });
    // The bytes are an object in the file store under their content key, exactly as uploaded.
    expect(stored!.storageKey).toBe(contentKey(body.measurementSet.sha256));
    expect(Buffer.compare(await runStore().get(stored!.storageKey), bytes)).toBe(0);
  });

  it("refuses the same bytes again on the device, naming the earlier set", async () => {
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv") });
    expect(r.status).toBe(409);
    const body = (await r.json()) as { error: { message: string; details: { existingSetId: number } } };
    expect(body.error.message).toMatch(/identical \(same SHA-256\) to measurement set #\d+ \(drive-sweep-doubler\.csv\)/);
  });

  it("asks for the serial when neither the file nor the form gives it", async () => {
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/attenuator-2port.s2p") });
    expect(r.status).toBe(422);
    expect(((await r.json()) as { error: { details: { field: string } } }).error.details.field).toBe("serial");
    const ok = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/attenuator-2port.s2p", { serial: "BFD-0200" }) });
    expect(ok.status).toBe(201);
  });

  const malformed = readdirSync(path.join(fixturesDir, "malformed")).sort();
  it.each(malformed)("malformed %s → 422 with the engine's message, nothing stored", async (file) => {
    const before = await uploadRowCounts();
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload(`malformed/${file}`, { serial: "BFD-X" }) });
    const body = (await r.json()) as { error: { code: string; message: string; details?: { ingest?: { fileName: string } } } };
    expect(r.status, body.error.message).toBe(422);
    expect(body.error.message.startsWith(file)).toBe(true);
    expect(body.error.details?.ingest?.fileName).toBe(file);
    expect(await uploadRowCounts()).toEqual(before);
  });

  it("refuses an oversize upload with 413 before storing anything", async () => {
    const before = await uploadRowCounts();
    const big = new Uint8Array(11 * 1024 * 1024).fill(0x31);
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("big.csv", {}, big) });
    expect(r.status).toBe(413);
    expect(await uploadRowCounts()).toEqual(before);
  });
});

describe("who may read, upload and approve", () => {
  const { MeasurementSet, User } = db();
  it("refuses customers, signed-out visitors and other organizations, returning no data", async () => {
    const signedOut = new TestClient();
    expect((await signedOut.request(`/api/devices/${deviceId}/measurements`)).status).toBe(401);
    expect((await as.customer.request(`/api/devices/${deviceId}/measurements`)).status).toBe(403);
    const foreign = await as.otherEngineer.request(`/api/devices/${deviceId}/measurements`);
    expect(foreign.status).toBe(404);
    expect(await foreign.text()).not.toContain("BFD-0001");
    const upload = await as.otherEngineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/two-tone-mixer.tsv") });
    expect(upload.status).toBe(404);
    expect((await as.customer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/two-tone-mixer.tsv") })).status).toBe(403);
    expect((await signedOut.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/two-tone-mixer.tsv") })).status).toBe(401);

    const [set] = await MeasurementSet.findAll({ where: { deviceId }, limit: 1 });
    expect((await as.otherEngineer.request(`/api/measurements/${set.id}`)).status).toBe(404);
    const approve = await as.otherReviewer.request(`/api/measurements/${set.id}/review`, { json: { decision: "approve" } });
    expect(approve.status).toBe(404);
    await set.reload();
    expect(set.state).toBe("submitted");
    expect((await as.otherEngineer.request(`/api/devices/${otherDeviceId}/measurements`)).status).toBe(200);
  });

  it("lets a reviewer approve or reject with a reason; decided sets stay as decided", async () => {
    const up = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/phase-noise-doubler.csv") });
    const { measurementSet } = (await up.json()) as { measurementSet: { id: number } };
    expect((await as.engineer.request(`/api/measurements/${measurementSet.id}/review`, { json: { decision: "approve" } })).status).toBe(403);
    const noReason = await as.reviewer.request(`/api/measurements/${measurementSet.id}/review`, { json: { decision: "reject", reason: "" } });
    expect(noReason.status).toBe(422);
    const ok = await as.reviewer.request(`/api/measurements/${measurementSet.id}/review`, { json: { decision: "approve" } });
    expect(ok.status).toBe(200);
    expect(((await ok.json()) as { measurementSet: { state: string } }).measurementSet.state).toBe("approved");
    const again = await as.reviewer.request(`/api/measurements/${measurementSet.id}/review`, { json: { decision: "reject", reason: "changed my mind" } });
    expect(again.status).toBe(409);
  });

  it("never lets the uploader approve their own set, even after becoming a reviewer", async () => {
    const up = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/frequency-sweep-mixer.csv") });
    const { measurementSet } = (await up.json()) as { measurementSet: { id: number } };
    await User.update({ role: "reviewer" }, { where: { id: org.users.engineer.id } });
    try {
      const r = await as.engineer.request(`/api/measurements/${measurementSet.id}/review`, { json: { decision: "approve" } });
      expect(r.status).toBe(403);
      expect(((await r.json()) as { error: { message: string } }).error.message).toMatch(/another reviewer/);
    } finally {
      await User.update({ role: "engineer" }, { where: { id: org.users.engineer.id } });
    }
  });

  it("reads a mixer's three-port file as its ports' match: VSWR per port, no splitter's insertion loss or balance", async () => {
    const mixer = await makeDevice(org.organization.id);
    await mixer.update({ deviceClass: "double-balanced-mixer", title: "Factory mixer" });
    const upload = async (id: number) =>
      (await (await as.engineer.request(`/api/devices/${id}/measurements`, { multipart: fixtureUpload("examples/splitter-3port.s3p", { serial: "BFD-0302" }) })).json()) as {
        measurementSet: { parameters: { name: string }[] };
      };
    const asMixer = new Set((await upload(mixer.id)).measurementSet.parameters.map((p) => p.name));
    expect(asMixer.has("vswr")).toBe(true);
    for (const name of ["insertion-loss", "amplitude-balance", "phase-balance"]) expect(asMixer.has(name), name).toBe(false);
    // The same bytes on another class's device are read by the splitter's roles, as before.
    const hybrid = await makeDevice(org.organization.id);
    await hybrid.update({ deviceClass: "quadrature-hybrid", title: "Factory splitter" });
    expect((await upload(hybrid.id)).measurementSet.parameters.map((p) => p.name)).toContain("amplitude-balance");
  });

  it("keeps both sets when a correction supersedes an approved one", async () => {
    const first = (await (await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/splitter-3port.s3p", { serial: "BFD-0301" }) })).json()) as { measurementSet: { id: number } };
    await as.reviewer.request(`/api/measurements/${first.measurementSet.id}/review`, { json: { decision: "approve" } });
    const corrected = await as.engineer.request(`/api/devices/${deviceId}/measurements`, {
      multipart: fixtureUpload("examples/hybrid-4port.s4p", { serial: "BFD-0301", supersedesId: String(first.measurementSet.id) }),
    });
    expect(corrected.status).toBe(201);
    const second = (await corrected.json()) as { measurementSet: { id: number; supersedesId: number } };
    expect(second.measurementSet.supersedesId).toBe(first.measurementSet.id);
    const old = (await (await as.engineer.request(`/api/measurements/${first.measurementSet.id}`)).json()) as { measurementSet: { state: string; supersededById: number } };
    expect(old.measurementSet).toMatchObject({ state: "approved", supersededById: second.measurementSet.id });
  });
});

describe("instruments and bench tokens", () => {
  it("warns on a set measured with an instrument whose calibration had lapsed", async () => {
    const created = await as.admin.request("/api/admin/instruments", {
      json: { kind: "spectrum analyzer", model: "Bench analyzer, 9 kHz–26.5 GHz", serial: `SA-${Date.now()}`, calibratedOn: "2025-01-10", calibrationDueOn: "2026-01-10", uncertainty: [{ quantity: "absolute power", value: 0.3, unit: "dB", coverageFactor: 2 }] },
    });
    expect(created.status).toBe(201);
    const { instrument } = (await created.json()) as { instrument: { id: number } };
    expect((await as.engineer.request("/api/admin/instruments", { json: {} })).status).toBe(403);
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, {
      multipart: fixtureUpload("examples/hybrid-4port-v2.s4p", { serial: "BFD-0400", measuredOn: "2026-06-01", instrumentIds: String(instrument.id) }),
    });
    expect(r.status).toBe(201);
    const { measurementSet } = (await r.json()) as { measurementSet: { warnings: string[]; instruments: { calibrationLapsed: boolean }[] } };
    expect(measurementSet.instruments[0].calibrationLapsed).toBe(true);
    expect(measurementSet.warnings.join(" ")).toMatch(/Calibration of spectrum analyzer .* was not valid on 2026-06-01/);
  });

  it("accepts bench uploads with a token until it is revoked", async () => {
    const device = await makeDevice(org.organization.id, `BENCH-${Date.now()}`);
    const created = await as.admin.request("/api/admin/bench-tokens", { json: { name: "Bench 3 sweep script" } });
    expect(created.status).toBe(201);
    const { token, benchToken } = (await created.json()) as { token: string; benchToken: { id: number } };
    const list = (await (await as.admin.request("/api/admin/bench-tokens")).json()) as { benchTokens: { id: number }[] };
    expect(JSON.stringify(list)).not.toContain(token);

    const bench = new TestClient();
    const upload = () => {
      const form = fixtureUpload("examples/two-tone-mixer.tsv", { device: device.partNumber });
      return bench.request("/api/v1/measurements", { multipart: form, headers: { authorization: `Bearer ${token}` }, origin: null });
    };
    const r = await upload();
    expect(r.status).toBe(201);
    const posted = ((await r.json()) as { measurementSet: { source: string; benchTokenName: string | null; uploadedBy: string | null } }).measurementSet;
    expect(posted).toMatchObject({ source: "bench-api", benchTokenName: "Bench 3 sweep script", uploadedBy: null });
    const dup = await upload();
    expect(dup.status).toBe(409);
    const bad = await bench.request("/api/v1/measurements", {
      multipart: fixtureUpload("malformed/drive-text-in-number.csv", { device: device.partNumber }),
      headers: { authorization: `Bearer ${token}` },
      origin: null,
    });
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { message: string } }).error.message).toMatch(/drive-text-in-number\.csv line 10, column 3/);

    expect((await as.admin.request(`/api/admin/bench-tokens/${benchToken.id}`, { method: "DELETE" })).status).toBe(200);
    expect((await upload()).status).toBe(401);
    const otherOrgToken = await as.otherEngineer.request("/api/admin/bench-tokens");
    expect(otherOrgToken.status).toBe(403);
  });
});

describe("column mapping for foreign CSV files", () => {
  const foreign = (rows: string[]) =>
    new TextEncoder().encode(["# exported by bench script v3", "Pin_dBm;Fund (dBm);Harm2 (dBm);Harm3 (dBm);Temp_F", ...rows].join("\n") + "\n");
  const goodRows = ["-2;-40.1;-24.0;-55.2;77", "0;-38.0;-21.5;-52.8;77", "2;-35.9;-19.3;-50.1;77", "4;-33.5;-17.9;-47.7;77"];
  const fields = { serial: `BFD-MAP-${Date.now()}`, inputFrequencyHz: "1000000000" };

  it("offers the mapping step, saves a mapping, and maps the next file with the same headers automatically", async () => {
    const first = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("bench-export.csv", fields, foreign(goodRows)) });
    expect(first.status).toBe(422);
    const body = (await first.json()) as { error: { details: { mapping: { headers: string[]; preview: string[][]; headerLine: number } } } };
    expect(body.error.details.mapping.headers).toEqual(["Pin_dBm", "Fund (dBm)", "Harm2 (dBm)", "Harm3 (dBm)", "Temp_F"]);
    expect(body.error.details.mapping.headerLine).toBe(2);
    expect(body.error.details.mapping.preview[0]).toEqual(["-2", "-40.1", "-24.0", "-55.2", "77"]);

    const saved = await as.engineer.request("/api/column-mappings", {
      json: {
        name: "Bench 3 export",
        kind: "drive-sweep",
        headers: body.error.details.mapping.headers,
        mapping: [
          { column: "Pin_dBm", target: "input_power", unit: "dBm" },
          { column: "Fund (dBm)", target: "p1_out", unit: "dBm" },
          { column: "Harm2 (dBm)", target: "p2_out", unit: "dBm" },
          { column: "Harm3 (dBm)", target: "p3_out", unit: "dBm" },
        ],
        metadata: { wanted_order: "2" },
      },
    });
    expect(saved.status, await saved.clone().text()).toBe(201);
    const second = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("bench-export.csv", fields, foreign(goodRows)) });
    const set = (await second.json()) as { measurementSet: { kind: string; conditions: { serial: string; inputFrequencyHz: number }; parameters: { name: string; value: number; conditions: Record<string, number> }[] } };
    expect(second.status, JSON.stringify(set)).toBe(201);
    expect(set.measurementSet.kind).toBe("drive-sweep");
    expect(set.measurementSet.conditions).toMatchObject({ serial: fields.serial, inputFrequencyHz: 1e9 });
    expect(set.measurementSet.parameters.length).toBeGreaterThan(0);
  });

  it("reports a bad cell of a mapped file at its line and column in the original file", async () => {
    const rows = [...goodRows.slice(0, 2), "2;-35.9;oops;-50.1;77"];
    const r = await as.engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("bench-export-bad.csv", fields, foreign(rows)) });
    expect(r.status).toBe(422);
    const { error } = (await r.json()) as { error: { message: string; details: { ingest: { line: number; column: number; field: string } } } };
    expect(error.details.ingest).toMatchObject({ line: 5, column: 3, field: "Harm2 (dBm)" });
    expect(error.message).toMatch(/^bench-export-bad\.csv line 5, column 3/);
  });

  it("refuses a mapping that leaves out a required quantity", async () => {
    const r = await as.engineer.request("/api/column-mappings", {
      json: { name: "Half", kind: "two-tone", headers: ["a", "b"], mapping: [{ column: "a", target: "input_power", unit: "dBm" }] },
    });
    expect(r.status).toBe(422);
    expect(((await r.json()) as { error: { message: string } }).error.message).toMatch(/Fundamental output per tone/);
  });
});

describe("editing a device", () => {
  it("lets an engineer of the organization edit it, refuses reviewers and other organizations, and audits the change", async () => {
    const device = await makeDevice(org.organization.id);
    const body = { partNumber: device.partNumber, deviceClass: "frequency-multiplier", title: "Edited doubler", description: "", keyConditions: { driveLevelDbm: 13, multiplicationFactor: 2 } };
    expect((await as.reviewer.request(`/api/devices/${device.id}`, { method: "PATCH", json: body })).status).toBe(403);
    expect((await as.otherEngineer.request(`/api/devices/${device.id}`, { method: "PATCH", json: body })).status).toBe(404);
    const r = await as.engineer.request(`/api/devices/${device.id}`, { method: "PATCH", json: body });
    expect(r.status).toBe(200);
    expect(((await r.json()) as { device: { title: string; keyConditions: { driveLevelDbm: number } } }).device).toMatchObject({ title: "Edited doubler", keyConditions: { driveLevelDbm: 13 } });
    const { AuditEvent } = (await import("@/models")).db();
    const event = await AuditEvent.findOne({ where: { action: "device.update", subjectId: String(device.id) } });
    expect((event!.before as { title: string }).title).toBe("Factory doubler");
  });
});
