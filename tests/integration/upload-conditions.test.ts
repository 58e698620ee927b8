import { randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeOrganization } from "./helpers/factories";
import { fixtureUpload, fixturesDir, uploadRowCounts } from "./helpers/uploads";

// Issue 13, item 1: the bench API takes each class's own conditions (templates/<class>/conditions.ts).
// A mixer states RF, LO and IF frequencies and LO drive; a hybrid its band, over which its figures are
// derived. Another class's condition, a reversed band and a band the file does not cover are 422s
// naming the field, and nothing is stored.

type Posted = { measurementSet: { conditions: Record<string, unknown>; parameters: { name: string; value: number; conditions: Record<string, string | number> }[] } };
type Refused = { error: { code: string; message: string; details?: { field?: string; fields?: { field: string }[] } } };

let token: string;
const parts: Record<"mixer" | "hybrid", string> = { mixer: "", hybrid: "" };
const bench = new TestClient();
let serial = 0;

beforeAll(async () => {
  const org = await makeOrganization();
  const { Device } = db();
  for (const [key, deviceClass] of [["mixer", "double-balanced-mixer"], ["hybrid", "quadrature-hybrid"]] as const) {
    parts[key] = `UC-${randomBytes(3).toString("hex")}`;
    await Device.create({ organizationId: org.organization.id, createdById: null, partNumber: parts[key], deviceClass, title: `Conditions ${key}`, description: "", keyConditions: {} });
  }
  const admin = new TestClient();
  expect((await admin.signIn(org.users.admin.email, factoryPassword)).ok).toBe(true);
  const created = await admin.request("/api/admin/bench-tokens", { json: { name: "Conditions bench" } });
  token = ((await created.json()) as { token: string }).token;
});
afterAll(() => closeDb());

function twoToneFile(): Uint8Array<ArrayBuffer> {
  const text = readFileSync(path.join(fixturesDir, "examples/two-tone-mixer.tsv"), "utf8").replace("# serial: BFD-0107", `# serial: UC-TT-${Date.now()}-${serial++}`);
  return new Uint8Array(Buffer.from(text, "utf8"));
}

/** The example hybrid (1.5–2.5 GHz in 50 MHz steps) with a comment that makes its bytes new. */
function hybridFile(): Uint8Array<ArrayBuffer> {
  const text = readFileSync(path.join(fixturesDir, "examples/hybrid-4port-v2.s4p"), "utf8").replace("serial BFD-4411", `serial UC-HY-${Date.now()}-${serial++}`);
  return new Uint8Array(Buffer.from(text, "utf8"));
}

function benchUpload(part: string, name: string, bytes: Uint8Array<ArrayBuffer>, fields: Record<string, string>) {
  return bench.request("/api/v1/measurements", {
    multipart: fixtureUpload(name, { device: part, ...fields }, bytes),
    headers: { authorization: `Bearer ${token}` },
    origin: null,
  });
}

describe("a mixer's conditions", () => {
  it("LO and IF frequencies stated with the upload reach the set and its figures; the file's RF and LO drive are kept", async () => {
    const r = await benchUpload(parts.mixer, "examples/two-tone-mixer.tsv", twoToneFile(), { loFrequencyHz: "1.07e9", ifFrequencyHz: "70e6" });
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(body.measurementSet.conditions).toMatchObject({ loFrequencyHz: 1.07e9, ifFrequencyHz: 7e7, loDriveDbm: 7 });
    const iip3 = body.measurementSet.parameters.find((p) => p.name === "iip3" && p.conditions.method === "slope-fit")!;
    expect(iip3.conditions).toMatchObject({ rfFrequencyHz: 1e9, loFrequencyHz: 1.07e9, ifFrequencyHz: 7e7, loPowerDbm: 7 });
  });
});

