import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload, fixturesDir, uploadRowCounts } from "./helpers/uploads";

/**
 * The measurement settings of an upload (issue 12): the phase-noise integration band from the file's
 * lines, the bench API's or form's fields, or the device class's default, in that order; a band
 * outside the trace refused with the band and the trace's span; the per-point tables in the answer.
 */
type Parameter = { name: string; value: number | null; conditions: Record<string, string | number> };
type Posted = { measurementSet: { id: number; parameters: Parameter[]; warnings: string[] }; tables: { id: string; columns: { label: string; unit: string }[]; rows: (number | null)[][] }[] };
type Refused = { error: { message: string; details: { field?: string } } };

let token: string;
let partNumber: string;
let deviceId: number;
const engineer = new TestClient();
const bench = new TestClient();
let serial = 0;

/** The example trace (1 Hz – 10 MHz) under a fresh serial, so each upload is new bytes; extra `# key: value` lines after the temperature. */
function phaseNoiseFile(extraLines: string[] = []): Uint8Array<ArrayBuffer> {
  const text = readFileSync(path.join(fixturesDir, "examples/phase-noise-doubler.csv"), "utf8")
    .replace("# serial: BFD-0001", `# serial: SET-${Date.now()}-${serial++}`)
    .replace("# temperature: 25 C", ["# temperature: 25 C", ...extraLines].join("\n"));
  return new Uint8Array(Buffer.from(text, "utf8"));
}

function benchUpload(fields: Record<string, string>, bytes = phaseNoiseFile(), name = "examples/phase-noise-doubler.csv") {
  return bench.request("/api/v1/measurements", {
    multipart: fixtureUpload(name, { device: partNumber, ...fields }, bytes),
    headers: { authorization: `Bearer ${token}` },
    origin: null,
  });
}

const jitterOf = (body: Posted) => body.measurementSet.parameters.find((p) => p.name === "rms-jitter")!;
const noBreak = (text: string) => text.replaceAll("\u00a0", " ");

beforeAll(async () => {
  const org = await makeOrganization();
  const device = await makeDevice(org.organization.id);
  partNumber = device.partNumber;
  deviceId = device.id;
  const admin = new TestClient();
  expect((await admin.signIn(org.users.admin.email, factoryPassword)).ok).toBe(true);
  expect((await engineer.signIn(org.users.engineer.email, factoryPassword)).ok).toBe(true);
  const created = await admin.request("/api/admin/bench-tokens", { json: { name: "Settings bench" } });
  token = ((await created.json()) as { token: string }).token;
});
afterAll(() => closeDb());

describe("integration band precedence through the bench API", () => {
  it("without a stated band the device class's default applies (frequency multiplier: 10 Hz – 1 MHz)", async () => {
    const r = await benchUpload({});
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(jitterOf(body).conditions).toMatchObject({ startHz: 10, stopHz: 1e6, bandSource: "template" });
    // The same figure the CLI prints for this trace over 10 Hz – 1 MHz (tests/unit/cli/__snapshots__).
    expect(jitterOf(body).value).toBeCloseTo(1.361, 3);
  });

  it("the bench API's ends win over the class default", async () => {
    const r = await benchUpload({ integrationStartHz: "1000", integrationStopHz: "100000" });
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(jitterOf(body).conditions).toMatchObject({ startHz: 1e3, stopHz: 1e5, bandSource: "upload" });
    const rmsPhase = body.measurementSet.parameters.find((p) => p.name === "rms-phase-error")!;
    expect(rmsPhase.conditions).toMatchObject({ startHz: 1e3, stopHz: 1e5, bandSource: "upload" });
  });

  it("a named band from the form's list", async () => {
    const r = await benchUpload({ integrationBand: "100-1m" });
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(jitterOf(body).conditions).toMatchObject({ startHz: 100, stopHz: 1e6, bandSource: "upload" });
  });

  it("the file's own lines win over the API, and the set's warnings say which was used", async () => {
    const r = await benchUpload({ integrationBand: "100-1m" }, phaseNoiseFile(["# integration_start: 1 kHz", "# integration_stop: 100 kHz"]));
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(jitterOf(body).conditions).toMatchObject({ startHz: 1e3, stopHz: 1e5, bandSource: "file" });
    expect(body.measurementSet.warnings.map(noBreak)).toContain("Integration band: the file says 1 kHz – 100 kHz, the upload said 100 Hz – 1 MHz; the file's is used");
  });

  it("the browser upload takes the same fields", async () => {
    const r = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/phase-noise-doubler.csv", { integrationBand: "10-1m" }, phaseNoiseFile()) });
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(jitterOf(body).conditions).toMatchObject({ startHz: 10, stopHz: 1e6, bandSource: "upload" });
  });
});

