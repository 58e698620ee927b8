import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";
import { release, sign, submitDraft } from "./helpers/reviews";

// The sheets index is a summary query paged like the device list: 30 devices need two pages.
let engineer: TestClient;
let reviewer: TestClient;
let foreignPart: string;

async function upload(deviceId: number, file: string): Promise<number> {
  const r = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload(`examples/${file}`) });
  expect(r.status, await r.clone().text()).toBe(201);
  return ((await r.json()) as { measurementSet: { id: number } }).measurementSet.id;
}

async function approve(setId: number): Promise<void> {
  expect((await reviewer.request(`/api/measurements/${setId}/review`, { json: { decision: "approve" } })).status).toBe(200);
}

async function putLimits(deviceId: number, parameters: string[]): Promise<void> {
  const limits = parameters.map((parameter) => ({ parameter, conditionsKey: "", max: 10, unit: "dB", basis: "test" }));
  expect((await engineer.request(`/api/devices/${deviceId}/spec-limits`, { method: "PUT", json: { limits } })).status).toBe(200);
}

beforeAll(async () => {
  const { Device } = db();
  const made = await makeOrganization();
  const other = await makeOrganization();
  foreignPart = (await makeDevice(other.organization.id, "SHX-9999")).partNumber;
  const classes = ["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"] as const;
  const ids: Record<string, number> = {};
  for (let i = 1; i <= 30; i++) {
    const device = await Device.create({
      organizationId: made.organization.id,
      createdById: null,
      partNumber: `SHX-${i}`,
      deviceClass: classes[i % 3],
      title: `Index test part ${i}`,
      description: "",
      keyConditions: {},
    });
    ids[device.partNumber] = device.id;
  }
  engineer = new TestClient();
  reviewer = new TestClient();
  expect((await engineer.signIn(made.users.engineer.email, factoryPassword)).ok).toBe(true);
  expect((await reviewer.signIn(made.users.reviewer.email, factoryPassword)).ok).toBe(true);

  // SHX-3: three approved sets from two units (serials BFD-0001 twice, BFD-0107), one waiting, two limits.
  for (const file of ["drive-sweep-doubler.csv", "phase-noise-doubler.csv", "frequency-sweep-mixer.csv"]) await approve(await upload(ids["SHX-3"], file));
  await upload(ids["SHX-3"], "two-tone-mixer.tsv");
  await putLimits(ids["SHX-3"], ["conversion-loss", "harmonic-suppression"]);
  // SHX-17 changes last of all.
  await putLimits(ids["SHX-17"], ["conversion-loss"]);
});
afterAll(() => closeDb());

type Row = { part: string; cells: Record<string, string> };

/** The rows of the sheets table, in order, with each counted cell's text. */
async function rows(query: string): Promise<Row[]> {
  const r = await engineer.request(`/sheets${query}`, { headers: { accept: "text/html" } });
  expect(r.status).toBe(200);
  const html = await r.text();
  return [...html.matchAll(/<tr[^>]*data-testid="sheet-row-([^"]+)"[^>]*>(.*?)<\/tr>/g)].map(([, part, body]) => ({
    part,
    cells: Object.fromEntries([...body.matchAll(/<td[^>]*data-testid="([^"]+)"[^>]*>(.*?)<\/td>/g)].map(([, id, cell]) => [id, cell.replace(/<[^>]+>/g, "")])),
  }));
}

const parts = async (query: string) => (await rows(query)).map((r) => r.part);

describe("the sheets index: a summary query, paged like the device list", () => {
  it("pages by 25 in natural part-number order, and never shows another organization's parts", async () => {
    const first = await parts("");
    expect(first).toHaveLength(25);
    expect(first.slice(0, 11)).toEqual(["SHX-1", "SHX-2", "SHX-3", "SHX-4", "SHX-5", "SHX-6", "SHX-7", "SHX-8", "SHX-9", "SHX-10", "SHX-11"]);
    expect(await parts("?page=2")).toEqual(["SHX-26", "SHX-27", "SHX-28", "SHX-29", "SHX-30"]);
    expect(first).not.toContain(foreignPart);
    // The pager links to the sheets index, not to the device list whose controls it shares.
    const html = await (await engineer.request("/sheets", { headers: { accept: "text/html" } })).text();
    const pager = html.match(/<nav[^>]*data-testid="sheets-pager".*?<\/nav>/s)?.[0] ?? "";
    expect(pager).toContain('href="/sheets?page=2"');
  });

  it("searches part number and title like the device list", async () => {
    expect(await parts("?q=shx-2")).toEqual(["SHX-2", "SHX-20", "SHX-21", "SHX-22", "SHX-23", "SHX-24", "SHX-25", "SHX-26", "SHX-27", "SHX-28", "SHX-29"]);
    expect(await parts(`?q=${encodeURIComponent("part 17")}`)).toEqual(["SHX-17"]);
    expect(await parts("?q=SHX-9999")).toEqual([]);
  });

  it("counts approved sets, units, sets awaiting review and limits from the database", async () => {
    const [shx3] = (await rows("?q=SHX-3")).filter((r) => r.part === "SHX-3");
    // By hand: 3 approved sets (drive sweep and phase noise of BFD-0001, frequency sweep of BFD-0107) → 2 units;
    // the two-tone file still waits; two limits were put.
    expect(shx3.cells).toMatchObject({ "approved-sets": "3", units: "2", "awaiting-review": "1", "limits-set": "2" });
    const [shx4] = await rows("?q=SHX-4");
    expect(shx4.cells).toMatchObject({ "approved-sets": "0", units: "0", "awaiting-review": "0", "limits-set": "0" });
  });

  it("sorts by the last change to the device, its sets or its limits", async () => {
    expect((await parts("?sort=updated")).slice(0, 3)).toEqual(["SHX-17", "SHX-3", "SHX-30"]);
    expect((await parts("?sort=updated&dir=asc")).slice(0, 2)).toEqual(["SHX-1", "SHX-2"]);
  });

  it("says where each sheet stands: not released, in review, released, and in review again after a release", async () => {
    const standing = async () => (await rows("?q=SHX-3")).find((r) => r.part === "SHX-3")!.cells["sheet-standing"];
    expect(await standing()).toBe("Not released");
    const { Device } = db();
    const deviceId = (await Device.findOne({ where: { partNumber: "SHX-3", organizationId: (await Device.findOne({ where: { partNumber: "SHX-17" } }))!.organizationId } }))!.id;
    const first = await submitDraft(engineer, deviceId);
    expect(await standing()).toBe("In review · Not released");
    // The engineer submitted; the reviewer signs, the engineer releases.
    expect((await sign(reviewer, first.id)).status).toBe(200);
    expect(await standing()).toBe("Approved, not released · Not released");
    expect((await release(engineer, first.id)).status).toBe(201);
    expect(await standing()).toBe("Rev. A released");
    await submitDraft(engineer, deviceId);
    expect(await standing()).toBe("In review · Rev. A released");
  });
});
