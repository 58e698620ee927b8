import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { RevisionSummary } from "@/lib/domain/reviews";
import { parseTouchstone } from "@/lib/ingest";
import type { SheetModel } from "@/lib/sheet";
import { closeDb, db } from "@/models";
import { perturbedNetwork } from "../unit/rf/perturbed-network";
import { outlineSvg } from "../unit/sheet/design-data/outline-fixture";
import { TestClient } from "./helpers/client";
import { clientsByRole, makeOrganization, type Who } from "./helpers/factories";
import { releaseSheet } from "./helpers/reviews";
import { fixtureUpload, fixturesDir } from "./helpers/uploads";

let as: Map<Who, TestClient>;
const anon = new TestClient();
let deviceId = 0;
let partNumber = "";
let revA: RevisionSummary;
let base = "";
const units: { serial: string; setId: number; text: string }[] = [];
const dir = mkdtempSync(path.join(tmpdir(), "bf-design-in-"));
const example = readFileSync(path.join(fixturesDir, "examples/hybrid-4port.s4p"), "utf8");

const outlineForm = (bytes: Uint8Array | string, name: string) => {
  const form = new FormData();
  form.set("file", new Blob([typeof bytes === "string" ? bytes : new Uint8Array(bytes)]), name);
  return form;
};

const designData = {
  pinFunctions: [
    { pin: "1", name: "IN", function: "Input" },
    { pin: "4", name: "ISO", function: "Isolated port, terminate in 50 Ω" },
  ],
  ordering: [{ partNumber: "DIH-TR", options: "", packing: "Tape and reel, 1000 pieces" }],
  recommendedOperatingConditions: [{ parameter: "Input power, CW", min: "", typ: "", max: "2.0", unit: "W" }],
  packageOutlineCaption: "Dimensions in mm; tolerance ±0.1 mm unless stated.",
};

async function upload(serial: string, temperatureC: string, text: string): Promise<number> {
  const engineer = as.get("engineer")!;
  const r = await engineer.request(`/api/devices/${deviceId}/measurements`, {
    multipart: fixtureUpload("examples/hybrid-4port.s4p", { serial, temperatureC, measuredOn: "2026-06-01" }, new Uint8Array(Buffer.from(text))),
  });
  expect(r.status, await r.clone().text()).toBe(201);
  const setId = ((await r.json()) as { measurementSet: { id: number } }).measurementSet.id;
  expect((await as.get("reviewer")!.request(`/api/measurements/${setId}/review`, { json: { decision: "approve" } })).status).toBe(200);
  return setId;
}

beforeAll(async () => {
  const org = await makeOrganization();
  as = await clientsByRole(org);
  partNumber = `DIH-${Date.now().toString(36).toUpperCase()}`;
  const device = await db().Device.create({ organizationId: org.organization.id, createdById: null, partNumber, deviceClass: "quadrature-hybrid", title: "Design-in test hybrid", description: "", keyConditions: {} });
  deviceId = device.id;
  for (const u of [0, 1, 2]) {
    const text = perturbedNetwork(example, u);
    units.push({ serial: `DH-0${u + 1}`, setId: await upload(`DH-0${u + 1}`, "25", text), text });
  }
  // One unit alone at −40 °C: no median of one.
  await upload("DH-09", "-40", perturbedNetwork(example, 3));
}, 180_000);
afterAll(() => closeDb());

describe("design-in data in the workspace", () => {
  it("saves the lists, refuses a figure that is not a number with the field named, and builds them into the draft", async () => {
    const engineer = as.get("engineer")!;
    const bad = await engineer.request(`/api/devices/${deviceId}/design-data`, {
      method: "PUT",
      json: { ...designData, recommendedOperatingConditions: [{ parameter: "Drive", min: "0x10", typ: "", max: "", unit: "dBm" }] },
    });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(await bad.json())).toContain("recommendedOperatingConditions.0.min");
    expect((await as.get("customer")!.request(`/api/devices/${deviceId}/design-data`, { method: "PUT", json: designData })).status).toBe(403);
    const ok = await engineer.request(`/api/devices/${deviceId}/design-data`, { method: "PUT", json: designData });
    expect(ok.status, await ok.clone().text()).toBe(200);
    // No drawing yet: the caption saved with the lists is still in the editor when the workspace is loaded again.
    const workspace = await engineer.request(`/sheets/${deviceId}`);
    expect(workspace.status).toBe(200);
    expect(await workspace.text()).toContain("tolerance ±0.1 mm unless stated");
  });

  it("takes an SVG outline rasterised to PNG, and answers 415, 422 and 413 in words for the rest", async () => {
    const engineer = as.get("engineer")!;
    const url = `/api/devices/${deviceId}/package-outline`;
    const pdf = await engineer.request(url, { multipart: outlineForm("%PDF-1.7 not a drawing", "outline.pdf") });
    expect(pdf.status).toBe(415);
    const script = await engineer.request(url, { multipart: outlineForm(`<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>`, "x.svg") });
    expect(script.status).toBe(422);
    expect(((await script.json()) as { error: { message: string } }).error.message).toContain("script element");
    const huge = await engineer.request(url, { multipart: outlineForm(new Uint8Array(1024 * 1024 + 1), "huge.png") });
    expect(huge.status).toBe(413);
    const ok = await engineer.request(url, { multipart: outlineForm(outlineSvg, "outline.svg") });
    expect(ok.status, await ok.clone().text()).toBe(201);
    expect(((await ok.json()) as { packageOutline: { widthPx: number; heightPx: number } }).packageOutline).toMatchObject({ widthPx: 1200, heightPx: 800 });

    const draft = ((await (await engineer.request(`/api/devices/${deviceId}/sheet`)).json()) as { sheet: SheetModel }).sheet;
    expect(draft.designData?.pinFunctions).toEqual(designData.pinFunctions);
    expect(draft.designData?.recommendedOperatingConditions[0].max.text).toBe("2.0");
    const png = Buffer.from(draft.designData!.packageOutline!.dataUri.split(",")[1], "base64");
    // sharp (libvips) reads the stored drawing back as the 1200 × 800 PNG the server drew.
    expect(await sharp(png).metadata()).toMatchObject({ format: "png", width: 1200, height: 800 });
  });
});