describe("a band the data cannot honour is refused, nothing stored", () => {
  it.each([
    [{ integrationBand: "12k-20m" }, [], "integrationBand", "The integration band 12 kHz – 20 MHz (set by the upload) reaches outside the trace, which spans 1 Hz – 10 MHz"],
    [{}, ["# integration_start: 0.1 Hz", "# integration_stop: 1 kHz"], "integrationBand", "The integration band 0.1 Hz – 1 kHz (set by the file) reaches outside the trace, which spans 1 Hz – 10 MHz"],
    [{ integrationStartHz: "1000" }, [], "integrationStopHz", "State both ends of the integration band"],
    [{ integrationStartHz: "1e5", integrationStopHz: "1e3" }, [], "integrationStopHz", "stop offset must lie above its start"],
    [{ integrationBand: "1-2" }, [], "integrationBand", "Choose one of the named bands"],
  ])("%j %j → 422", async (fields, lines, field, message) => {
    const before = await uploadRowCounts();
    const r = await benchUpload(fields as Record<string, string>, phaseNoiseFile(lines));
    const body = (await r.json()) as Refused;
    expect(r.status, JSON.stringify(body)).toBe(422);
    expect(noBreak(JSON.stringify(body))).toContain(message);
    expect(JSON.stringify(body)).toContain(field);
    expect(await uploadRowCounts()).toEqual(before);
  });
});

