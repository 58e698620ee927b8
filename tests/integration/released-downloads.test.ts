import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { parseTouchstone, sParameter } from "@/lib/ingest";
import { closeDb, db } from "@/models";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeOrganization, type Who } from "./helpers/factories";
import { addApprovedSet, releaseSheet } from "./helpers/reviews";
import { fixtureUpload, fixturesDir } from "./helpers/uploads";

let org: Awaited<ReturnType<typeof makeOrganization>>;
let as: Map<Who, TestClient>;
let otherEngineer: TestClient;
const anon = new TestClient();
let partNumber: string;
let revA: RevisionSummary;
let base: string;
let currentBase: string;
const sets = { h1: 0, h2: 0, live: 0, submitted: 0 };
const bytesOf = (relative: string) => new Uint8Array(readFileSync(path.join(fixturesDir, relative)));
// Another file's bytes: the same network with a comment line of its own (a set's file is unique per device).
const variant = (tag: string) => new Uint8Array(Buffer.concat([Buffer.from(bytesOf("examples/hybrid-4port.s4p")), Buffer.from(`! ${tag}\n`)]));

beforeAll(async () => {
  org = await makeOrganization();
  const other = await makeOrganization();
  as = await clientsByRole(org);
  otherEngineer = (await clientsByRole(other)).get("engineer")!;
  partNumber = `DLH-${Date.now().toString(36).toUpperCase()}`;
  const device = await db().Device.create({
    organizationId: org.organization.id,
    createdById: null,
    partNumber,
    deviceClass: "quadrature-hybrid",
    title: "Download test hybrid",
    description: "",
    keyConditions: {},
  });
  const engineer = as.get("engineer")!;
  const reviewer = as.get("reviewer")!;
  sets.h1 = await addApprovedSet(device.id, engineer, reviewer, "examples/hybrid-4port.s4p", { serial: "H-01", temperatureC: "25", measuredOn: "2026-06-01" });
  sets.h2 = await addApprovedSet(device.id, engineer, reviewer, "examples/hybrid-4port-v2.s4p", { serial: "H-02", temperatureC: "-40", measuredOn: "2026-06-02" });
  revA = await releaseSheet(engineer, reviewer, device.id);
  // After the release: one set approved (live data the revision does not rest on) and one awaiting review.
  const live = await engineer.request(`/api/devices/${device.id}/measurements`, {
    multipart: fixtureUpload("examples/hybrid-4port.s4p", { serial: "H-03", temperatureC: "25", measuredOn: "2026-06-03" }, variant("live")),
  });
  expect(live.status, await live.clone().text()).toBe(201);
  sets.live = ((await live.json()) as { measurementSet: { id: number } }).measurementSet.id;
  expect((await reviewer.request(`/api/measurements/${sets.live}/review`, { json: { decision: "approve" } })).status).toBe(200);
  const pending = await engineer.request(`/api/devices/${device.id}/measurements`, {
    multipart: fixtureUpload("examples/hybrid-4port.s4p", { serial: "H-04", temperatureC: "25", measuredOn: "2026-06-04" }, variant("pending")),
  });
  expect(pending.status, await pending.clone().text()).toBe(201);
  sets.submitted = ((await pending.json()) as { measurementSet: { id: number } }).measurementSet.id;
  base = revA.pdfPath.replace(/\/pdf$/, "");
  currentBase = base.replace(/\/A$/, "/current");
}, 120_000);
afterAll(() => closeDb());

