/**
 * The demo's conformity watch (models/seeders/demo-conformity.ts), played after the demo's releases
 * (scripts/seed-demo-releases.ts): each unit is posted through the bench API with a token made for
 * this run and revoked at the end (as the demo loader posts its files), then approved by the
 * organization's reviewer, so the approval reads it against the current revision: KDX-2G4's unit
 * raises a conformity alert, KM-7H's stays in control.
 *
 * Each step looks first: a unit already uploaded is not uploaded again, one already decided is left
 * alone, and a part without a current revision is skipped with a note, so a second run changes
 * nothing. Needs MariaDB (for the token) and the app at BENCHFOLD_APP_URL. Called as
 * `seedDemoConformity(appUrl)` right after `seedDemoReleases(appUrl)`, or on its own with
 * `node node_modules/tsx/dist/cli.mjs scripts/seed-demo-conformity.ts`.
 */
import { createHash, randomBytes } from "node:crypto";
import type { MeasurementSetSummary } from "../lib/domain/measurements";
import type { RevisionSummary } from "../lib/domain/reviews";
import { closeDb, db } from "../models";
import { demoConformityUnits } from "../models/seeders/demo-conformity";
import { demoOrganizations, demoPassword } from "../models/seeders/demo-scenario";
import { DemoApiSession } from "./demo-api-session";

function person(appUrl: string, org: string, role: "engineer" | "reviewer" | "admin"): Promise<DemoApiSession> {
  const user = demoOrganizations.find((o) => o.slug === org)?.users.find((u) => u.role === role);
  if (!user) throw new Error(`the demo organization ${org} has no ${role}`);
  return DemoApiSession.signIn(appUrl, { email: user.email, password: demoPassword });
}

/** Posts a unit through the bench API with a token of this run (revoked at once); the new set's id. */
async function postThroughBench(appUrl: string, unit: (typeof demoConformityUnits)[number]): Promise<number> {
  const { BenchToken, Instrument, Organization, User } = db();
  const organization = await Organization.findOne({ where: { slug: unit.org } });
  const admin = organization && (await User.findOne({ where: { organizationId: organization.id, role: "admin" } }));
  if (!organization || !admin) throw new Error(`the demo organization ${unit.org} is not there`);
  const token = `bfd_${randomBytes(30).toString("base64url")}`;
  const row = await BenchToken.create({
    organizationId: organization.id, createdById: admin.id, name: "Demo conformity loader (revoked after use)", tokenPrefix: token.slice(0, 10),
    tokenHash: createHash("sha256").update(token).digest("hex"),
  });
  try {
    const instruments = await Instrument.findAll({ where: { organizationId: organization.id } });
    const { demoInstruments } = await import("../models/seeders/demo-measurements");
    const ids = unit.instruments.map((key) => {
      const serial = demoInstruments[unit.org].find((i) => i.key === key)?.serial;
      const found = instruments.find((i) => i.serial === serial);
      if (!found) throw new Error(`the demo instrument ${unit.org}/${key} is not there`);
      return found.id;
    });
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(unit.bytes())]), unit.file);
    form.set("device", unit.part);
    for (const [k, v] of Object.entries(unit.fields)) form.set(k, v);
    form.set("instrumentIds", ids.join(","));
    const r = await fetch(`${appUrl}/api/v1/measurements`, { method: "POST", headers: { authorization: `Bearer ${token}` }, body: form });
    const body = (await r.json()) as { measurementSet?: { id: number }; error?: { message: string } };
    if (r.status !== 201) throw new Error(`demo upload ${unit.file} → ${unit.part}: ${r.status} ${body.error?.message}`);
    return body.measurementSet!.id;
  } finally {
    await row.update({ revokedAt: new Date() });
  }
}

/** Closes every open conformity alert of the device with the reason, as its engineer; how many were open. */
export async function closeDemoAlerts(engineer: DemoApiSession, deviceId: number, reason: string): Promise<number> {
  const { conformity } = await engineer.call<{ conformity: { alerts: { id: number; closed: unknown }[] } }>("GET", `/api/devices/${deviceId}/conformity`);
  const open = conformity.alerts.filter((a) => a.closed === null);
  for (const alert of open) await engineer.call("POST", `/api/conformity-alerts/${alert.id}/close`, { reason }, 200);
  return open.length;
}

/** Uploads and approves each unit the database does not show yet; what it did, one line each. */
export async function seedDemoConformity(appUrl: string): Promise<string[]> {
  const done: string[] = [];
  for (const unit of demoConformityUnits) {
    const engineer = await person(appUrl, unit.org, "engineer");
    const { devices } = await engineer.call<{ devices: { id: number; partNumber: string }[] }>("GET", "/api/devices");
    const device = devices.find((d) => d.partNumber === unit.part);
    if (!device) throw new Error(`the demo device ${unit.part} is not there`);
    const { revisions } = await engineer.call<{ revisions: RevisionSummary[] }>("GET", `/api/devices/${device.id}/revisions`);
    if (!revisions.some((r) => r.standing === "current")) {
      done.push(`${unit.part} has no current revision yet: unit ${unit.serial} waits`);
      continue;
    }
    const { measurementSets } = await engineer.call<{ measurementSets: MeasurementSetSummary[] }>("GET", `/api/devices/${device.id}/measurements`);
    const existing = measurementSets.find((s) => s.conditions.serial === unit.serial);
    if (existing && existing.state !== "submitted") continue;
    const setId = existing?.id ?? (await postThroughBench(appUrl, unit));
    const reviewer = await person(appUrl, unit.org, "reviewer");
    await reviewer.call("POST", `/api/measurements/${setId}/review`, { decision: "approve" }, 200);
    const { conformity } = await engineer.call<{ conformity: { alerts: { measurementSetId: number }[] } }>("GET", `/api/devices/${device.id}/conformity`);
    const raised = conformity.alerts.some((a) => a.measurementSetId === setId);
    done.push(`${unit.part} unit ${unit.serial} approved after the release: ${raised ? "conformity alert raised" : "in control, no alert"} (the demo expects: ${unit.expect})`);
  }
  return done;
}

if (require.main === module) {
  const appUrl = process.env.BENCHFOLD_APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
  seedDemoConformity(appUrl)
    .then((played) => console.error(`[benchfold] demo conformity watch: ${played.length ? played.join("; ") : "already there"}`))
    .catch((error) => {
      console.error("[benchfold] demo conformity watch failed:", error instanceof Error ? error.message : error);
      process.exitCode = 1;
    })
    .finally(() => closeDb());
}
