/**
 * Release benchmark (run by `npm run bench`, not by `npm test`): the invented bench doubler of
 * fixtures/sheets (43 table rows, 6 charts, 59 measurement sets) is put in the database as a
 * device of a throwaway organization, then submitted, signed and released with the server's own
 * functions, several times (a changed device description makes each run a new sheet). Printed:
 * submission (the freeze: candidate model built from MariaDB, digest, insert) and release end
 * to end, with the parts of the release: the freshness rebuild of the model, the PDF render
 * through the worker pool, SHA-256 of the bytes, and the rest (letter, frozen JSON, PDF row,
 * notes, audit and notices, commit); beside one PDF render of the same model as the reference
 * measured in the same process. Nothing is asserted on time.
 *
 * Needs MariaDB (`npm run db:start`) with a migrated benchfold_test (one `npm test` run; DB_NAME
 * picks another); skipped with a note otherwise. BENCH_RELEASE_RUNS (3).
 */
import { createHash, randomBytes } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { Worker } from "node:worker_threads";
import { expect, it, vi } from "vitest";
import { ensureBenchStore } from "./bench-store";
import type { SheetInput, SheetModel } from "@/lib/sheet";

vi.mock("server-only", () => ({}));

/** What the server's functions spent in the model build and the PDF render, recorded as they run. */
const spent = vi.hoisted(() => ({ modelMs: [] as number[], pdfMs: [] as number[], pool: null as null | { render: (m: SheetModel) => Promise<Buffer> } }));

vi.mock("@/lib/server/reviews/candidate-model", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/server/reviews/candidate-model")>();
  return {
    ...actual,
    buildCandidateModel: async (opts: Parameters<typeof actual.buildCandidateModel>[0]) => {
      const t0 = performance.now();
      const frozen = await actual.buildCandidateModel(opts);
      spent.modelMs.push(performance.now() - t0);
      return frozen;
    },
  };
});

vi.mock("@/lib/server/pdf/pdf-render-pool", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/server/pdf/pdf-render-pool")>();
  const timed = {
    render: async (model: SheetModel) => {
      const t0 = performance.now();
      const pdf = await spent.pool!.render(model);
      spent.pdfMs.push(performance.now() - t0);
      return pdf;
    },
  };
  return { ...actual, sheetPdfRenderPool: () => timed };
});

const runs = Number(process.env.BENCH_RELEASE_RUNS ?? 3);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const password = "release bench password, never used elsewhere";

/** The bench doubler as rows of a new organization: device, instruments, approved sets, limits, prose. */
async function storeBenchDevice(input: SheetInput) {
  const { db } = await import("@/models");
  const { Organization, User, Device, Instrument, StoredFile, MeasurementSet, MeasurementSetInstrument, SpecLimit, SheetContent } = db();
  const { hashPassword } = await import("@/lib/server/accounts/hash-password");
  const tag = randomBytes(4).toString("hex");
  const organization = await Organization.create({ slug: `release-bench-${tag}`, name: `Release Bench ${tag}`, kind: "vendor" });
  const passwordHash = await hashPassword(password);
  const person = (role: "engineer" | "reviewer") =>
    User.create({ organizationId: organization.id, email: `${role}-${tag}@release-bench.example`, name: `Bench ${role}`, role, passwordHash });
  const [engineer, reviewer] = [await person("engineer"), await person("reviewer")];
  const { organizationName: _name, ...fields } = input.device;
  const device = await Device.create({ ...fields, organizationId: organization.id, createdById: engineer.id } as never);
  const file = await StoredFile.create({ organizationId: organization.id, sha256: "0".repeat(64), sizeBytes: 1, originalName: "bench.csv", contentType: "text/csv", storageKey: "sha256/00/placeholder-never-read" });
  const instrumentIds = new Map<string, number>();
  for (const set of input.approvedSets) {
    const created = await MeasurementSet.create({
      organizationId: organization.id, deviceId: device.id, storedFileId: file.id, sha256: createHash("sha256").update(`${tag}-${set.id}`).digest("hex"), kind: set.kind,
      state: "approved", supersedesId: null, conditions: { serial: set.serial, lot: set.lot, temperatureC: set.temperatureC }, parsed: {}, parameters: set.parameters,
      curves: set.curves, warnings: [], measuredOn: set.measuredOn, source: "browser", uploadedById: engineer.id, benchTokenId: null,
    } as never);
    for (const i of set.instruments) {
      if (!instrumentIds.has(i.serial)) instrumentIds.set(i.serial, (await Instrument.create({ ...i, organizationId: organization.id } as never)).id);
      await MeasurementSetInstrument.create({ measurementSetId: created.id, instrumentId: instrumentIds.get(i.serial)!, calibrationLapsed: false });
    }
  }
  for (const limit of input.limits) await SpecLimit.create({ ...limit, organizationId: organization.id, deviceId: device.id } as never);
  await SheetContent.create({ organizationId: organization.id, deviceId: device.id, prose: input.prose, absoluteMaximumRatings: input.absoluteMaximumRatings, measurementUncertainty: input.settings.measurementUncertainty ?? {} });
  const session = (u: typeof engineer) => ({ id: u.id, email: u.email, name: u.name, role: u.role, organizationId: organization.id, organizationName: organization.name, organizationKind: "vendor" as const });
  return { device, engineer: session(engineer), reviewer: session(reviewer) };
}

