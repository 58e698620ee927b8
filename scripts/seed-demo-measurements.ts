/**
 * Fills the demo organizations with measurement sets through the real upload path: a bench
 * token (made for this run, revoked at the end) posts the example files to POST
 * /api/v1/measurements of the running app, and a demo reviewer approves some over HTTP.
 * Runs once per database (recorded in octavo_seeds). Needs the app at OCTAVO_APP_URL.
 *
 * Invented demo data: extra units of the example doubler are the example file with a
 * different serial and a small, seeded offset on every power reading.
 */
import { randomBytes, createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { BenchToken, Organization, User, closeSequelize, getSequelize } from "../models";
import { demoPassword } from "../models/seeders/demo-scenario";

const appUrl = process.env.OCTAVO_APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
const marker = "demo-measurements-via-bench-api";
const examples = path.resolve(__dirname, "../fixtures/examples");

type Upload = { org: string; part: string; file: string; fields?: Record<string, string>; bytes?: Buffer; approve?: boolean };

function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Another unit of the example doubler: new serial, every output power moved by up to ±0.6 dB. */
function anotherDoublerUnit(serial: string, seed: number): Buffer {
  const rand = seeded(seed);
  const shift = (rand() - 0.5) * 1.2;
  const lines = readFileSync(path.join(examples, "drive-sweep-doubler.csv"), "utf8").split("\n");
  return Buffer.from(
    lines
      .map((line) => {
        if (line.startsWith("# serial:")) return `# serial: ${serial}`;
        if (!/^-?\d/.test(line)) return line;
        const [input, ...outs] = line.split(",");
        return [input, ...outs.map((v) => (Number(v) + shift + (rand() - 0.5) * 0.3).toFixed(2))].join(",");
      })
      .join("\n"),
  );
}

const uploads: Upload[] = [
  { org: "kestrine", part: "KDX-2G4", file: "drive-sweep-doubler.csv", approve: true },
  ...["OCT-0002", "OCT-0003", "OCT-0004", "OCT-0005"].map((serial, i) => ({
    org: "kestrine", part: "KDX-2G4", file: `drive-sweep-${serial.toLowerCase()}.csv`, bytes: anotherDoublerUnit(serial, 11 + i), approve: i < 3,
  })),
  { org: "kestrine", part: "KDX-2G4", file: "phase-noise-doubler.csv", approve: true },
  { org: "kestrine", part: "KM-7H", file: "frequency-sweep-mixer.csv", approve: true },
  { org: "kestrine", part: "KM-7H", file: "two-tone-mixer.tsv", approve: false },
  { org: "kestrine", part: "KQH-2G", file: "hybrid-4port.s4p", fields: { serial: "OCT-0401", temperatureC: "25" }, approve: true },
  { org: "pellacourt", part: "PS-2W", file: "splitter-3port.s3p", fields: { serial: "PS-0007", temperatureC: "25" }, approve: false },
  { org: "wrenfield-lab", part: "WL-C2611-KDX", file: "drive-sweep-doubler.csv", approve: true },
  { org: "wrenfield-lab", part: "WL-C2611-KDX", file: "phase-noise-doubler.csv", approve: false },
];

async function signIn(email: string): Promise<string> {
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const cookies = csrf.headers.getSetCookie().map((c) => c.split(";")[0]);
  const r = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookies.join("; "), origin: new URL(appUrl).origin },
    body: new URLSearchParams({ csrfToken, email, password: demoPassword, json: "true" }),
  });
  const session = r.headers.getSetCookie().map((c) => c.split(";")[0]).find((c) => c.includes("session-token"));
  if (!session) throw new Error(`demo sign-in as ${email} failed (${r.status})`);
  return session;
}

async function main() {
  const sequelize = getSequelize();
  await sequelize.query("CREATE TABLE IF NOT EXISTS octavo_seeds (name VARCHAR(255) NOT NULL PRIMARY KEY)");
  const done = await sequelize.query("SELECT name FROM octavo_seeds WHERE name = ?", { replacements: [marker], type: QueryTypes.SELECT });
  if (done.length) {
    console.error("[octavo] demo measurements: already uploaded");
    return;
  }
  const tokens = new Map<string, { token: string; row: BenchToken }>();
  for (const slug of new Set(uploads.map((u) => u.org))) {
    const org = await Organization.findOne({ where: { slug } });
    const admin = await User.findOne({ where: { organizationId: org!.id, role: "admin" } });
    const token = `oct_${randomBytes(30).toString("base64url")}`;
    const row = await BenchToken.create({
      organizationId: org!.id, createdById: admin!.id, name: "Demo loader (revoked after use)", tokenPrefix: token.slice(0, 10),
      tokenHash: createHash("sha256").update(token).digest("hex"),
    });
    tokens.set(slug, { token, row });
  }
  const toApprove = new Map<string, number[]>();
  for (const u of uploads) {
    const form = new FormData();
    const bytes = u.bytes ?? readFileSync(path.join(examples, u.file));
    form.set("file", new Blob([new Uint8Array(bytes)]), u.file);
    form.set("device", u.part);
    for (const [k, v] of Object.entries(u.fields ?? {})) form.set(k, v);
    const r = await fetch(`${appUrl}/api/v1/measurements`, { method: "POST", headers: { authorization: `Bearer ${tokens.get(u.org)!.token}` }, body: form });
    const body = (await r.json()) as { measurementSet?: { id: number }; error?: { message: string } };
    if (r.status !== 201) throw new Error(`demo upload ${u.file} → ${u.part}: ${r.status} ${body.error?.message}`);
    if (u.approve) toApprove.set(u.org, [...(toApprove.get(u.org) ?? []), body.measurementSet!.id]);
  }
  for (const [slug, ids] of toApprove) {
    const org = await Organization.findOne({ where: { slug } });
    const reviewer = await User.findOne({ where: { organizationId: org!.id, role: "reviewer" } });
    const session = await signIn(reviewer!.email);
    for (const id of ids) {
      const r = await fetch(`${appUrl}/api/measurements/${id}/review`, {
        method: "POST",
        headers: { "content-type": "application/json", cookie: session, origin: new URL(appUrl).origin },
        body: JSON.stringify({ decision: "approve" }),
      });
      if (r.status !== 200) throw new Error(`demo approval of set ${id}: ${r.status} ${await r.text()}`);
    }
  }
  for (const { row } of tokens.values()) await row.update({ revokedAt: new Date() });
  await sequelize.query("INSERT INTO octavo_seeds (name) VALUES (?)", { replacements: [marker] });
  console.error(`[octavo] demo measurements: ${uploads.length} files uploaded through the bench API, ${[...toApprove.values()].flat().length} approved`);
}

main()
  .catch((error) => {
    console.error("[octavo] demo measurements failed:", error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(() => closeSequelize());