describe("compression reference and per-point values through the bench API", () => {
  it("a stated reference drive is used and named; one outside the sweep is refused", async () => {
    const twoTone = new Uint8Array(readFileSync(path.join(fixturesDir, "examples/two-tone-mixer.tsv")));
    const r = await benchUpload({ compressionReferenceDbm: "-16" }, twoTone, "examples/two-tone-mixer.tsv");
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    const p1db = body.measurementSet.parameters.find((p) => p.name === "input-p1db")!;
    expect(p1db.conditions).toMatchObject({ referenceDbm: -16, referenceSource: "upload" });
    expect(body.tables[0].columns.map((c) => c.unit)).toEqual(["dBm", "Vrms", "dBµV", "dBm", "Vrms", "dBµV"]);
    // 0 dBm into 50 Ω is 0.2236 Vrms and 107.0 dBµV; each row's cells agree with that ratio.
    const [, toneDbm, toneVrms, toneDbuv] = body.tables[0].rows[0] as number[];
    expect(toneVrms).toBeCloseTo(0.22360679775 * 10 ** (toneDbm / 20), 12);
    expect(toneDbuv).toBeCloseTo(toneDbm + 106.9897, 4);

    const bytes = new Uint8Array(Buffer.from(readFileSync(path.join(fixturesDir, "examples/two-tone-mixer.tsv"), "utf8").replace(/^(# serial: .*)$/m, "$1-B"), "utf8"));
    const refused = await benchUpload({ compressionReferenceDbm: "-40" }, bytes, "examples/two-tone-mixer.tsv");
    expect(refused.status).toBe(422);
    expect(noBreak(JSON.stringify(await refused.json()))).toContain("The reference drive −40 dBm lies outside the sweep");
  });

  it("a Touchstone upload answers every frequency's S-parameters, phase and mismatch loss", async () => {
    const r = await benchUpload({ serial: `S2P-${Date.now()}` }, new Uint8Array(readFileSync(path.join(fixturesDir, "examples/attenuator-2port.s2p"))), "examples/attenuator-2port.s2p");
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    const table = body.tables[0];
    expect(table.id).toBe("s-parameters-per-frequency");
    expect(table.columns.slice(0, 2)).toEqual([{ label: "S11", unit: "dB" }, { label: "S11", unit: "deg" }]);
    expect(table.columns.at(-1)).toEqual({ label: "mismatch loss port 2", unit: "dB" });
    expect(table.rows.length).toBeGreaterThan(2);
    expect(body.measurementSet.parameters.some((p) => p.name === "mismatch-loss" && p.conditions.statistic === "worst")).toBe(true);

    const page = await engineer.request(`/devices/${deviceId}/measurements/${body.measurementSet.id}`);
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(html).toContain("Values at each point");
    expect(html).toContain("mismatch loss port 1");
  });
});

describe("the impedance of power readings (issue 12: dBm ↔ Vrms ↔ dBµV for the stated impedance)", () => {
  type Table = Posted["tables"][number] & { impedanceOhm?: number; impedanceSource?: string };
  /** The two-tone example under a fresh serial, with extra `# key: value` lines after the serial. */
  function twoToneFile(extraLines: string[] = []): Uint8Array<ArrayBuffer> {
    const text = readFileSync(path.join(fixturesDir, "examples/two-tone-mixer.tsv"), "utf8").replace(/^# serial: .*$/m, [`# serial: Z-${Date.now()}-${serial++}`, ...extraLines].join("\n"));
    return new Uint8Array(Buffer.from(text, "utf8"));
  }
  const upload = (fields: Record<string, string>, lines: string[] = []) => benchUpload(fields, twoToneFile(lines), "examples/two-tone-mixer.tsv");

  it("the upload's field is used, stored with the set and named by the table; read back the same through GET /api/v1/measurements/{id}", async () => {
    const r = await upload({ impedanceOhm: "75" });
    const body = (await r.json()) as Posted & { measurementSet: { conditions: { impedanceOhm?: number } } };
    expect(r.status, JSON.stringify(body)).toBe(201);
    const table = body.tables[0] as Table;
    expect(table).toMatchObject({ impedanceOhm: 75, impedanceSource: "upload" });
    expect(body.measurementSet.conditions.impedanceOhm).toBe(75);
    // V = √(P·R), dBµV = 20·log10(V / 1 µV) (definitions; IEC 60050-112 for the decibel): 0 dBm into 75 Ω
    // is √(1e-3·75) = 0.27386 Vrms = 108.75 dBµV, so each row's cells follow that ratio.
    const [, toneDbm, toneVrms, toneDbuv] = table.rows[0] as number[];
    expect(toneVrms).toBeCloseTo(0.27386127875 * 10 ** (toneDbm / 20), 12);
    expect(toneDbuv).toBeCloseTo(toneDbm + 108.7506, 4);

    const read = await bench.request(`/api/v1/measurements/${body.measurementSet.id}`, { headers: { authorization: `Bearer ${token}` }, origin: null });
    expect(read.status).toBe(200);
    const again = (await read.json()) as Posted;
    expect(again.tables).toEqual(body.tables);
    expect(again.measurementSet.id).toBe(body.measurementSet.id);

    const page = await engineer.request(`/devices/${deviceId}/measurements/${body.measurementSet.id}`);
    expect(noBreak(await page.text())).toContain("75 Ω, set by the upload");
  });

  it("the file's `# impedance:` line wins over the upload's field, and the set's warnings say so", async () => {
    const r = await upload({ impedanceOhm: "50" }, ["# impedance: 75 ohm"]);
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    expect(body.tables[0]).toMatchObject({ impedanceOhm: 75, impedanceSource: "file" });
    expect(noBreak(body.measurementSet.warnings.join("\n"))).toContain("Impedance: the file says 75 Ω, the upload said 50 Ω; the file's is used");
  });

  it("without a stated impedance the tables use 50 Ω and say it is Benchfold's default", async () => {
    const r = await upload({});
    const body = (await r.json()) as Posted;
    expect(r.status).toBe(201);
    expect(body.tables[0]).toMatchObject({ impedanceOhm: 50, impedanceSource: "engine" });
  });

  it.each([
    [{ impedanceOhm: "0" }, [], "impedanceOhm"],
    [{ impedanceOhm: "-75" }, [], "impedanceOhm"],
    [{ impedanceOhm: "5000" }, [], "impedanceOhm"],
    [{ impedanceOhm: "Infinity" }, [], "impedanceOhm"],
    [{}, ["# impedance: 0.5 ohm"], "impedance"],
    [{}, ["# impedance: fifty"], "impedance"],
  ])("%j %j is refused with 422 naming %s, nothing stored", async (fields, lines, field) => {
    const before = await uploadRowCounts();
    const r = await upload(fields as Record<string, string>, lines as string[]);
    const text = await r.text();
    expect(r.status, text).toBe(422);
    expect(text).toContain(field);
    expect(await uploadRowCounts()).toEqual(before);
  });
});


describe("discrete spurs in dBc and the excess over ideal ×N through an upload (issue 13)", () => {
  type WithUnit = Parameter & { unit: string };
  /** The example without its RBW column (offset, L, L_input), under a fresh serial. */
  function withoutBandwidthColumn(): Uint8Array<ArrayBuffer> {
    const text = Buffer.from(phaseNoiseFile()).toString("utf8")
      .split("\n")
      .map((line) => (line.startsWith("#") || line === "" ? line : line.split(",").filter((_, i) => i !== 2).join(",")))
      .join("\n");
    return new Uint8Array(Buffer.from(text, "utf8"));
  }
  /** The rows of the set page's parameters table whose heading cell is `label`, as text. */
  async function pageRows(setId: number, label: string): Promise<string[]> {
    const page = await engineer.request(`/devices/${deviceId}/measurements/${setId}`);
    expect(page.status).toBe(200);
    const html = noBreak(await page.text());
    return [...html.matchAll(/<tr>(.*?)<\/tr>/g)].map((m) => m[1]).filter((row) => row.includes(`>${label}</th>`)).map((row) => row.replace(/<[^>]+>/g, " ").replace(/\s+/g, " "));
  }

  it("the file's RBW column gives each spur in dBc with its offset and bandwidth; the set page prints them in dBc", async () => {
    const r = await benchUpload({});
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    const parameters = body.measurementSet.parameters as WithUnit[];
    const spurs = parameters.filter((p) => p.name === "discrete-spur");
    expect(spurs.map((p) => [p.conditions.offsetHz, p.unit, p.conditions.bandwidthSource])).toEqual([
      [50, "dBc", "file"],
      [150, "dBc", "file"],
      [25000, "dBc", "file"],
    ]);
    // −108.5 dBc/Hz plotted at RBW 1 Hz: −108.5 + 10·log10(1.0645) = −108.229 dBc (the same as the CLI's, tests/unit/cli/__snapshots__).
    expect(parameters.find((p) => p.name === "worst-discrete-spur")!.value).toBeCloseTo(-108.229, 3);
    // The source's L(f) in the file's L_input column: the excess over ideal ×2 at 1 kHz, as the CLI prints it.
    expect(parameters.find((p) => p.name === "excess-over-ideal-multiplication" && p.conditions.offsetHz === 1000)!.value).toBeCloseTo(1.609, 3);

    const rows = await pageRows(body.measurementSet.id, "Discrete spur");
    expect(rows).toHaveLength(3);
    for (const row of rows) {
      expect(row).toMatch(/ dBc $/);
      expect(row).toContain("bandwidth set by the file");
    }
    expect(rows[0]).toContain("−108.23 dBc");
    expect(await pageRows(body.measurementSet.id, "Spur as plotted")).toEqual([]);
  });

  it("the upload's resolution bandwidth when the file states none", async () => {
    const r = await benchUpload({ resolutionBandwidthHz: "1" }, withoutBandwidthColumn());
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    const spur = body.measurementSet.parameters.find((p) => p.name === "discrete-spur" && p.conditions.offsetHz === 50)!;
    expect(spur.conditions).toMatchObject({ resolutionBandwidthHz: 1, bandwidthSource: "upload" });
    expect(spur.value).toBeCloseTo(-108.229, 3);
  });

  it("without a bandwidth the spurs stay as plotted in dBc/Hz, with a warning, and the set page labels them so", async () => {
    const r = await benchUpload({}, withoutBandwidthColumn());
    const body = (await r.json()) as Posted;
    expect(r.status, JSON.stringify(body)).toBe(201);
    const parameters = body.measurementSet.parameters as WithUnit[];
    expect(parameters.some((p) => p.name === "discrete-spur" || p.name === "worst-discrete-spur")).toBe(false);
    expect(parameters.filter((p) => p.name === "spur").map((p) => p.unit)).toEqual(["dBc/Hz", "dBc/Hz", "dBc/Hz"]);
    expect(noBreak(body.measurementSet.warnings.join("\n"))).toContain("No noise or resolution bandwidth stated: the spurs at 50 Hz, 150 Hz, 25 kHz are given as plotted, in dBc/Hz, not in dBc");
    const rows = await pageRows(body.measurementSet.id, "Spur as plotted");
    expect(rows).toHaveLength(3);
    for (const row of rows) expect(row).toMatch(/ dBc\/Hz $/);
    expect(await pageRows(body.measurementSet.id, "Discrete spur")).toEqual([]);
  });

  it("both bandwidths at once are refused, nothing stored", async () => {
    const before = await uploadRowCounts();
    const r = await benchUpload({ resolutionBandwidthHz: "1", noiseBandwidthHz: "1" }, withoutBandwidthColumn());
    const body = (await r.json()) as Refused;
    expect(r.status, JSON.stringify(body)).toBe(422);
    expect(body.error.details.field).toBe("resolutionBandwidthHz");
    expect(await uploadRowCounts()).toEqual(before);
  });
});
