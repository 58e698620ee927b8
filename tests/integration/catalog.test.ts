import { randomBytes } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import type { CatalogResult } from "@/lib/catalog/types";
import type { RevisionSummary } from "@/lib/domain/reviews";
import type { KeyConditions } from "@/lib/domain/devices";
import type { SheetModel } from "@/lib/sheet";
import { closeDb, db } from "@/models";
import { releasedSheetsSelect, releasedSpecValuesSelect } from "@/models/migrations/20261202-0750-released-spec-values";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeDevice, makeOrganization, type Who } from "./helpers/factories";
import { addApprovedSet, releaseSheet } from "./helpers/reviews";

// The catalog over HTTP: sheets released through the real review path (submit, sign, release),
// found by class, frequency, limits with units, text and organization, with counts, sort and paging.

const tag = randomBytes(3).toString("hex");
let vendor: Awaited<ReturnType<typeof makeOrganization>>;
let lab: Awaited<ReturnType<typeof makeOrganization>>;
let vendorClients: Map<Who, TestClient>;
let labClients: Map<Who, TestClient>;
const anyone = new TestClient();
const part = (name: string) => `CAT${tag}-${name}`.toUpperCase();
const revisions: Record<string, RevisionSummary> = {};

async function makeReleasable(opts: {
  clients: Map<Who, TestClient>;
  organizationId: number;
  name: string;
  deviceClass?: "frequency-multiplier" | "double-balanced-mixer";
  fixture?: string;
  keyConditions: KeyConditions;
  conversionLossMaxDb?: number;
}): Promise<number> {
  const device = await makeDevice(opts.organizationId, part(opts.name));
  await device.update({ title: `Catalog ${opts.deviceClass === "double-balanced-mixer" ? "mixer" : "doubler"} ${tag}`, deviceClass: opts.deviceClass ?? "frequency-multiplier", keyConditions: opts.keyConditions });
  await addApprovedSet(device.id, opts.clients.get("engineer")!, opts.clients.get("reviewer")!, opts.fixture);
  if (opts.conversionLossMaxDb !== undefined) await setConversionLossMax(opts.clients.get("engineer")!, device.id, opts.conversionLossMaxDb);
  return device.id;
}

/** A max limit on every conversion-loss group of the draft. */
async function setConversionLossMax(engineer: TestClient, deviceId: number, maxDb: number): Promise<void> {
  const r = await engineer.request(`/api/devices/${deviceId}/sheet`);
  const { sheet } = (await r.json()) as { sheet: SheetModel };
  const limits = sheet.specifications.rows
    .filter((row) => row.parameter === "conversion-loss")
    .map((row) => ({ parameter: row.parameter, conditionsKey: row.conditionsKey, max: maxDb, unit: row.unit, basis: "test" }));
  expect(limits.length).toBeGreaterThan(0);
  const put = await engineer.request(`/api/devices/${deviceId}/spec-limits`, { method: "PUT", json: { limits } });
  expect(put.status, await put.clone().text()).toBe(200);
}

async function search(qs: string | URLSearchParams): Promise<CatalogResult> {
  const r = await anyone.request(`/api/v1/sheets?${qs.toString()}`);
  expect(r.status, await r.clone().text()).toBe(200);
  return (await r.json()) as CatalogResult;
}
const parts = (result: CatalogResult) => result.hits.map((h) => h.partNumber);
const q = (pairs: [string, string][]) => new URLSearchParams(pairs);

beforeAll(async () => {
  vendor = await makeOrganization("vendor");
  lab = await makeOrganization("lab");
  vendorClients = await clientsByRole(vendor);
  labClients = await clientsByRole(lab);
  const v = { clients: vendorClients, organizationId: vendor.organization.id };
  // Drives are per port, where the sheet holds its rows: inside the fixture's sweep (−9 to +16 dBm per port).
  const d1 = await makeReleasable({ ...v, name: "D1", conversionLossMaxDb: 12, keyConditions: { inputFrequencyHz: { min: 1e9, max: 2e9 }, outputFrequencyHz: { min: 2e9, max: 4e9 }, driveLevelDbm: 13, multiplicationFactor: 2 } });
  const d2 = await makeReleasable({ ...v, name: "D2", conversionLossMaxDb: 9, keyConditions: { inputFrequencyHz: { min: 4e9, max: 6e9 }, outputFrequencyHz: { min: 8e9, max: 12e9 }, driveLevelDbm: 15, multiplicationFactor: 2 } });
  const m1 = await makeReleasable({ ...v, name: "M1", deviceClass: "double-balanced-mixer", fixture: "examples/frequency-sweep-mixer.csv", keyConditions: { inputFrequencyHz: { min: 1.7e9, max: 2.2e9 }, driveLevelDbm: 7 } });
  const l1 = await makeReleasable({ clients: labClients, organizationId: lab.organization.id, name: "L1", keyConditions: { inputFrequencyHz: { min: 2e9, max: 3e9 }, driveLevelDbm: 10 } });
  const release = (clients: Map<Who, TestClient>, id: number) => releaseSheet(clients.get("engineer")!, clients.get("reviewer")!, id);
  revisions.D1 = await release(vendorClients, d1);
  revisions.D2 = await release(vendorClients, d2);
  revisions.M1 = await release(vendorClients, m1);
  revisions.L1A = await release(labClients, l1);
  // A second revision of L1 (a limit stated where there was none): A is superseded, B is current.
  await setConversionLossMax(labClients.get("engineer")!, l1, 20);
  revisions.L1B = await release(labClients, l1);
}, 240_000);
afterAll(() => closeDb());

