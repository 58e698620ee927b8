import { readFileSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { ConformityWatchView } from "@/lib/domain/conformity";
import type { SheetModel } from "@/lib/sheet";
import { closeDb, db } from "@/models";
import type { TestClient } from "./helpers/client";
import { clientsByRole, makeOrganization, type Who } from "./helpers/factories";
import { mailsTo, setFakeSmtpListening } from "./helpers/mailbox";
import { releaseSheet } from "./helpers/reviews";
import { fixtureUpload, fixturesDir } from "./helpers/uploads";
import { makeDevice } from "./helpers/factories";

// A doubler released as Rev. A from five units, with a guaranteed conversion-loss max of the release
// mean + 0.8 dB and U = 0.1 dB (guarded acceptance). Each unit is the example drive sweep with every
// output level lowered by an offset, which raises its conversion loss by exactly that offset (the
// optimum stays at the same drive) and leaves the harmonic suppressions (dBc) as they are.

let org: Awaited<ReturnType<typeof makeOrganization>>;
let other: Awaited<ReturnType<typeof makeOrganization>>;
let clients: Map<Who, TestClient>;
let otherClients: Map<Who, TestClient>;
let deviceId: number;
let releaseMean: number;
let releaseSigma: number;
const as = (who: Who) => clients.get(who)!;
const groupKey = "drive=10;inputFrequencyHz=1000000000;temperatureC=25";

/** The example drive sweep as unit `serial`, its outputs lowered by `offsetDb`. */
function unitFile(serial: string, offsetDb: number): Uint8Array<ArrayBuffer> {
  const lines = readFileSync(path.join(fixturesDir, "examples/drive-sweep-doubler.csv"), "utf8").split("\n");
  const out = lines.map((line) => {
    if (line.startsWith("# serial:")) return `# serial: ${serial}`;
    if (!/^-?\d/.test(line)) return line;
    const [input, ...outputs] = line.split(",");
    return [input, ...outputs.map((v) => (Number(v) - offsetDb).toFixed(2))].join(",");
  });
  return new Uint8Array(Buffer.from(out.join("\n")));
}

async function approvedUnit(serial: string, offsetDb: number): Promise<number> {
  const upload = await as("engineer").request(`/api/devices/${deviceId}/measurements`, { multipart: fixtureUpload("examples/drive-sweep-doubler.csv", {}, unitFile(serial, offsetDb)) });
  expect(upload.status, await upload.clone().text()).toBe(201);
  const setId = ((await upload.json()) as { measurementSet: { id: number } }).measurementSet.id;
  const review = await as("reviewer").request(`/api/measurements/${setId}/review`, { json: { decision: "approve" } });
  expect(review.status, await review.clone().text()).toBe(200);
  return setId;
}

async function watch(client = as("engineer")): Promise<ConformityWatchView> {
  const r = await client.request(`/api/devices/${deviceId}/conformity`);
  expect(r.status, await r.clone().text()).toBe(200);
  return ((await r.json()) as { conformity: ConformityWatchView }).conformity;
}

async function draftIssues(): Promise<string[]> {
  const r = await as("engineer").request(`/api/devices/${deviceId}/sheet`);
  return ((await r.json()) as { sheet: SheetModel }).sheet.issues.map((i) => i.message);
}

async function alertRows(): Promise<{ id: number; measurement_set_id: number; closed_at: Date | null; close_reason: string | null }[]> {
  return db().sequelize.query("SELECT id, measurement_set_id, closed_at, close_reason FROM conformity_alerts WHERE device_id = ? ORDER BY id", {
    type: QueryTypes.SELECT,
    replacements: [deviceId],
  });
}

async function outboxOf(eventKey: string): Promise<{ recipient: string; sent_at: Date | null }[]> {
  return db().sequelize.query("SELECT recipient, sent_at FROM outbox_messages WHERE event_key = ? ORDER BY recipient", { type: QueryTypes.SELECT, replacements: [eventKey] });
}

beforeAll(async () => {
  org = await makeOrganization();
  other = await makeOrganization();
  clients = await clientsByRole(org);
  otherClients = await clientsByRole(other);
  deviceId = (await makeDevice(org.organization.id)).id;
  const offsets = [0, 0.2, -0.15, 0.1, -0.05];
  for (const [i, offset] of offsets.entries()) await approvedUnit(`CW-${100 + i}`, offset);
  const content = await as("engineer").request(`/api/devices/${deviceId}/sheet-content`, { method: "PUT", json: { measurementUncertainty: { "conversion-loss": 0.1 } } });
  expect(content.status, await content.clone().text()).toBe(200);
  const draft = (await (await as("engineer").request(`/api/devices/${deviceId}/sheet`)).json()) as { sheet: SheetModel };
  const group = draft.sheet.statistics.groups.find((g) => g.groupId === `conversion-loss-at-drive:${groupKey}`)!;
  expect(group.n).toBe(5);
  releaseMean = group.mean.value!;
  releaseSigma = group.standardDeviation.value!;
  const limits = await as("engineer").request(`/api/devices/${deviceId}/spec-limits`, {
    method: "PUT",
    json: { limits: [{ parameter: "conversion-loss", conditionsKey: groupKey, max: Math.round((releaseMean + 0.8) * 100) / 100, unit: "dB", basis: "test" }] },
  });
  expect(limits.status, await limits.clone().text()).toBe(200);
  await releaseSheet(as("engineer"), as("reviewer"), deviceId);
}, 240_000);
afterAll(async () => {
  await setFakeSmtpListening(true);
  await closeDb();
});

describe("the conformity watch over HTTP", () => {
  it("starts at the release: the limit, its rule and an empty chart", async () => {
    const w = await watch();
    expect(w.revision?.letter).toBe("A");
    expect(w.setCount).toBe(0);
    expect(w.limits).toHaveLength(1);
    expect(w.limits[0]).toMatchObject({ inside: 0, outside: 0 });
    expect(w.limits[0].limitText).toMatch(/guarded acceptance w = U/);
    expect(w.charts).toEqual([]);
    expect(w.alerts).toEqual([]);
  });

  it("an in-control unit raises no alert and joins the chart", async () => {
    const setId = await approvedUnit("CW-200", 0.03);
    expect(await alertRows()).toEqual([]);
    const w = await watch();
    expect(w.setCount).toBe(1);
    expect(w.limits[0]).toMatchObject({ inside: 1, outside: 0 });
    expect(w.charts).toHaveLength(1);
    expect(w.charts[0]).toMatchObject({ pointCount: 1, releaseUnitCount: 5, signals: [] });
    // The release's mean and s (n − 1), as its annex states them.
    expect(w.charts[0].centreText.replace(/\u00a0/g, " ")).toBe(`${Number(releaseMean.toFixed(3))} dB`);
    expect(setId).toBeGreaterThan(0);
  });

  it("a unit outside the guaranteed limit raises one alert, audited, with one mail to each engineer and reviewer even while SMTP is down", async () => {
    await setFakeSmtpListening(false);
    const setId = await approvedUnit("CW-201", 1.2);
    const rows = await alertRows();
    expect(rows.map((r) => r.measurement_set_id)).toEqual([setId]);
    const alertId = rows[0].id;
    const eventKey = `conformity-alert:${alertId}:raised`;
    expect((await outboxOf(eventKey)).map((r) => r.recipient)).toEqual([org.users.engineer.email, org.users.reviewer.email].sort());
    // Let the worker fail against the closed port at least once before the relay comes back.
    await new Promise((r) => setTimeout(r, 2500));
    await setFakeSmtpListening(true);
    for (let i = 0; i < 600 && (await outboxOf(eventKey)).some((r) => r.sent_at === null); i++) await new Promise((r) => setTimeout(r, 100));
    expect((await outboxOf(eventKey)).every((r) => r.sent_at !== null)).toBe(true);
    for (const who of ["engineer", "reviewer"] as const) {
      const mails = (await mailsTo(org.users[who].email)).filter((m) => m.subject.startsWith("Conformity alert on"));
      expect(mails, who).toHaveLength(1);
      expect(mails[0].text).toContain(`Unit CW-201 (measurement set #${setId})`);
      expect(mails[0].text).toContain("Conversion loss");
    }
    expect(await mailsTo(org.users.admin.email)).toEqual([]);

    const audit = await db().AuditEvent.findAll({ where: { subjectType: "conformity-alert", subjectId: String(alertId) } });
    expect(audit.map((a) => a.action)).toEqual(["conformity-alert.raise"]);
    const w = await watch();
    expect(w.limits[0]).toMatchObject({ inside: 1, outside: 1 });
    expect(w.alerts).toHaveLength(1);
    expect(w.alerts[0].closed).toBeNull();
    // Outside the limit, and 1.2 dB is far beyond 3σ of the release: Nelson's test 1 with it.
    expect(w.alerts[0].findings.map((f) => f.replace(/\u00a0/g, " "))).toEqual([
      expect.stringMatching(/^Unit CW-201 \(set #\d+\): Conversion loss at .* reads [\d.]+ dB, outside the guaranteed max [\d.]+ dB \(accepted up to [\d.]+ dB, guarded acceptance w = U\)\.$/),
      expect.stringMatching(/Nelson test 1, one point beyond 3σ, ends at unit CW-201/),
    ]);
    expect(w.charts[0].signals.map((s) => [s.rule, s.serial])).toEqual([[1, "CW-201"]]);
    expect(1.2 / releaseSigma).toBeGreaterThan(3);
    expect((await draftIssues()).some((m) => m.startsWith(`Conformity alert #${alertId}:`))).toBe(true);
  });

  it("approving a second set does not raise the first alert again", async () => {
    await approvedUnit("CW-202", -0.02);
    expect((await alertRows()).length).toBe(1);
  });

  it("only an engineer of the organization closes an alert, with a reason; closing is audited and the issue leaves the sheet", async () => {
    const [{ id }] = await alertRows();
    const close = (client: TestClient, reason: unknown) => client.request(`/api/conformity-alerts/${id}/close`, { json: { reason } });
    expect((await close(as("reviewer"), "Reviewer may not close this one.")).status).toBe(403);
    expect((await close(as("admin"), "Admin may not close this one.")).status).toBe(403);
    expect((await close(as("customer"), "Customer may not close this one.")).status).toBe(403);
    expect((await close(as("signed-out"), "Signed out may not close this one.")).status).toBe(401);
    expect((await close(otherClients.get("engineer")!, "Another organization's engineer.")).status).toBe(404);
    const short = await close(as("engineer"), "ok");
    expect(short.status).toBe(422);
    expect(JSON.stringify(await short.json())).toMatch(/at least 10 characters/);
    expect((await alertRows())[0].closed_at).toBeNull();

    const reason = "New lot, limit revision planned";
    const closed = await close(as("engineer"), reason);
    expect(closed.status, await closed.clone().text()).toBe(200);
    expect((await alertRows())[0]).toMatchObject({ close_reason: reason });
    expect((await close(as("engineer"), reason)).status).toBe(409);

    const audit = await db().AuditEvent.findAll({ where: { subjectType: "conformity-alert", subjectId: String(id) }, order: [["id", "ASC"]] });
    expect(audit.map((a) => a.action)).toEqual(["conformity-alert.raise", "conformity-alert.close"]);
    expect(audit[1].actorUserId).toBe(org.users.engineer.id);
    expect(audit[1].after).toMatchObject({ reason });
    const w = await watch(as("reviewer"));
    expect(w.alerts[0].closed).toMatchObject({ reason, by: org.users.engineer.name });
    expect((await draftIssues()).some((m) => m.startsWith("Conformity alert"))).toBe(false);
  });

  it("is read by the organization's engineers and reviewers only", async () => {
    const path = `/api/devices/${deviceId}/conformity`;
    expect((await as("reviewer").request(path)).status).toBe(200);
    expect((await as("admin").request(path)).status).toBe(403);
    expect((await as("customer").request(path)).status).toBe(403);
    expect((await as("signed-out").request(path)).status).toBe(401);
    expect((await otherClients.get("engineer")!.request(path)).status).toBe(404);
  });

  it("the device page shows the section to an engineer and leaves it out for an administrator", async () => {
    const page = await (await as("engineer").request(`/devices/${deviceId}`)).text();
    expect(page).toContain("Conformity since release");
    expect(page).toContain("Units inside each guaranteed limit");
    const adminPage = await (await as("admin").request(`/devices/${deviceId}`)).text();
    expect(adminPage).not.toContain("Conformity since release");
  });
});
