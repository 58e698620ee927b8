import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload, fixturesDir, uploadRowCounts } from "./helpers/uploads";

// Impossible dates and non-decimal numbers, through every form and API that takes them: each is a
// 422 that names the field (or the file, line and field), never a 500, and nothing is stored.

type ErrorBody = { error: { code: string; message: string; details?: { fields?: { field: string; message: string }[]; ingest?: { fileName: string; line?: number; field?: string } } } };

let org: Awaited<ReturnType<typeof makeOrganization>>;
let deviceId: number;
let partNumber: string;
let benchToken: string;
const engineer = new TestClient();
const admin = new TestClient();

beforeAll(async () => {
  org = await makeOrganization();
  const device = await makeDevice(org.organization.id);
  deviceId = device.id;
  partNumber = device.partNumber;
  expect((await engineer.signIn(org.users.engineer.email, factoryPassword)).ok).toBe(true);
  expect((await admin.signIn(org.users.admin.email, factoryPassword)).ok).toBe(true);
  const created = await admin.request("/api/admin/bench-tokens", { json: { name: "Validation bench" } });
  benchToken = ((await created.json()) as { token: string }).token;
});
afterAll(() => closeDb());


async function expectFieldError(r: Response, field: string): Promise<ErrorBody> {
  const body = (await r.json()) as ErrorBody;
  expect(r.status, JSON.stringify(body)).toBe(422);
  expect(body.error.code).toBe("invalid");
  expect(body.error.details?.fields?.[0]?.field).toBe(field);
  expect(body.error.message.startsWith(`${field}: `)).toBe(true);
  return body;
}

/** The doubler example with one more metadata line after `# serial:` (line 3 of the file). */
function driveSweepWith(line: string, serial: string): Uint8Array<ArrayBuffer> {
  const text = readFileSync(path.join(fixturesDir, "examples/drive-sweep-doubler.csv"), "utf8")
    .replace("# serial: BFD-0001", `# serial: ${serial}\n${line}`)
    .replace("-5.00,", "-5.0,");
  return new Uint8Array(Buffer.from(text, "utf8"));
}

const impossibleDates = ["2026-02-30", "2025-02-29", "2026-13-01", "2026-04-31", "0000-00-00", "2026-00-10"];

describe("impossible calendar dates answer 422 naming the field", () => {
  it.each(impossibleDates)("upload form measuredOn %s", async (date) => {
    const before = await uploadRowCounts();
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/phase-noise-doubler.csv", { measuredOn: date }) });
    await expectFieldError(r, "measuredOn");
    expect(await uploadRowCounts()).toEqual(before);
  });

  it.each(impossibleDates)("bench API measuredOn %s", async (date) => {
    const before = await uploadRowCounts();
    const form = fixtureUpload("examples/two-tone-mixer.tsv", { device: partNumber, measuredOn: date });
    const r = await new TestClient().request("/api/v1/measurements", { multipart: form, headers: { authorization: `Bearer ${benchToken}` }, origin: null });
    await expectFieldError(r, "measuredOn");
    expect(await uploadRowCounts()).toEqual(before);
  });

  it.each(impossibleDates)("file metadata # date: %s names the file, line and field", async (date) => {
    const before = await uploadRowCounts();
    const form = fixtureUpload("examples/drive-sweep-doubler.csv", {}, driveSweepWith(`# date: ${date}`, `BFD-DATE-${date}`));
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: form });
    const body = (await r.json()) as ErrorBody;
    expect(r.status, JSON.stringify(body)).toBe(422);
    expect(body.error.details?.ingest).toMatchObject({ fileName: "drive-sweep-doubler.csv", line: 3, field: "date" });
    expect(body.error.message).toContain(`drive-sweep-doubler.csv line 3 ("date")`);
    expect(await uploadRowCounts()).toEqual(before);
  });

  it("a real leap day in a file's metadata is kept as the measurement date", async () => {
    const form = fixtureUpload("examples/drive-sweep-doubler.csv", {}, driveSweepWith("# date: 2024-02-29", "BFD-LEAP"));
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: form });
    const body = (await r.json()) as { measurementSet: { measuredOn: string } };
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(body.measurementSet.measuredOn).toBe("2024-02-29");
  });

  const instrument = (dates: { calibratedOn: string; calibrationDueOn: string }) => ({
    kind: "power meter",
    model: "Thermal sensor head",
    serial: `PM-${Math.random().toString(36).slice(2, 10)}`,
    ...dates,
  });
  it.each(impossibleDates)("instrument calibratedOn %s", async (date) => {
    await expectFieldError(await admin.request("/api/admin/instruments", { json: instrument({ calibratedOn: date, calibrationDueOn: "2027-01-31" }) }), "calibratedOn");
  });
  it.each(impossibleDates)("instrument calibrationDueOn %s", async (date) => {
    await expectFieldError(await admin.request("/api/admin/instruments", { json: instrument({ calibratedOn: "2024-01-31", calibrationDueOn: date }) }), "calibrationDueOn");
  });
  it("an instrument with real dates, one a leap day, is saved", async () => {
    const r = await admin.request("/api/admin/instruments", { json: instrument({ calibratedOn: "2024-02-29", calibrationDueOn: "2025-02-28" }) });
    expect(r.status).toBe(201);
  });
});