describe("the search index is written by the release", () => {
  it("holds one row per specification row of the frozen model, inside the release", async () => {
    const { sequelize, SheetRevision } = db();
    for (const revision of Object.values(revisions)) {
      const row = await SheetRevision.unscoped().findByPk(revision.id, { attributes: ["modelJson"] });
      const model = JSON.parse(row!.modelJson) as SheetModel;
      const [{ n }] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM released_spec_values WHERE revision_id = ?", { type: QueryTypes.SELECT, replacements: [revision.id] });
      expect(Number(n)).toBe(model.specifications.rows.length);
      expect(model.specifications.rows.length).toBeGreaterThan(0);
    }
  });

  it("the migration's backfill (SQL over the frozen model) gives the rows the release path wrote", async () => {
    const { sequelize } = db();
    const ids = Object.values(revisions).map((r) => r.id);
    const stored = await sequelize.query<Record<string, unknown>>(
      `SELECT revision_id, organization_id, device_id, device_class, row_id, parameter, conditions_key, min_value, typ_value, max_value, unit
         FROM released_spec_values WHERE revision_id IN (?) ORDER BY revision_id, row_id, conditions_key`,
      { type: QueryTypes.SELECT, replacements: [ids] },
    );
    const backfill = await sequelize.query<Record<string, unknown>>(`${releasedSpecValuesSelect} WHERE r.id IN (?) ORDER BY 1, 5, 7`, { type: QueryTypes.SELECT, replacements: [ids], raw: true });
    expect(backfill.map((row) => Object.values(row))).toEqual(stored.map((row) => Object.values(row)));
    const sheets = await sequelize.query<Record<string, unknown>>(
      `SELECT revision_id, organization_id, device_id, device_class, part_number, title, letter, input_min_hz, input_max_hz, output_min_hz, output_max_hz, drive_dbm, released_at
         FROM released_sheets WHERE revision_id IN (?) ORDER BY revision_id`,
      { type: QueryTypes.SELECT, replacements: [ids] },
    );
    const sheetsBackfill = await sequelize.query<Record<string, unknown>>(`${releasedSheetsSelect} WHERE r.id IN (?) ORDER BY 1`, { type: QueryTypes.SELECT, replacements: [ids] });
    // L1's device now carries the key conditions of its latest release; they were not changed in between.
    expect(sheetsBackfill.map((row) => Object.values(row).map(String))).toEqual(sheets.map((row) => Object.values(row).map(String)));
  });
});

