/**
 * The fault suite's database part: the private MariaDB is killed (SIGKILL, no shutdown) in the
 * middle of an upload, 20 times at seeded moments. Each time: the upload answers 201 (it committed
 * first) or 503 in a plain sentence, never 500; while the database is down the API answers 503;
 * once it is started again the same app process serves again; and the tables hold no partial
 * upload — every measurement set has its stored file, every stored file its set, and each trial
 * added at most the one set it sent.
 *
 * Then the same in the middle of a release, 20 times: the release answers 201 (committed) or 503;
 * afterwards a revision exists exactly when its candidate says released, with its PDF bytes whose
 * SHA-256 (computed by MariaDB) is the stored one, its audit event and its queued notices; and
 * when no revision exists the same candidate releases cleanly once the database is back.
 *
 * It stops and starts the MariaDB instance the whole run shares, so it runs alone in its file
 * (integration files run one at a time) and always leaves the database running.
 */
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mulberry32 } from "@/lib/stats/seeded-random";
import { readVerified } from "@/lib/server/storage/object-store";
import { closeDb, db } from "@/models";
import { TestClient } from "./helpers/client";
import { runStore } from "./helpers/object-store";
import { killDatabase, startDatabase } from "./helpers/database-process";
import { clientsByRole, factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { deviceWithApprovedData, release, sign, submitDraft } from "./helpers/reviews";

const TRIALS = 20;

/** A phase-noise trace of 30,000 offsets: big enough that parsing, deriving and storing take a while. */
function bigTrace(serial: string): Uint8Array<ArrayBuffer> {
  const lines = ["# kind: phase-noise", `# serial: ${serial}`, "# carrier_frequency: 2 GHz", "# carrier_power: 3 dBm", "offset [Hz],L [dBc/Hz]"];
  const points = 30_000;
  for (let i = 0; i < points; i++) {
    const offsetHz = 10 ** ((7 * i) / (points - 1));
    lines.push(`${offsetHz.toPrecision(8)},${(-110 - 10 * Math.log10(offsetHz) * 0.8).toFixed(3)}`);
  }
  return new TextEncoder().encode(`${lines.join("\n")}\n`) as Uint8Array<ArrayBuffer>;
}


async function waitUntil(check: () => Promise<boolean>, timeoutMs: number): Promise<number> {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    if (await check().catch(() => false)) return Date.now() - started;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`not within ${timeoutMs} ms`);
}

let engineer: TestClient;
let deviceId = 0;
let organizationId = 0;
const outcomes: { status: number; killAfterMs: number; recoveredMs: number }[] = [];

async function consistency() {
  await closeDb();
  const { sequelize } = db();
  const [row] = await sequelize.query<{ sets: number; orphanFiles: number; setsWithoutFile: number }>(
    `SELECT
       (SELECT COUNT(*) FROM measurement_sets WHERE device_id = :deviceId) AS sets,
       (SELECT COUNT(*) FROM stored_files f WHERE f.organization_id = :organizationId
          AND NOT EXISTS (SELECT 1 FROM measurement_sets s WHERE s.stored_file_id = f.id)) AS orphanFiles,
       (SELECT COUNT(*) FROM measurement_sets s WHERE s.organization_id = :organizationId
          AND NOT EXISTS (SELECT 1 FROM stored_files f WHERE f.id = s.stored_file_id)) AS setsWithoutFile`,
    { type: QueryTypes.SELECT, replacements: { deviceId, organizationId } },
  );
  return { sets: Number(row.sets), orphanFiles: Number(row.orphanFiles), setsWithoutFile: Number(row.setsWithoutFile) };
}

beforeAll(async () => {
  const made = await makeOrganization();
  organizationId = made.organization.id;
  deviceId = (await makeDevice(made.organization.id)).id;
  engineer = new TestClient();
  expect((await engineer.signIn(made.users.engineer.email, factoryPassword)).ok).toBe(true);
});

afterAll(async () => {
  await startDatabase();
  await closeDb();
  const counts = new Map<number, number>();
  if (outcomes.length === 0) return;
  for (const o of outcomes) counts.set(o.status, (counts.get(o.status) ?? 0) + 1);
  const recovery = outcomes.map((o) => o.recoveredMs).sort((a, b) => a - b);
  console.log(
    `[database faults] ${outcomes.length} kills mid-upload: ${[...counts].map(([s, n]) => `${s}×${n}`).join(", ")}; ` +
      `app serving again ${recovery[0]}–${recovery[recovery.length - 1]} ms after the restart began`,
  );
}, 60_000);

