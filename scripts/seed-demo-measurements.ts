/**
 * Fills the demo organizations through the app's own API, as people would: admins enter the
 * instruments, a bench token (made for this run, revoked at the end) posts the demo files to
 * POST /api/v1/measurements, a demo reviewer approves some, and engineers save their sheets'
 * limits and prose. The data are in models/seeders/demo-measurements.ts and demo-sheets.ts.
 * Runs once per database (recorded in benchfold_seeds). Then the demo's reviews and releases
 * (seed-demo-releases.ts) and the demo catalog's parts (seed-demo-catalog.ts), which check the sheets'
 * state themselves. Needs the app at BENCHFOLD_APP_URL.
 */
import { randomBytes, createHash } from "node:crypto";
import { QueryTypes } from "sequelize";
import { db, closeDb, withDatabaseLock } from "../models";
import type { User, BenchToken } from "../models";
import { demoInstruments, demoUploads } from "../models/seeders/demo-measurements";
import { demoPassword } from "../models/seeders/demo-scenario";
import { demoSheets } from "../models/seeders/demo-sheets";
import { demoDesignIn, demoOutlineBytes } from "../models/seeders/demo-design-in";
import { seedDemoCatalog } from "./seed-demo-catalog";
import { seedDemoReleases } from "./seed-demo-releases";
import { seedDemoConformity } from "./seed-demo-conformity";
import { signInOverHttp } from "./sign-in-over-http";

const appUrl = process.env.BENCHFOLD_APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
const marker = "demo-measurements-via-bench-api";

function signIn(email: string): Promise<string> {
  return signInOverHttp(appUrl, { email, password: demoPassword });
}

async function userOf(slug: string, role: "admin" | "engineer" | "reviewer"): Promise<User> {
  const { Organization, User } = db();
  const org = await Organization.findOne({ where: { slug } });
  return (await User.findOne({ where: { organizationId: org!.id, role } }))!;
}

async function call(session: string, method: string, url: string, body: unknown, expected: number): Promise<unknown> {
  const r = await fetch(`${appUrl}${url}`, {
    method,
    headers: { "content-type": "application/json", cookie: session, origin: new URL(appUrl).origin },
    body: JSON.stringify(body),
  });
  if (r.status !== expected) throw new Error(`${method} ${url}: ${r.status} ${await r.text()}`);
  return r.json();
}

/** The demo's package outline (an SVG in models/seeders/outlines/) through the workspace's upload endpoint, rasterised there. */
async function uploadOutline(session: string, deviceId: number, file: string): Promise<void> {
  const form = new FormData();
  form.set("file", new Blob([new Uint8Array(demoOutlineBytes(file))], { type: "image/svg+xml" }), file);
  const r = await fetch(`${appUrl}/api/devices/${deviceId}/package-outline`, { method: "POST", headers: { cookie: session, origin: new URL(appUrl).origin }, body: form });
  if (r.status !== 201) throw new Error(`POST /api/devices/${deviceId}/package-outline (${file}): ${r.status} ${await r.text()}`);
}