describe("GET /api/v1/sheets", () => {
  it("finds an organization's current sheets by class, with counts per class and organization", async () => {
    const result = await search(q([["q", tag], ["org", vendor.organization.slug], ["class", "frequency-multiplier"]]));
    expect(result.total).toBe(2);
    expect(parts(result)).toEqual([part("D1"), part("D2")]);
    // Each facet is counted without its own filter: the mixer and the lab still show what they would find.
    expect(result.facets.deviceClass).toEqual([
      { value: "frequency-multiplier", label: "Frequency multiplier", count: 2 },
      { value: "double-balanced-mixer", label: "Double-balanced mixer", count: 1 },
    ].sort((a, b) => (a.value < b.value ? -1 : 1)));
    expect(result.facets.organization).toEqual(
      expect.arrayContaining([
        { value: vendor.organization.slug, label: vendor.organization.name, count: 2 },
        { value: lab.organization.slug, label: lab.organization.name, count: 1 },
      ]),
    );
  });

  it("finds a part by the frequency it must cover, in either band, with the unit as typed", async () => {
    const at = async (covers: string) => parts(await search(q([["q", tag], ["covers", covers]]))).sort();
    // D1 doubles 1–2 GHz to 2–4 GHz, D2 4–6 GHz to 8–12 GHz, M1 takes 1.7–2.2 GHz, L1 2–3 GHz.
    expect(await at("2.5 GHz")).toEqual([part("D1"), part("L1")].sort());
    expect(await at("10 GHz")).toEqual([part("D2")]);
    expect(await at("5000 MHz")).toEqual([part("D2")]);
    expect(await at("1.8GHz")).toEqual([part("D1"), part("M1")].sort());
    expect(await at("20 GHz")).toEqual([]);
  });

  it("finds parts by a guaranteed limit and by drive, units accepted as typed", async () => {
    const found = async (f: string[]) => parts(await search(q([["q", tag], ...f.map((x): [string, string] => ["f", x])]))).sort();
    // The worst stated conversion-loss max: D1 12 dB, D2 9 dB, L1 (rev. B) 20 dB; M1 states none.
    expect(await found(["conversion-loss.max<=10 dB"])).toEqual([part("D2")]);
    expect(await found(["conversion-loss<=12.5dB"])).toEqual([part("D1"), part("D2")].sort());
    expect(await found(["conversion-loss.max>=12 dB"])).toEqual([part("D1"), part("L1")].sort());
    expect(await found(["drive<=+13 dBm"])).toEqual([part("D1"), part("L1"), part("M1")].sort());
    expect(await found(["drive<=+13 dBm", "drive>=10 dBm", "conversion-loss<=15 dB"])).toEqual([part("D1")]);
  });

  it("finds parts by text in the part number and the title", async () => {
    expect(parts(await search(q([["q", part("D2")]])))).toEqual([part("D2")]);
    expect(parts(await search(q([["q", `mixer ${tag}`]])))).toEqual([part("M1")]);
    // LIKE's wildcards are matched as themselves.
    expect((await search(q([["q", `${tag}%`]]))).total).toBe(0);
  });

  it("lists current revisions by default and every revision on request", async () => {
    const current = await search(q([["q", tag], ["org", lab.organization.slug]]));
    expect(current.hits.map((h) => h.letter)).toEqual(["B"]);
    const all = await search(q([["q", tag], ["org", lab.organization.slug], ["rev", "all"]]));
    expect(all.hits.map((h) => h.letter).sort()).toEqual(["A", "B"]);
    expect(all.hits[0].path).toMatch(new RegExp(`^/datasheets/${lab.organization.slug}/${part("L1")}/[AB]$`));
  });

  it("sorts by a numeric column, empty values last, and pages", async () => {
    const byDrive = await search(q([["q", tag], ["sort", "drive"], ["dir", "desc"]]));
    expect(parts(byDrive)).toEqual([part("D2"), part("D1"), part("L1"), part("M1")]);
    expect(byDrive.hits.map((h) => h.sortValue)).toEqual([15, 13, 10, 7]);
    const byLoss = await search(q([["q", tag], ["sort", "conversion-loss.max"]]));
    expect(parts(byLoss)).toEqual([part("D2"), part("D1"), part("L1"), part("M1")]);
    expect(byLoss.hits.map((h) => h.sortValue)).toEqual([9, 12, 20, null]);
    const page1 = await search(q([["q", tag], ["sort", "drive"], ["limit", "3"]]));
    const page2 = await search(q([["q", tag], ["sort", "drive"], ["limit", "3"], ["page", "2"]]));
    expect([page1.total, page2.total]).toEqual([4, 4]);
    expect([...parts(page1), ...parts(page2)]).toEqual([part("M1"), part("L1"), part("D1"), part("D2")]);
  });

  it("shows the class's key figures: conversion loss typ and its guaranteed max", async () => {
    const [hit] = (await search(q([["q", part("D2")]]))).hits;
    const loss = hit.figures.find((f) => f.key === "conversion-loss")!;
    expect(loss).toMatchObject({ guarantee: "max", limit: 9, unit: "dB" });
    expect(loss.typ).toEqual(expect.any(Number));
    expect(hit).toMatchObject({ inputFrequencyHz: { min: 4e9, max: 6e9 }, outputFrequencyHz: { min: 8e9, max: 12e9 }, driveLevelDbm: 15, deviceClass: "frequency-multiplier" });
  });

  it.each([
    ["f=conversion-loss.max%3C%3Dten", "f[0]"],
    ["f=conversion-loss.max%3C%3D10%20dBm", "f[0]"],
    ["f=warp-factor%3C%3D9", "f[0]"],
    ["f=conversion-loss.max%3E%3D12&f=conversion-loss.max%3C%3D10", "f[1]"],
    ["covers=2.4", "covers"],
    ["covers=0x10%20GHz", "covers"],
    ["class=toaster", "class"],
    ["sort=title", "sort"],
    ["page=-1", "page"],
    [`q=${"x".repeat(10_000)}`, "q"],
  ])("answers 422 naming the field to %#", async (qs, field) => {
    const r = await anyone.request(`/api/v1/sheets?${qs}`);
    expect(r.status).toBe(422);
    const body = (await r.json()) as { error: { message: string; details: { fields: { field: string; message: string }[] } } };
    expect(body.error.details.fields[0].field).toBe(field);
    // Never the ten thousand characters back (an unknown parameter's message lists the known ones).
    expect(body.error.message.length).toBeLessThan(1000);
  });
});