type Run = { rows: number; charts: number; submitMs: number; freezeMs: number; signMs: number; releaseMs: number; freshnessMs: number; pdfMs: number; hashMs: number; referencePdfMs: number; pdfKb: number };

/** One submission, signature and release of the bench device as it stands, timed in parts. */
async function releaseOnce(bench: Awaited<ReturnType<typeof storeBenchDevice>>, round: number): Promise<Run> {
  const { db } = await import("@/models");
  const { buildCandidateModel } = await import("@/lib/server/reviews/candidate-model");
  const { submitSheet } = await import("@/lib/server/reviews/submit-sheet");
  const { decideCandidate } = await import("@/lib/server/reviews/decide-candidate");
  const { releaseCandidate } = await import("@/lib/server/reviews/release-candidate");
  const { Device, SheetRevision } = db();
  const deviceId = bench.device.id;
  // A new description is a new sheet, so every round has something to release.
  await Device.update({ description: `${bench.device.description} (release bench round ${round})` }, { where: { id: deviceId } });
  const { model } = await buildCandidateModel({ organizationId: bench.engineer.organizationId, deviceId, date: new Date().toISOString().slice(0, 10) });
  const acknowledgements = model.issues.map((i) => ({ issue: i.message, reason: "The bench sheet stands as the fixture states it." }));
  spent.modelMs.length = 0;
  spent.pdfMs.length = 0;

  let t0 = performance.now();
  const candidate = await submitSheet({ engineer: bench.engineer, deviceId, body: { acknowledgements, note: "" } });
  const submitMs = performance.now() - t0;
  const freezeMs = spent.modelMs.splice(0).reduce((a, b) => a + b, 0);
  t0 = performance.now();
  await decideCandidate({ reviewer: bench.reviewer, candidateId: candidate.id, body: { decision: "approve", meaning: "approved-for-release", password }, clientAddress: "198.18.0.1" });
  const signMs = performance.now() - t0;
  spent.modelMs.length = 0;
  t0 = performance.now();
  const revision = await releaseCandidate({ engineer: bench.engineer, candidateId: candidate.id, body: { note: "" } });
  const releaseMs = performance.now() - t0;
  const freshnessMs = spent.modelMs.splice(0).reduce((a, b) => a + b, 0);
  const pdfMs = spent.pdfMs.splice(0).reduce((a, b) => a + b, 0);

  const stored = (await SheetRevision.unscoped().findByPk(revision.id, { attributes: ["pdfKey", "modelJson", "pdfSha256"] }))!;
  const { objectStore } = await import("@/lib/server/storage/stored-objects");
  const pdf = await objectStore().get(stored.pdfKey);
  t0 = performance.now();
  const sha = createHash("sha256").update(pdf).digest("hex");
  const hashMs = performance.now() - t0;
  expect(sha).toBe(stored.pdfSha256);
  // The reference, in the same process: one more render of the released model through the same pool.
  t0 = performance.now();
  await spent.pool!.render(JSON.parse(stored.modelJson) as SheetModel);
  const referencePdfMs = performance.now() - t0;
  const released = JSON.parse(stored.modelJson) as SheetModel;
  return { rows: released.specifications.rows.length, charts: released.charts.length, submitMs, freezeMs, signMs, releaseMs, freshnessMs, pdfMs, hashMs, referencePdfMs, pdfKb: pdf.length / 1024 };
}