/** S-parameters as scikit-rf (Debian python3-scikit-rf) reads a file: frequencies in Hz, S[k][i][j] real and imaginary. */
function readWithScikitRf(fileName: string, bytes: Uint8Array): { f: number[]; re: number[][][]; im: number[][][]; z0: number[] } {
  const dir = mkdtempSync(path.join(tmpdir(), "bf-touchstone-"));
  try {
    const file = path.join(dir, fileName);
    writeFileSync(file, bytes);
    const script = [
      "import json, sys, warnings",
      "warnings.filterwarnings('ignore')",
      "import skrf",
      "n = skrf.Network(sys.argv[1])",
      "print(json.dumps({'f': [float(x) for x in n.f], 're': n.s.real.tolist(), 'im': n.s.imag.tolist(), 'z0': [float(z.real) for z in n.z0[0]]}))",
    ].join("\n");
    const out = execFileSync("/usr/bin/python3", ["-c", script, file], { encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] });
    return JSON.parse(out.trim().split("\n").pop()!);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

describe("Touchstone files behind a released revision", () => {
  it("sends the approved set's bytes exactly as uploaded, named by part, revision, serial and temperature, cached like the PDF", async () => {
    const r = await anon.request(`${base}/touchstone/${sets.h1}`);
    expect(r.status, await r.clone().text()).toBe(200);
    const bytes = new Uint8Array(await r.arrayBuffer());
    expect(Buffer.from(bytes).equals(Buffer.from(bytesOf("examples/hybrid-4port.s4p")))).toBe(true);
    expect(r.headers.get("content-disposition")).toBe(`attachment; filename="${partNumber}_revA_H-01_25C.s4p"`);
    expect(r.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    expect(r.headers.get("content-type")).toBe("application/octet-stream");
    const etag = r.headers.get("etag")!;
    expect(etag).toMatch(/^"[0-9a-f]{64}"$/);
    expect((await anon.request(`${base}/touchstone/${sets.h1}`, { headers: { "if-none-match": etag } })).status).toBe(304);

    const cold = await anon.request(`${base}/touchstone/${sets.h2}`);
    expect(cold.status).toBe(200);
    expect(cold.headers.get("content-disposition")).toBe(`attachment; filename="${partNumber}_revA_H-02_-40C.s4p"`);
    const viaCurrent = await anon.request(`${currentBase}/touchstone/${sets.h1}`);
    expect(viaCurrent.status).toBe(200);
    expect(viaCurrent.headers.get("cache-control")).toBe("public, no-cache");
  });

  it("reads back through the engine and through scikit-rf to the same S-parameters at every frequency", async () => {
    for (const setId of [sets.h1, sets.h2]) {
      const r = await anon.request(`${base}/touchstone/${setId}`);
      const name = /filename="([^"]+)"/.exec(r.headers.get("content-disposition")!)![1];
      const bytes = new Uint8Array(await r.arrayBuffer());
      const { data } = parseTouchstone(name, bytes);
      const ref = readWithScikitRf(name, bytes);
      expect(data.portCount).toBe(4);
      expect(ref.re[0].length).toBe(4);
      expect(data.frequencyHz.length).toBe(ref.f.length);
      expect(data.referenceOhm).toEqual(ref.z0);
      let compared = 0;
      for (let k = 0; k < ref.f.length; k++) {
        expect(Math.abs(data.frequencyHz[k] - ref.f[k])).toBeLessThanOrEqual(1e-9 * ref.f[k]);
        for (let i = 1; i <= 4; i++) {
          for (let j = 1; j <= 4; j++) {
            const s = sParameter(data, i, j);
            // scikit-rf's s[k][i-1][j-1] is S(i, j), as in the engine.
            expect(Math.abs(s.re[k] - ref.re[k][i - 1][j - 1])).toBeLessThanOrEqual(1e-12);
            expect(Math.abs(s.im[k] - ref.im[k][i - 1][j - 1])).toBeLessThanOrEqual(1e-12);
            compared++;
          }
        }
      }
      expect(compared).toBe(16 * ref.f.length);
    }
  }, 60_000);

  it("never reaches a set the revision does not rest on: live, awaiting review, unknown, or under another part", async () => {
    for (const setId of [sets.live, sets.submitted, 2147483000]) {
      for (const b of [base, currentBase]) {
        const r = await anon.request(`${b}/touchstone/${setId}`);
        expect(r.status, `${b} ${setId}`).toBe(404);
        expect(((await r.json()) as { error: { code: string } }).error.code).toBe("not-found");
      }
    }
    expect((await anon.request(`${base}/touchstone/abc`)).status).toBe(404);
    expect((await anon.request(`${base.replace(/\/A$/, "/Q")}/touchstone/${sets.h1}`)).status).toBe(404);
    expect((await anon.request(`/api/v1/sheets/no-such-org/${encodeURIComponent(partNumber)}/A/touchstone/${sets.h1}`)).status).toBe(404);
    // The engineer's own session changes nothing: the public address serves only what the revision rests on.
    expect((await as.get("engineer")!.request(`${base}/touchstone/${sets.live}`)).status).toBe(404);
  });

  it("lists the revision's files on its public page, and only those", async () => {
    const r = await anon.request(revA.publicPath);
    expect(r.status).toBe(200);
    const html = await r.text();
    expect(html).toContain(`${base}/touchstone/${sets.h1}`);
    expect(html).toContain(`${base}/touchstone/${sets.h2}`);
    expect(html).toContain(`${partNumber}_revA_H-01_25C.s4p`);
    expect(html).not.toContain(`/touchstone/${sets.live}`);
    expect(html).not.toContain(`/touchstone/${sets.submitted}`);
    expect(html).toContain(`${base}/csv`);
  });
});

