import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { SheetModel } from "@/lib/sheet";
import { db, closeDb } from "@/models";
import type { Device } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";

/**
 * One organization's sheet content must never break another organization's sheet. Deeply nested
 * markdown once made its own sheet fail and, after one PDF request, every later PDF of every
 * organization answer 500 until the server restarted.
 */

// Nested quotes: 1,000 levels got through the markdown pipeline and broke the PDF layout engine
// for the whole process; 5,000 levels overflowed the markdown pipeline itself.
const layoutBreaking = `${">".repeat(1000)} deep`;
const pipelineBreaking = `${">".repeat(5000)} deeper`;

let engineerA: TestClient;
let engineerB: TestClient;
let deviceA: Device;
let deviceA2: Device;
let deviceB: Device;

beforeAll(async () => {
  const a = await makeOrganization();
  const b = await makeOrganization("lab");
  deviceA = await makeDevice(a.organization.id);
  deviceA2 = await makeDevice(a.organization.id);
  deviceB = await makeDevice(b.organization.id);
  engineerA = new TestClient();
  engineerB = new TestClient();
  expect((await engineerA.signIn(a.users.engineer.email, factoryPassword)).ok).toBe(true);
  expect((await engineerB.signIn(b.users.engineer.email, factoryPassword)).ok).toBe(true);
});
afterAll(() => closeDb());

function pdfText(bytes: Buffer): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), "benchfold-isolation-")), "sheet.pdf");
  writeFileSync(file, bytes);
  // poppler's pdftotext reads the PDF independently of the renderer that wrote it.
  return execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
}

async function expectPdf(client: TestClient, device: Device): Promise<string> {
  const r = await client.request(`/api/devices/${device.id}/sheet/pdf`);
  const bytes = Buffer.from(await r.arrayBuffer());
  expect(r.status, `PDF of ${device.partNumber}: ${bytes.subarray(0, 300).toString()}`).toBe(200);
  expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
  const text = pdfText(bytes);
  expect(text).toContain(device.partNumber);
  return text;
}

async function expectWebPage(client: TestClient, device: Device): Promise<string> {
  const r = await client.request(`/sheets/${device.id}`);
  const html = await r.text();
  expect(r.status, `web sheet of ${device.partNumber}`).toBe(200);
  expect(html).toContain(device.partNumber);
  return html;
}

async function sheetModel(client: TestClient, device: Device): Promise<SheetModel> {
  const r = await client.request(`/api/devices/${device.id}/sheet`);
  expect(r.status, `sheet model of ${device.partNumber}`).toBe(200);
  return ((await r.json()) as { sheet: SheetModel }).sheet;
}

/** Stores prose as a document saved before the limits existed would be: straight into the table. */
async function storeProse(device: Device, prose: Record<string, string>) {
  const { SheetContent } = db();
  await SheetContent.upsert({ organizationId: device.organizationId, deviceId: device.id, prose, absoluteMaximumRatings: [], measurementUncertainty: {}, updatedById: null });
}

describe("one organization's prose and another organization's sheet", () => {
  it("deep nesting is refused when the prose is saved, with the section and the limit named", async () => {
    const r = await engineerA.request(`/api/devices/${deviceA.id}/sheet-content`, { method: "PUT", json: { prose: { features: pipelineBreaking } } });
    expect(r.status).toBe(422);
    const { error } = (await r.json()) as { error: { message: string; details: { fields: { field: string; message: string }[] } } };
    expect(error.details.fields[0].field).toBe("prose.features");
    expect(error.details.fields[0].message).toMatch(/Key features/);
    expect(error.details.fields[0].message).toMatch(/more than 10 levels/);
    const shallow = await engineerA.request(`/api/devices/${deviceA.id}/sheet-content`, {
      method: "PUT",
      json: { prose: { features: "> - a quoted list\n>   - **nested _twice_**" } },
    });
    expect(shallow.status).toBe(200);
  });

  it(
    "a stored document from before the limit prints a notice in its section, and every other sheet still renders",
    { timeout: 300_000 },
    async () => {
      await storeProse(deviceA, { description: layoutBreaking });
      await storeProse(deviceA2, { applications: pipelineBreaking });
      const firstPdfA = await engineerA.request(`/api/devices/${deviceA.id}/sheet/pdf`);

      // Another organization's sheet, never rendered before (so never cached), renders as a PDF and a page.
      const textB = await expectPdf(engineerB, deviceB);
      expect(textB).not.toMatch(/This section is not shown/);
      await expectWebPage(engineerB, deviceB);

      // The organization's own sheets answer too, each section over the limit replaced by a notice.
      expect(firstPdfA.status).toBe(200);
      const textA = await expectPdf(engineerA, deviceA);
      expect(textA).toMatch(/This section is not shown: it nests quotes, lists or emphasis more than 10 levels deep/);
      const modelA2 = await sheetModel(engineerA, deviceA2);
      const applications = modelA2.prose.find((section) => section.id === "applications")!;
      expect(applications.blocks).toEqual([{ type: "paragraph", children: [{ type: "text", value: expect.stringMatching(/^This section is not shown/) }] }]);
      expect(modelA2.issues.map((issue) => issue.code)).toContain("prose-over-limit");
      await expectWebPage(engineerA, deviceA);
      await expectWebPage(engineerA, deviceA2);
      await expectPdf(engineerA, deviceA2);
    },
  );
});