async function loadDemoMeasurements() {
  const { BenchToken, Device, Organization, sequelize } = db();
  await sequelize.query("CREATE TABLE IF NOT EXISTS benchfold_seeds (name VARCHAR(255) NOT NULL PRIMARY KEY)");
  const done = await sequelize.query("SELECT name FROM benchfold_seeds WHERE name = ?", { replacements: [marker], type: QueryTypes.SELECT });
  if (done.length) {
    console.error("[benchfold] demo measurements: already uploaded");
    return;
  }
  const slugs = [...new Set(demoUploads.map((u) => u.org))];
  const started = Date.now();

  // Instruments, entered by each organization's admin.
  const instrumentIds = new Map<string, number>();
  for (const [slug, instruments] of Object.entries(demoInstruments)) {
    const session = await signIn((await userOf(slug, "admin")).email);
    for (const { key, ...instrument } of instruments) {
      const { instrument: saved } = (await call(session, "POST", "/api/admin/instruments", instrument, 201)) as { instrument: { id: number } };
      instrumentIds.set(`${slug}/${key}`, saved.id);
    }
  }

  // Files, through the bench API with a token made for this run and revoked at the end.
  const tokens = new Map<string, { token: string; row: BenchToken }>();
  for (const slug of slugs) {
    const admin = await userOf(slug, "admin");
    const token = `bfd_${randomBytes(30).toString("base64url")}`;
    const row = await BenchToken.create({
      organizationId: admin.organizationId, createdById: admin.id, name: "Demo loader (revoked after use)", tokenPrefix: token.slice(0, 10),
      tokenHash: createHash("sha256").update(token).digest("hex"),
    });
    tokens.set(slug, { token, row });
  }
  const toApprove = new Map<string, number[]>();
  for (const u of demoUploads) {
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(u.bytes())]), u.file);
    form.set("device", u.part);
    for (const [k, v] of Object.entries(u.fields)) form.set(k, v);
    form.set("instrumentIds", u.instruments.map((key) => instrumentIds.get(`${u.org}/${key}`)).join(","));
    const r = await fetch(`${appUrl}/api/v1/measurements`, { method: "POST", headers: { authorization: `Bearer ${tokens.get(u.org)!.token}` }, body: form });
    const body = (await r.json()) as { measurementSet?: { id: number }; error?: { message: string } };
    if (r.status !== 201) throw new Error(`demo upload ${u.file} → ${u.part}: ${r.status} ${body.error?.message}`);
    // A unit the demo's revision B adds waits for review until revision A is out (seed-demo-releases.ts).
    if (u.approve && !u.approveAfterRevisionA) toApprove.set(u.org, [...(toApprove.get(u.org) ?? []), body.measurementSet!.id]);
  }

  // A second engineer (the organization's reviewer) approves some; the rest wait in the review queue.
  for (const [slug, ids] of toApprove) {
    const session = await signIn((await userOf(slug, "reviewer")).email);
    for (const id of ids) await call(session, "POST", `/api/measurements/${id}/review`, { decision: "approve" }, 200);
  }
  for (const { row } of tokens.values()) await row.update({ revokedAt: new Date() });

  // What the engineers wrote on their sheets: limits, prose, ratings, stated uncertainty.
  let sheets = 0;
  let designed = 0;
  for (const org of await Organization.findAll()) {
    const content = Object.entries(demoSheets);
    const devices = await Device.findAll({ where: { organizationId: org.id } });
    const mine = content.filter(([part]) => devices.some((d) => d.partNumber === part));
    if (mine.length === 0) continue;
    const session = await signIn((await userOf(org.slug, "engineer")).email);
    for (const [part, sheet] of mine) {
      const id = devices.find((d) => d.partNumber === part)!.id;
      await call(session, "PUT", `/api/devices/${id}/spec-limits`, { limits: sheet.limits }, 200);
      await call(session, "PUT", `/api/devices/${id}/sheet-content`, { prose: sheet.prose, absoluteMaximumRatings: sheet.absoluteMaximumRatings, measurementUncertainty: sheet.measurementUncertainty }, 200);
      const designIn = demoDesignIn[part];
      if (designIn) {
        // Before any release, so every released revision carries the design-in sections.
        const { packageOutline, ...lists } = designIn;
        await call(session, "PUT", `/api/devices/${id}/design-data`, { ...lists, packageOutlineCaption: packageOutline.caption }, 200);
        await uploadOutline(session, id, packageOutline.file);
        designed++;
      }
      sheets++;
    }
  }

  await sequelize.query("INSERT INTO benchfold_seeds (name) VALUES (?)", { replacements: [marker] });
  console.error(
    `[benchfold] demo measurements: ${demoUploads.length} files uploaded through the bench API, ${[...toApprove.values()].flat().length} approved; ` +
      `${instrumentIds.size} instruments; ${sheets} sheets with limits and prose, ${designed} with design-in data (${((Date.now() - started) / 1000).toFixed(1)} s)`,
  );
}

async function main() {
  await loadDemoMeasurements();
  // The reviews and releases look at where each sheet stands, so they run (or carry on) every time.
  let started = Date.now();
  const played = await seedDemoReleases(appUrl);
  console.error(`[benchfold] demo reviews and releases: ${played.length ? played.join("; ") : "already there"} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  // Right after the releases, before the demo catalog, so that the demo story's sets keep the ids the
  // sheet snapshots were recorded with (tests/integration/sheets.test.ts compares them).
  // After the releases: one unit outside KDX-2G4's released limit (a conformity alert), one in control.
  started = Date.now();
  const watched = await seedDemoConformity(appUrl);
  console.error(`[benchfold] demo conformity watch: ${watched.length ? watched.join("; ") : "already there"} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  // The demo catalog's parts: created, measured, limited and released as A through the same API.
  started = Date.now();
  const catalog = await seedDemoCatalog(appUrl);
  console.error(`[benchfold] demo catalog: ${catalog.length ? `released ${catalog.join(", ")}` : "already there"} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
}

// Under a database lock, like the migrations: two instances booting together load the demo once.
withDatabaseLock(db().sequelize, "benchfold-demo", 600, main)
  .catch((error) => {
    console.error("[benchfold] demo measurements failed:", error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