describe("a released revision's design-in data and merged Touchstone file", () => {
  beforeAll(async () => {
    revA = await releaseSheet(as.get("engineer")!, as.get("reviewer")!, deviceId);
    base = revA.pdfPath.replace(/\/pdf$/, "");
  }, 180_000);

  it("freezes the design-in data with the release and prints it on the public page and in the PDF", async () => {
    const sheet = ((await (await anon.request(base)).json()) as { sheet: SheetModel }).sheet;
    expect(sheet.designData?.ordering).toEqual(designData.ordering);
    expect(sheet.designData?.packageOutline?.caption).toBe(designData.packageOutlineCaption);
    // A later edit changes the draft, never the release.
    expect((await as.get("engineer")!.request(`/api/devices/${deviceId}/package-outline`, { method: "DELETE" })).status).toBe(200);
    const again = ((await (await anon.request(base)).json()) as { sheet: SheetModel }).sheet;
    expect(again.designData?.packageOutline?.sha256).toBe(sheet.designData?.packageOutline?.sha256);

    const html = await (await anon.request(revA.publicPath)).text();
    for (const words of ["Package outline", "Pin functions", "Ordering information", "Recommended operating conditions", "Tape and reel, 1000 pieces"]) expect(html).toContain(words);
    expect(html).toMatch(/<img[^>]+src="data:image\/png;base64,/);
    const file = path.join(dir, "released.pdf");
    writeFileSync(file, Buffer.from(await (await anon.request(revA.pdfPath)).arrayBuffer()));
    const text = execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, "").toLowerCase();
    expect(text).toContain("pinfunctions");
    expect(text).toContain("tapeandreel,1000pieces");
    expect(execFileSync("pdfimages", ["-list", file], { encoding: "utf8" })).toMatch(/\b1200\s+800\b/);
  });

  it("offers the median unit of the three 25 °C units, named by part, revision and condition, and none for one unit", async () => {
    const html = await (await anon.request(revA.publicPath)).text();
    expect(html).toContain(`${base}/touchstone/median/25C-s4p`);
    expect(html).not.toContain("/touchstone/median/-40C-s4p");
    expect((await anon.request(`${base}/touchstone/median/-40C-s4p`)).status).toBe(404);
    expect((await anon.request(`${base}/touchstone/median/nothing`)).status).toBe(404);
    const r = await anon.request(`${base}/touchstone/median/25C-s4p`);
    expect(r.status, await r.clone().text()).toBe(200);
    expect(r.headers.get("content-disposition")).toBe(`attachment; filename="${partNumber}_revA_median-of-3_25C.s4p"`);
    expect(r.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    const etag = r.headers.get("etag")!;
    expect((await anon.request(`${base}/touchstone/median/25C-s4p`, { headers: { "if-none-match": etag } })).status).toBe(304);
    const text = await r.text();

    // The engine reads it back.
    const { data } = parseTouchstone("median.s4p", text);
    expect(data.portCount).toBe(4);
    expect(data.referenceOhm).toEqual([50, 50, 50, 50]);

    // scikit-rf and numpy (Debian python3-scikit-rf): the median of the three units' downloaded files is the merged file.
    const merged = path.join(dir, "median.s4p");
    writeFileSync(merged, text);
    const files = await Promise.all(
      units.map(async (u) => {
        const file = path.join(dir, `${u.serial}.s4p`);
        writeFileSync(file, Buffer.from(await (await anon.request(`${base}/touchstone/${u.setId}`)).arrayBuffer()));
        return file;
      }),
    );
    const out = execFileSync("/usr/bin/python3", ["scripts/reference/skrf-median-network.py", merged, ...files], { encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] });
    const reference = JSON.parse(out.trim().split("\n").pop()!);
    expect(reference.frequencyHz).toEqual(Array.from(data.frequencyHz));
    expect(reference.maxDbDifference).toBeLessThan(1e-9);
    expect(reference.maxDegDifference).toBeLessThan(1e-7);
  }, 60_000);
});