describe("the specification table as CSV", () => {
  it("answers the frozen table with its headers, immutable under a letter and revalidated as current", async () => {
    const r = await anon.request(`${base}/csv`);
    expect(r.status, await r.clone().text()).toBe(200);
    expect(r.headers.get("content-type")).toBe("text/csv; charset=utf-8; header=present");
    expect(r.headers.get("content-disposition")).toBe(`attachment; filename="${partNumber}-rev-A-specifications.csv"`);
    expect(r.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    // Read as bytes: fetch's text() drops a UTF-8 byte-order mark.
    const bytes = Buffer.from(await r.arrayBuffer());
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = bytes.toString("utf8");
    expect(text.startsWith("\uFEFFParameter,Symbol,")).toBe(true);
    const model = ((await (await anon.request(base)).json()) as { sheet: { specifications: { rows: unknown[] } } }).sheet;
    expect(text.trimEnd().split("\r\n").length).toBe(model.specifications.rows.length + 1);
    const etag = r.headers.get("etag")!;
    expect((await anon.request(`${base}/csv`, { headers: { "if-none-match": etag } })).status).toBe(304);
    const current = await anon.request(`${currentBase}/csv`);
    expect(current.status).toBe(200);
    expect(current.headers.get("cache-control")).toBe("public, no-cache");
    expect(Buffer.from(await current.arrayBuffer()).equals(bytes)).toBe(true);
    expect((await anon.request(`${base.replace(/\/A$/, "/Q")}/csv`)).status).toBe(404);
  });
});

describe("a measurement set's raw file in the workspace", () => {
  it("is the organization's engineers', reviewers' and administrators' to download, whatever the set's state", async () => {
    for (const who of ["engineer", "reviewer", "admin"] as const) {
      for (const [setId, expected] of [
        [sets.h1, bytesOf("examples/hybrid-4port.s4p")],
        [sets.submitted, variant("pending")],
      ] as const) {
        const r = await as.get(who)!.request(`/api/measurements/${setId}/file`);
        expect(r.status, `${who} ${setId}`).toBe(200);
        expect(Buffer.from(await r.arrayBuffer()).equals(Buffer.from(expected))).toBe(true);
        expect(r.headers.get("content-disposition")).toBe('attachment; filename="hybrid-4port.s4p"');
        expect(r.headers.get("cache-control")).toBe("private, no-store");
      }
    }
  });

  it("refuses a customer (403), a visitor (401) and another organization (404)", async () => {
    expect((await as.get("customer")!.request(`/api/measurements/${sets.h1}/file`)).status).toBe(403);
    expect((await anon.request(`/api/measurements/${sets.h1}/file`)).status).toBe(401);
    const foreign = await otherEngineer.request(`/api/measurements/${sets.h1}/file`);
    expect(foreign.status).toBe(404);
    expect(await foreign.text()).not.toContain("Benchfold example");
    expect((await as.get("engineer")!.request(`/api/measurements/2147483000/file`)).status).toBe(404);
    expect((await as.get("engineer")!.request(`/api/measurements/x1/file`)).status).toBe(404);
  });

  it("is linked from the set's page", async () => {
    const device = await db().MeasurementSet.findByPk(sets.h1, { attributes: ["deviceId"] });
    const r = await as.get("reviewer")!.request(`/devices/${device!.deviceId}/measurements/${sets.h1}`);
    expect(r.status).toBe(200);
    expect(await r.text()).toContain(`/api/measurements/${sets.h1}/file`);
  });
});