describe("MariaDB killed in the middle of an upload", () => {
  it(`loses nothing and leaves nothing half-written, ${TRIALS} trials`, async () => {
    const random = mulberry32(20261202); // the same kill moments on every run
    // One upload undisturbed, to learn how long one takes: each kill falls at a seeded moment within that time.
    const calibration = new FormData();
    calibration.set("file", new Blob([bigTrace("BFD-KILL-TIMING")]), "kill-timing.csv");
    const started = Date.now();
    expect((await engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: calibration })).status).toBe(201);
    const uploadMs = Date.now() - started;
    let expectedMaxSets = (await consistency()).sets;
    for (let trial = 0; trial < TRIALS; trial++) {
      const form = new FormData();
      form.set("file", new Blob([bigTrace(`BFD-KILL-${trial}`)]), `kill-${trial}.csv`);
      const upload = engineer.request(`/api/devices/${deviceId}/measurements`, { multipart: form });
      const killAfterMs = Math.round(random() * uploadMs);
      await new Promise((resolve) => setTimeout(resolve, killAfterMs));
      killDatabase();

      const response = await upload;
      const body = (await response.json()) as { error?: { message: string } };
      expect([201, 503], `trial ${trial}: ${JSON.stringify(body).slice(0, 200)}`).toContain(response.status);
      if (response.status === 503) expect(body.error?.message).toMatch(/cannot reach its database/);

      const whileDown = await engineer.request(`/api/devices/${deviceId}`);
      expect(whileDown.status).toBe(503);
      expect(((await whileDown.json()) as { error: { message: string } }).error.message).toMatch(/cannot reach its database/);

      const restart = startDatabase();
      const recoveredMs = await waitUntil(async () => (await engineer.request(`/api/devices/${deviceId}`)).status === 200, 60_000);
      await restart;
      outcomes.push({ status: response.status, killAfterMs, recoveredMs });

      const state = await consistency();
      expect(state.orphanFiles, `trial ${trial}: stored files without a set`).toBe(0);
      expect(state.setsWithoutFile, `trial ${trial}: sets without their file`).toBe(0);
      expect(state.sets, `trial ${trial}: more sets than uploads`).toBeLessThanOrEqual(expectedMaxSets + 1);
      if (response.status === 201) expect(state.sets).toBe(expectedMaxSets + 1);
      expectedMaxSets = state.sets;
    }
  }, 600_000);
});

type ReleaseState = { revisions: number; pdfOk: number; candidateState: string; audits: number; notices: number };

async function releaseState(deviceId: number, candidateId: number): Promise<ReleaseState> {
  await closeDb();
  const [row] = await db().sequelize.query<ReleaseState>(
    `SELECT
       (SELECT COUNT(*) FROM sheet_revisions WHERE device_id = :deviceId) AS revisions,
       (SELECT state FROM sheet_candidates WHERE id = :candidateId) AS candidateState,
       (SELECT COUNT(*) FROM audit_events WHERE action = 'sheet.released' AND subject_id IN
          (SELECT id FROM sheet_revisions WHERE device_id = :deviceId)) AS audits,
       (SELECT COUNT(*) FROM outbox_messages WHERE event_key = CONCAT('sheet-candidate:', :candidateId, ':released')) AS notices`,
    { type: QueryTypes.SELECT, replacements: { deviceId, candidateId } },
  );
  // A revision's PDF is whole when its object in the file store has the recorded size and SHA-256.
  const pdfs = await db().sequelize.query<{ pdf_key: string; pdf_sha256: string; pdf_bytes: number }>(
    "SELECT pdf_key, pdf_sha256, pdf_bytes FROM sheet_revisions WHERE device_id = :deviceId AND pdf_bytes > 0",
    { type: QueryTypes.SELECT, replacements: { deviceId } },
  );
  let pdfOk = 0;
  for (const p of pdfs) {
    const ok = await readVerified(runStore(), { key: p.pdf_key, sha256: p.pdf_sha256, sizeBytes: p.pdf_bytes }).then(() => true, () => false);
    if (ok) pdfOk++;
  }
  return { ...row, revisions: Number(row.revisions), pdfOk, audits: Number(row.audits), notices: Number(row.notices) };
}

describe("MariaDB killed in the middle of a release", () => {
  it(`leaves no revision without its PDF, candidate, audit event and notices, ${TRIALS} trials`, async () => {
    const made = await makeOrganization();
    const people = await clientsByRole(made);
    const eng = people.get("engineer")!;
    const rev = people.get("reviewer")!;
    const prepare = async () => {
      const id = await deviceWithApprovedData(made.organization.id, eng, rev);
      const candidate = await submitDraft(eng, id);
      expect((await sign(rev, candidate.id)).status).toBe(200);
      return { deviceId: id, candidateId: candidate.id };
    };
    const random = mulberry32(20261203);
    // Two undisturbed releases: the first also starts the PDF workers; the second is how long one takes.
    expect((await release(eng, (await prepare()).candidateId)).status).toBe(201);
    const timing = await prepare();
    const started = Date.now();
    expect((await release(eng, timing.candidateId)).status).toBe(201);
    const releaseMs = Date.now() - started;
    const statuses = new Map<number, number>();
    for (let trial = 0; trial < TRIALS; trial++) {
      const { deviceId: id, candidateId } = await prepare();
      const answer = release(eng, candidateId, `Trial ${trial}.`);
      await new Promise((resolve) => setTimeout(resolve, Math.round(random() * releaseMs)));
      killDatabase();
      const response = await answer;
      expect([201, 503], `trial ${trial}: ${(await response.clone().text()).slice(0, 200)}`).toContain(response.status);
      statuses.set(response.status, (statuses.get(response.status) ?? 0) + 1);
      const restart = startDatabase();
      await waitUntil(async () => (await eng.request(`/api/devices/${id}`)).status === 200, 60_000);
      await restart;

      const state = await releaseState(id, candidateId);
      const released = state.revisions === 1;
      expect(state.revisions, `trial ${trial}: at most one revision`).toBeLessThanOrEqual(1);
      expect(state.pdfOk, `trial ${trial}: every revision has its PDF and hash`).toBe(state.revisions);
      expect(state.candidateState, `trial ${trial}`).toBe(released ? "released" : "approved");
      expect(state.audits, `trial ${trial}: the audit event goes with the revision`).toBe(state.revisions);
      expect(state.notices > 0, `trial ${trial}: the notices go with the revision`).toBe(released);
      if (response.status === 201) expect(released).toBe(true);
      if (!released) expect((await release(eng, candidateId)).status, `trial ${trial}: released once the database is back`).toBe(201);
    }
    console.log(`[database faults] ${TRIALS} kills mid-release (release ≈ ${releaseMs} ms): ${[...statuses].map(([s, n]) => `${s}×${n}`).join(", ")}`);
  }, 900_000);
});