describe("a withdrawal", () => {
  it("takes the revision out of the current catalog at once, and rev=all still lists it", async () => {
    const before = await search(q([["q", tag], ["org", vendor.organization.slug]]));
    expect(parts(before)).toContain(part("M1"));
    const w = await vendorClients.get("reviewer")!.request(`/api/sheet-revisions/${revisions.M1.id}/withdraw`, { json: { reason: "Catalog test: withdrawn to leave the current list." } });
    expect(w.status, await w.clone().text()).toBe(200);
    // The same query again: the answer kept for it must not outlive the withdrawal.
    const after = await search(q([["q", tag], ["org", vendor.organization.slug]]));
    expect(parts(after)).toEqual([part("D1"), part("D2")]);
    expect(after.total).toBe(before.total - 1);
    const all = await search(q([["q", tag], ["org", vendor.organization.slug], ["rev", "all"]]));
    expect(parts(all)).toContain(part("M1"));
  });
});

describe("GET /api/v1/sheets/{org}/{part}/{rev}", () => {
  it("returns the released model as versioned JSON, by letter and as current, with an ETag", async () => {
    const base = `/api/v1/sheets/${lab.organization.slug}/${part("L1")}`;
    const current = await anyone.request(`${base}/current`);
    expect(current.status).toBe(200);
    expect(current.headers.get("cache-control")).toBe("public, no-cache");
    const body = (await current.json()) as { apiVersion: number; revision: RevisionSummary; history: RevisionSummary[]; sheet: SheetModel };
    expect(body.apiVersion).toBe(1);
    expect(body.revision).toMatchObject({ letter: "B", standing: "current", id: revisions.L1B.id });
    expect(body.sheet.header.partNumber).toBe(part("L1"));
    expect(body.sheet.release?.revisionLabel).toBe("B");
    expect(body.history.map((r) => r.letter)).toEqual(["B", "A"]);

    const a = await anyone.request(`${base}/A`);
    const aBody = (await a.json()) as { revision: RevisionSummary; sheet: SheetModel };
    expect(aBody.revision.standing).toBe("superseded");
    expect(aBody.sheet.release?.revisionLabel).toBe("A");

    const etag = current.headers.get("etag")!;
    expect(etag).toMatch(/^"[0-9a-f]{40}"$/);
    const again = await anyone.request(`${base}/current`, { headers: { "if-none-match": etag } });
    expect(again.status).toBe(304);
    expect(a.headers.get("etag")).not.toBe(etag);
  });

  it("answers 404 for a revision or part that was never released", async () => {
    expect((await anyone.request(`/api/v1/sheets/${lab.organization.slug}/${part("L1")}/Z`)).status).toBe(404);
    expect((await anyone.request(`/api/v1/sheets/${lab.organization.slug}/NO-SUCH-PART/current`)).status).toBe(404);
  });
});

describe("/catalog", () => {
  it("draws the results of a query in the URL, with links to the released sheets", async () => {
    const r = await anyone.request(`/catalog?${q([["q", tag], ["class", "frequency-multiplier"], ["f", "conversion-loss<=10 dB"]])}`);
    expect(r.status).toBe(200);
    const html = await r.text();
    expect(html).toContain(`/datasheets/${vendor.organization.slug}/${part("D2")}/A`);
    expect(html).not.toContain(part("D1"));
    expect(html).toContain('data-testid="catalog-facets"');
  });

  it("says what is wrong with a query it cannot read, naming the field, without echoing ten thousand characters", async () => {
    const r = await anyone.request(`/catalog?f=${encodeURIComponent("conversion-loss<=10 furlongs")}&q=${"y".repeat(10_000)}`);
    expect(r.status).toBe(200);
    const html = await r.text();
    expect(html).toContain('data-testid="catalog-issues"');
    expect(html).toContain("unknown unit");
    // The form keeps what was typed, cut to the 200 characters the search reads.
    expect(html).toContain(`value="${"y".repeat(200)}"`);
    expect(html).not.toContain(`value="${"y".repeat(201)}`);
  });
});