describe("a hybrid's band", () => {
  it("the figures are derived over the stated band and carry it", async () => {
    const full = (await (await benchUpload(parts.hybrid, "examples/hybrid-4port-v2.s4p", hybridFile(), { serial: "UC-HY-FULL" })).json()) as Posted;
    const r = await benchUpload(parts.hybrid, "examples/hybrid-4port-v2.s4p", hybridFile(), { serial: "UC-HY-BAND", bandStartHz: "1.8e9", bandStopHz: "2.2e9" });
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(body.measurementSet.conditions).toMatchObject({ bandStartHz: 1.8e9, bandStopHz: 2.2e9 });
    const worst = (p: Posted, name: string) => p.measurementSet.parameters.find((x) => x.name === name && x.conditions.statistic === "worst" && x.conditions.path === "S21")!;
    expect(worst(body, "insertion-loss").conditions).toMatchObject({ startHz: 1.8e9, stopHz: 2.2e9 });
    expect(worst(full, "insertion-loss").conditions).toMatchObject({ startHz: 1.5e9, stopHz: 2.5e9 });
    // The stated band is inside the file's: its highest loss cannot exceed the whole file's.
    expect(worst(body, "insertion-loss").value).toBeLessThanOrEqual(worst(full, "insertion-loss").value);
  });
});

describe("conditions the class does not state, and bands the data cannot honour, are refused; nothing is stored", () => {
  it.each([
    ["hybrid", { splitterExcessLossDb: "0.4" }, "splitterExcessLossDb", "Splitter excess loss (splitterExcessLossDb) is not a condition of a quadrature hybrid or power splitter; this class states: band start (bandStartHz), band stop (bandStopHz)."],
    ["hybrid", { inputFrequencyHz: "2e9" }, "inputFrequencyHz", "is not a condition of a quadrature hybrid"],
    ["hybrid", { bandStartHz: "1.8e9" }, "bandStopHz", "State both ends: band start and band stop."],
    ["hybrid", { bandStartHz: "2.2e9", bandStopHz: "1.8e9" }, "bandStopHz", "The band stop must lie above the band start."],
    ["hybrid", { bandStartHz: "1e9", bandStopHz: "2e9" }, "bandStartHz", "below the file's lowest frequency: the file spans 1500000000 to 2500000000 Hz"],
    ["hybrid", { bandStartHz: "1.81e9", bandStopHz: "1.82e9" }, "bandStopHz", "The band holds 0 of the file's frequencies"],
    ["hybrid", { bandStartHz: "0x10", bandStopHz: "2e9" }, "bandStartHz", "band start (Hz) must be a decimal number"],
    ["mixer", { driveLevelDbm: "7" }, "driveLevelDbm", "Drive level (driveLevelDbm) is not a condition of a double-balanced mixer; this class states: RF frequency (rfFrequencyHz), LO frequency (loFrequencyHz), IF frequency (ifFrequencyHz), LO drive (loDriveDbm)."],
    ["mixer", { loDriveDbm: "Infinity" }, "loDriveDbm", "LO drive (dBm) must be a decimal number"],
    ["mixer", { ifFrequencyHz: "-70e6" }, "ifFrequencyHz", "IF frequency (Hz) must be at least 1"],
  ] as const)("%s %j → 422 naming %s", async (part, fields, field, message) => {
    const before = await uploadRowCounts();
    const r = part === "hybrid" ? await benchUpload(parts.hybrid, "examples/hybrid-4port-v2.s4p", hybridFile(), { serial: "UC-HY-BAD", ...fields }) : await benchUpload(parts.mixer, "examples/two-tone-mixer.tsv", twoToneFile(), fields);
    const body = (await r.json()) as Refused;
    expect(r.status, JSON.stringify(body)).toBe(422);
    expect(body.error.details?.field ?? body.error.details?.fields?.[0]?.field).toBe(field);
    expect(body.error.message).toContain(message);
    expect(await uploadRowCounts()).toEqual(before);
  });
});
