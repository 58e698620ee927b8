/**
 * Plausibility through the bench API (POST /api/v1/measurements): a value no passive part can
 * produce is refused with 422 and the file, line and column, and nothing is stored; a value
 * inside the uncertainty is kept with a warning that the set page, the review queue and the
 * sheet's open issues show.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/models";
import { TestClient } from "./helpers/client";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { fixtureUpload, uploadRowCounts } from "./helpers/uploads";

let org: Awaited<ReturnType<typeof makeOrganization>>;
let device: Awaited<ReturnType<typeof makeDevice>>;
let token = "";
const as: Record<"engineer" | "reviewer" | "admin", TestClient> = { engineer: new TestClient(), reviewer: new TestClient(), admin: new TestClient() };
const bench = new TestClient();

beforeAll(async () => {
  org = await makeOrganization();
  device = await makeDevice(org.organization.id, `PL-${Date.now()}`);
  for (const role of ["engineer", "reviewer", "admin"] as const) expect((await as[role].signIn(org.users[role].email, factoryPassword)).ok).toBe(true);
  const created = await as.admin.request("/api/admin/bench-tokens", { json: { name: "Plausibility bench" } });
  expect(created.status).toBe(201);
  token = ((await created.json()) as { token: string }).token;
});
afterAll(() => closeDb());

function benchUpload(relative: string) {
  return bench.request("/api/v1/measurements", {
    multipart: fixtureUpload(relative, { device: device.partNumber }),
    headers: { authorization: `Bearer ${token}` },
    origin: null,
  });
}

describe("plausibility through the bench API", () => {
  it("refuses a harmonic 3.20 dB above the input with 422, file, line and column, and stores nothing", async () => {
    const before = await uploadRowCounts();
    const r = await benchUpload("implausible/drive-harmonic-above-input.csv");
    expect(r.status).toBe(422);
    const body = (await r.json()) as { error: { code: string; message: string; details: { ingest: { code: string; line: number; column: number; field: string } } } };
    expect(body.error.message).toBe(
      'drive-harmonic-above-input.csv line 13, column 3 ("p2_out [dBm]"): 13.20 dBm out is 3.20 dB above the 10.00 dBm of "input_power [dBm]" on the same row; a passive part cannot put out more than it takes in, and two readings of ±0.5 dB explain at most 1.0 dB: check the column order, the units and the attenuator offsets',
    );
    expect(body.error.details.ingest).toMatchObject({ code: "implausible-value", line: 13, column: 3, field: "p2_out [dBm]" });
    expect(await uploadRowCounts()).toEqual(before);
  });

  it("keeps a harmonic 0.37 dB above the input with a warning the set page, the review queue and the sheet's open issues show", async () => {
    const warning =
      '"p2_out [dBm]" is above "input_power [dBm]" on 1 row, by up to 0.37 dB (line 14: 15.37 dBm out, 15.00 dBm in); within the 1.0 dB that two readings of ±0.5 dB allow, but a passive part has no gain: check the calibration and the offsets';
    const r = await benchUpload("implausible/drive-harmonic-at-input.csv");
    expect(r.status).toBe(201);
    const { measurementSet } = (await r.json()) as { measurementSet: { id: number; warnings: string[] } };
    // Once: the parser's warnings are not stored a second time through the analysis' copy of them.
    expect(measurementSet.warnings.filter((w) => w === `Plausibility: ${warning}`)).toHaveLength(1);

    const setPage = await as.reviewer.request(`/devices/${device.id}/measurements/${measurementSet.id}`);
    expect(setPage.status).toBe(200);
    const setHtml = await setPage.text();
    expect(setHtml).toContain('data-testid="plausibility-warning"');
    expect(setHtml).toContain(warning.replace(/"/g, "&quot;"));

    const queue = await as.reviewer.request("/review");
    const queueHtml = await queue.text();
    const row = queueHtml.slice(queueHtml.indexOf(`data-testid="review-row-${measurementSet.id}"`));
    expect(row.slice(0, row.indexOf("</tr>"))).toMatch(/data-testid="plausibility-count"[^>]*><span class="figure">1<\/span> plausibility/);

    expect((await as.reviewer.request(`/api/measurements/${measurementSet.id}/review`, { json: { decision: "approve" } })).status).toBe(200);
    const sheet = await as.engineer.request(`/api/devices/${device.id}/sheet`);
    expect(sheet.status).toBe(200);
    const { sheet: model } = (await sheet.json()) as { sheet: { issues: { code: string; message: string }[] } };
    expect(model.issues.filter((i) => i.code === "implausible-value")).toEqual([
      {
        code: "implausible-value",
        message: `Measurement set ${measurementSet.id} (drive-sweep, BFD-0501) carries a plausibility warning: ${warning}.`,
      },
    ]);
  });
});