describe("numbers parse strictly: blank is missing, only decimal notation", () => {
  it.each([
    ["temperatureC", "0x10"],
    ["temperatureC", "0b101"],
    ["temperatureC", "0o17"],
    ["driveLevelDbm", "Infinity"],
    ["driveLevelDbm", "NaN"],
    ["cableLossDb", "1,5"],
    ["cableLossDb", "1_0"],
    ["splitterExcessLossDb", "2 dB"],
    ["inputFrequencyHz", "1e400"],
  ])("upload %s = %j → 422 naming the field, nothing stored", async (field, value) => {
    const before = await uploadRowCounts();
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, {
      multipart: fixtureUpload("examples/hybrid-4port-v2.s4p", { serial: `BFD-NUM-${field}`, [field]: value }),
    });
    await expectFieldError(r, field);
    expect(await uploadRowCounts()).toEqual(before);
  });

  it("the bench API refuses a hexadecimal drive level", async () => {
    const form = fixtureUpload("examples/two-tone-mixer.tsv", { device: partNumber, driveLevelDbm: "0x7" });
    const r = await new TestClient().request("/api/v1/measurements", { multipart: form, headers: { authorization: `Bearer ${benchToken}` }, origin: null });
    await expectFieldError(r, "driveLevelDbm");
  });

  it("a blank or spaces-only field is missing, not 0", async () => {
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, {
      multipart: fixtureUpload("examples/attenuator-2port.s2p", { serial: "BFD-BLANK", temperatureC: "  ", cableLossDb: "", driveLevelDbm: "\t" }),
    });
    const body = (await r.json()) as { measurementSet: { conditions: Record<string, unknown> } };
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(body.measurementSet.conditions).not.toHaveProperty("temperatureC");
    expect(body.measurementSet.conditions).not.toHaveProperty("cableLossDb");
    expect(body.measurementSet.conditions).not.toHaveProperty("driveLevelDbm");
  });

  it("a decimal with an exponent and a leading sign is a number", async () => {
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, {
      multipart: fixtureUpload("examples/splitter-3port.s3p", { serial: "BFD-EXP", temperatureC: "-4.0e1", inputFrequencyHz: "2.4E9" }),
    });
    const body = (await r.json()) as { measurementSet: { conditions: Record<string, unknown> } };
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(body.measurementSet.conditions).toMatchObject({ temperatureC: -40, inputFrequencyHz: 2.4e9 });
  });

  it("instrument ids are decimal: a hexadecimal id is refused", async () => {
    const created = await admin.request("/api/admin/instruments", {
      json: { kind: "signal generator", model: "Synthesizer", serial: `SG-${Date.now()}`, calibratedOn: "2026-01-05", calibrationDueOn: "2027-01-05" },
    });
    const { instrument } = (await created.json()) as { instrument: { id: number } };
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, {
      multipart: fixtureUpload("examples/hybrid-4port.s4p", { serial: "BFD-HEXID", instrumentIds: `0x${instrument.id.toString(16)}` }),
    });
    const body = await expectFieldError(r, "instrumentIds.0");
    expect(body.error.message).toContain("0x");
  });

  it("a device id in the path is decimal: 0x… is the same 404 as an unknown id", async () => {
    expect((await engineer.request(`/api/devices/${deviceId}`)).status).toBe(200);
    expect((await engineer.request(`/api/devices/0x${deviceId.toString(16)}`)).status).toBe(404);
    expect((await engineer.request(`/api/devices/${deviceId}.0`)).status).toBe(404);
    expect((await engineer.request(`/api/devices/%20${deviceId}`)).status).toBe(404);
  });
});