it("times the release of the bench doubler sheet", { timeout: 900_000 }, async () => {
  process.env.DB_NAME ??= "benchfold_test";
  const { db, closeDb } = await import("@/models");
  try {
    await db().sequelize.authenticate();
    await db().SheetRevision.count();
  } catch (error) {
    console.log(`release benchmark skipped: no migrated database ${process.env.DB_NAME} (${(error as Error).message.split("\n")[0]}); run npm run db:start, and npm test once`);
    await closeDb();
    return;
  }
  // The release writes its PDF to the object store: the configured one, or a local fake.
  const benchStore = await ensureBenchStore();
  const { PdfRenderPool } = await import("@/lib/server/pdf/pdf-render-pool");
  const { buildRenderWorkerForNode } = await import("../../tests/unit/pdf/workers/build-render-worker");
  const workerFile = await buildRenderWorkerForNode();
  const pool = new PdfRenderPool((resourceLimits) => new Worker(workerFile, { resourceLimits }), { workers: 1, timeoutMs: 600_000, heapMb: 512, maxQueued: 4 });
  spent.pool = pool;
  try {
    const input = JSON.parse(readFileSync(path.resolve(__dirname, "../../fixtures/sheets/doubler-full.json"), "utf8")) as SheetInput;
    const bench = await storeBenchDevice(input);
    const all: Run[] = [];
    for (let round = 0; round <= runs; round++) all.push(await releaseOnce(bench, round));
    printRelease(all, input);
  } finally {
    await pool.close();
    await closeDb();
    await benchStore.stop();
  }
});

function printRelease(all: Run[], input: SheetInput) {
  const [cold, ...warm] = all;
  const column = (pick: (r: Run) => number) => [pick(cold), median(warm.map(pick))];
  const rows: [string, (r: Run) => number][] = [
    ["submit (freeze)", (r) => r.submitMs],
    ["  of which the model", (r) => r.freezeMs],
    ["sign (password, fresh)", (r) => r.signMs],
    ["release, end to end", (r) => r.releaseMs],
    ["  freshness rebuild", (r) => r.freshnessMs],
    ["  PDF (worker pool)", (r) => r.pdfMs],
    ["  SHA-256 of the PDF", (r) => r.hashMs],
    ["  transaction and rest", (r) => r.releaseMs - r.freshnessMs - r.pdfMs - r.hashMs],
    ["reference: one PDF", (r) => r.referencePdfMs],
  ];
  console.log(`\nRelease of the bench doubler (${cold.rows} spec rows, ${cold.charts} charts, ${input.approvedSets.length} measurement sets; PDF ${warm[0].pdfKb.toFixed(0)} kB): the first round (cold), then the median of ${warm.length}`);
  console.log(`${"step".padEnd(26)} ${"cold".padStart(9)} ${"warm median".padStart(12)}`);
  for (const [name, pick] of rows) {
    const [c, w] = column(pick);
    console.log(`${name.padEnd(26)} ${c.toFixed(1).padStart(6)} ms ${w.toFixed(1).padStart(9)} ms`);
  }
  const release = median(warm.map((r) => r.releaseMs));
  const reference = median(warm.map((r) => r.referencePdfMs));
  console.log(`release ÷ one PDF render of the same model: ${(release / reference).toFixed(2)}×; submit + sign + release: ${(median(warm.map((r) => r.submitMs + r.signMs + r.releaseMs)) / 1000).toFixed(2)} s; aim: release under 2 s`);
}
