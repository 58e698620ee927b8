import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import type { SheetModel } from "@/lib/sheet";
import { db, closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeOrganization } from "./helpers/factories";
import { fixtureUpload } from "./helpers/uploads";

/**
 * A device class added exactly as DEVELOPERS.md's "Adding a device class" says: the folder
 * templates/comb-generator-test-only/ and one line in lib/domain/device-classes.ts (marked
 * testOnly, so only this test build offers it). Nothing else in the app knows the class; it
 * goes through the same HTTP routes as a shipped one: device, upload, review, sheet JSON and PDF.
 */
const deviceClass = "comb-generator-test-only";
let engineer: TestClient;
let reviewer: TestClient;
let deviceId: number;

beforeAll(async () => {
  const org = await makeOrganization();
  engineer = new TestClient();
  reviewer = new TestClient();
  expect((await engineer.signIn(org.users.engineer.email, factoryPassword)).ok).toBe(true);
  expect((await reviewer.signIn(org.users.reviewer.email, factoryPassword)).ok).toBe(true);
});
afterAll(() => closeDb());

async function sheetOf(id: number): Promise<SheetModel> {
  const r = await engineer.request(`/api/devices/${id}/sheet`);
  expect(r.status).toBe(200);
  return ((await r.json()) as { sheet: SheetModel }).sheet;
}

describe("a device class added by the recipe", () => {
  const { sequelize } = db();
  it("is stored as text, so the class needed no migration", async () => {
    const [column] = await sequelize.query<{ DATA_TYPE: string }>(
      "SELECT DATA_TYPE FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'devices' AND COLUMN_NAME = 'device_class'",
      { type: QueryTypes.SELECT },
    );
    expect(column.DATA_TYPE).toBe("varchar");
  });

  it("takes a new device, and still refuses a class that is not in the list", async () => {
    const body = { partNumber: "CMB-10G", deviceClass, title: "Step-recovery comb generator, 1 GHz lines", keyConditions: { driveLevelDbm: 20 } };
    const created = await engineer.request("/api/devices", { json: body });
    const json = (await created.json()) as { device: { id: number; deviceClass: string } };
    expect(created.status, JSON.stringify(json)).toBe(201);
    expect(json.device.deviceClass).toBe(deviceClass);
    deviceId = json.device.id;

    const unknown = await engineer.request("/api/devices", { json: { ...body, partNumber: "CMB-X", deviceClass: "comb-generator" } });
    expect(unknown.status).toBe(422);

    const page = await engineer.request(`/devices/${deviceId}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Comb generator");
  });

  it("takes a bench file of a kind its template reads, reviewed by another person", async () => {
    const up = await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv") });
    const body = (await up.json()) as { measurementSet: { id: number; state: string; kind: string } };
    expect(up.status, JSON.stringify(body)).toBe(201);
    expect(body.measurementSet).toMatchObject({ kind: "drive-sweep", state: "submitted" });
    const review = await reviewer.request(`/api/measurements/${body.measurementSet.id}/review`, { json: { decision: "approve" } });
    expect(review.status).toBe(200);
  });

  it("builds its sheet from the template: the class's label, its one spec row, its chart", async () => {
    const model = await sheetOf(deviceId);
    expect(model.template).toEqual({ deviceClass, label: "Comb generator" });
    expect(model.header).toMatchObject({ partNumber: "CMB-10G", deviceClassLabel: "Comb generator", released: false });
    expect(model.specifications.rows.map((r) => r.label)).toEqual(["Conversion loss"]);
    expect(model.specifications.notes).toEqual(["Comb lines measured one at a time. System impedance 50 Ω."]);
    expect(model.statistics.groups.map((g) => ({ parameter: g.parameter, n: g.n }))).toEqual([{ parameter: "conversion-loss", n: 1 }]);
    expect(model.charts.map((c) => c.id)).toEqual(["cl"]);
    expect(model.cautions).toEqual(["Test-only caution: limits apply only under the stated conditions."]);
  });

  it("prints its sheet as a PDF with the template's words in it", { timeout: 120_000 }, async () => {
    const model = await sheetOf(deviceId);
    const r = await engineer.request(`/api/devices/${deviceId}/sheet/pdf`);
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toBe("application/pdf");
    const file = path.join(mkdtempSync(path.join(tmpdir(), "benchfold-pdf-")), "comb.pdf");
    writeFileSync(file, Buffer.from(await r.arrayBuffer()));
    // poppler's pdftotext reads the PDF independently of the renderer that wrote it.
    const text = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("CMB-10G");
    expect(text).toContain("Conversion loss");
    expect(text).toContain("Loss vs drive");
    const typ = model.specifications.rows[0].typ;
    expect(typ.value).not.toBeNull();
    expect(text).toContain(typ.text);
  });

  it("shows its sheet on the workspace page", async () => {
    const page = await engineer.request(`/sheets/${deviceId}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Conversion loss");
  });
});