describe("ranges: min above max is refused with a message", () => {
  const device = (keyConditions: Record<string, unknown>) => ({
    partNumber: `RNG-${Math.random().toString(36).slice(2, 8)}`,
    deviceClass: "frequency-multiplier",
    title: "Range check doubler",
    keyConditions,
  });

  it.each(["inputFrequencyHz", "outputFrequencyHz"])("device %s band with min above max", async (key) => {
    const r = await engineer.request("/api/devices", { json: device({ [key]: { min: 4e9, max: 2e9 } }) });
    const body = await expectFieldError(r, `keyConditions.${key}.max`);
    expect(body.error.message).toMatch(/above|below/);
  });

  it("a device band with min equal to max is one frequency, and accepted", async () => {
    const r = await engineer.request("/api/devices", { json: device({ inputFrequencyHz: { min: 2e9, max: 2e9 } }) });
    expect(r.status).toBe(201);
  });

  it("spec limits with min above max are refused", async () => {
    const r = await engineer.request(`/api/devices/${deviceId}/spec-limits`, {
      method: "PUT",
      json: { limits: [{ parameter: "conversion-loss", conditionsKey: "", min: 12, max: 8, unit: "dB", basis: "test" }] },
    });
    const body = await expectFieldError(r, "limits.0.max");
    expect(body.error.message).toMatch(/above|exceed/);
  });
});

describe("a device description is held to the sheet's prose limits when it is saved", () => {
  it("a description nested deeper than the limit is refused (422 naming the field and the limit), and nothing changes", async () => {
    const deep = `${"> ".repeat(14)}too deep`;
    const before = await (await engineer.request(`/api/devices/${deviceId}`)).json();
    const r = await engineer.request(`/api/devices/${deviceId}`, {
      method: "PATCH",
      json: { partNumber, deviceClass: "frequency-multiplier", title: "Factory doubler", description: deep, keyConditions: { multiplicationFactor: 2 } },
    });
    expect(r.status).toBe(422);
    const body = (await r.json()) as ErrorBody;
    expect(body.error.details?.fields?.[0].field).toBe("description");
    expect(body.error.details?.fields?.[0].message).toMatch(/more than 10 levels deep/);
    expect(await (await engineer.request(`/api/devices/${deviceId}`)).json()).toEqual(before);
  });
});

describe("an address whose %-escapes do not decode", () => {
  it.each(["/devices/%E0%A4%A", "/api/devices/%E0%A4%A", "/r/%E0%A4%A", "/datasheets/x/%FF/A"])("%s answers 400 in words, never 500", async (path) => {
    const r = await engineer.request(path);
    expect(r.status).toBe(400);
    expect(await r.text()).toMatch(/does not decode/);
  });
});
