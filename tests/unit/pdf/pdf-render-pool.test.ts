import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { afterEach, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { AppError } from "@/lib/errors";
import { buildSheetModel, type ProseBlock, type SheetModel } from "@/lib/sheet";
import { type PdfRenderLimits, PdfRenderPool } from "@/lib/server/pdf/pdf-render-pool";
import { loadDoublerInput } from "../sheet/fixture";
import { buildRenderWorkerForNode } from "./workers/build-render-worker";

const standIn = path.resolve(__dirname, "workers/behaving-worker.mjs");
const limits: PdfRenderLimits = { workers: 1, timeoutMs: 60_000, heapMb: 256, maxQueued: 8 };

const pools: PdfRenderPool[] = [];
function standInPool(overrides: Partial<PdfRenderLimits> = {}): PdfRenderPool {
  const pool = new PdfRenderPool((resourceLimits) => new Worker(standIn, { resourceLimits }), { ...limits, ...overrides });
  pools.push(pool);
  return pool;
}
afterEach(async () => {
  await Promise.all(pools.splice(0).map((pool) => pool.close()));
});

const ask = (behaviour: Record<string, unknown>) => behaviour as unknown as SheetModel;

async function refusal(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

/** Sends one request to a worker and waits for its answer (after the worker says it is ready). */
function ask1(worker: Worker, id: number, model: unknown): Promise<{ ok: boolean }> {
  return new Promise((resolve) => {
    const onMessage = (reply: { id?: number; ok: boolean }) => {
      if (reply.id !== id) return;
      worker.off("message", onMessage);
      resolve(reply);
    };
    worker.on("message", onMessage);
    worker.postMessage({ id, model });
  });
}

describe("why one sheet's PDF broke every later PDF of the process", () => {
  it("react-pdf's layout engine (yoga, WebAssembly) traps on a deep enough tree and then fails every later layout, however small", async () => {
    const worker = new Worker(standIn);
    await new Promise((resolve) => worker.once("message", resolve));
    try {
      expect((await ask1(worker, 1, { depth: 3 })).ok).toBe(true);
      expect((await ask1(worker, 2, { depth: 2000 })).ok).toBe(false);
      expect((await ask1(worker, 3, { depth: 3 })).ok).toBe(false);
    } finally {
      await worker.terminate();
    }
  });
});

describe("PdfRenderPool", () => {
  it("stops a worker that stays idle past idleMs, and starts one again for the next render", async () => {
    const pool = standInPool({ idleMs: 200 });
    expect((await pool.render(ask({ depth: 3 }))).toString()).toBe("%PDF-stand-in 500");
    expect(pool.workerCount).toBe(1);
    await new Promise((resolve) => setTimeout(resolve, 600));
    expect(pool.workerCount).toBe(0);
    expect((await pool.render(ask({ depth: 3 }))).toString()).toBe("%PDF-stand-in 500");
    expect(pool.workerCount).toBe(1);
  });

  it("keeps a busy worker however long the render takes, and keeps workers forever without idleMs", async () => {
    const busy = standInPool({ idleMs: 100 });
    const long = busy.render(ask({ behave: "slow", ms: 400 }));
    await new Promise((resolve) => setTimeout(resolve, 250));
    expect(busy.workerCount).toBe(1);
    await long.catch(() => undefined);
    const forever = standInPool();
    await forever.render(ask({ depth: 3 }));
    await new Promise((resolve) => setTimeout(resolve, 400));
    expect(forever.workerCount).toBe(1);
  });

  it("a render that breaks its worker's layout engine costs that render only: a fresh worker takes the next", async () => {
    const pool = standInPool();
    const broken = await refusal(pool.render(ask({ depth: 2000 })));
    expect(broken.code).toBe("internal");
    expect(broken.details).toMatchObject({ pdf: "render-failed" });
    expect(broken.message).toMatch(/could not be laid out\. Other sheets are not affected/);
    const next = await pool.render(ask({ depth: 3 }));
    expect(next.toString()).toBe("%PDF-stand-in 500");
  });

  it("stops a render that runs past the time limit, answers 503 in words, and renders the next sheet", async () => {
    const pool = standInPool({ timeoutMs: 300 });
    const stopped = await refusal(pool.render(ask({ behave: "hang" })));
    expect(stopped.status).toBe(503);
    expect(stopped.details).toMatchObject({ pdf: "time-limit", limitMs: 300 });
    expect(stopped.message).toMatch(/took longer than 0\.3 s to lay out and was stopped/);
    expect((await pool.render(ask({ depth: 3 }))).toString()).toMatch(/^%PDF-/);
  });

  it("stops a render that outgrows the heap limit, answers 503 in words, and renders the next sheet", async () => {
    const pool = standInPool({ heapMb: 24 });
    const stopped = await refusal(pool.render(ask({ behave: "fill-heap" })));
    expect(stopped.status).toBe(503);
    expect(stopped.details).toMatchObject({ pdf: "memory-limit", limitMb: 24 });
    expect(stopped.message).toMatch(/needed more than 24 MB/);
    expect((await pool.render(ask({ depth: 3 }))).toString()).toMatch(/^%PDF-/);
  });

  it("a worker that exits mid-render fails that render only", async () => {
    const pool = standInPool();
    expect((await refusal(pool.render(ask({ behave: "exit" })))).code).toBe("internal");
    expect((await pool.render(ask({ depth: 3 }))).toString()).toMatch(/^%PDF-/);
  });

  it("other sheets render while one runs away on another worker", { timeout: 60_000 }, async () => {
    const pool = standInPool({ workers: 2 });
    let runawaySettled = false;
    const runaway = pool.render(ask({ behave: "hang" })).finally(() => (runawaySettled = true));
    runaway.catch(() => undefined);
    const others = await Promise.all([1, 2, 3, 4].map(() => pool.render(ask({ depth: 3 }))));
    expect(others.map((pdf) => pdf.toString())).toEqual(Array(4).fill("%PDF-stand-in 500"));
    expect(runawaySettled).toBe(false);
    expect(pool.workerCount).toBe(2);
    await pool.close();
    expect((await refusal(runaway)).code).toBe("unavailable");
  });

  it("refuses renders beyond its queue with 503 instead of piling them up", async () => {
    const pool = standInPool({ maxQueued: 1 });
    await pool.render(ask({ depth: 3 }));
    // The worker is ready and idle: the runaway gets it at once, the next waits, the one after has no place.
    const runaway = pool.render(ask({ behave: "hang" }));
    const waiting = pool.render(ask({ depth: 3 }));
    for (const p of [runaway, waiting]) p.catch(() => undefined);
    const busy = await refusal(pool.render(ask({ depth: 3 })));
    expect(busy.status).toBe(503);
    expect(busy.details).toMatchObject({ pdf: "busy" });
    expect(busy.message).toMatch(/Too many PDFs/);
  });

  it("says so when its worker cannot start, and does not start workers in a loop", async () => {
    let spawned = 0;
    const pool = new PdfRenderPool(() => {
      spawned++;
      return new Worker("throw new Error('no renderer here')", { eval: true });
    }, limits);
    pools.push(pool);
    const refused = await refusal(pool.render(ask({ depth: 3 })));
    expect(refused.code).toBe("internal");
    expect(refused.message).toMatch(/could not start/);
    expect(spawned).toBe(1);
    expect(pool.workerCount).toBe(0);
    const unstartable = new PdfRenderPool(() => {
      throw new Error("no worker file");
    }, limits);
    pools.push(unstartable);
    expect((await refusal(unstartable.render(ask({ depth: 3 })))).message).toMatch(/could not start/);
  });
});

describe("PdfRenderPool with the real render worker", () => {
  it("renders the sheet, isolates a model that fails, and renders the next sheet", { timeout: 300_000 }, async () => {
    const file = await buildRenderWorkerForNode();
    const pool = new PdfRenderPool((resourceLimits) => new Worker(file, { resourceLimits }), { ...limits, timeoutMs: 240_000, heapMb: 512 });
    pools.push(pool);
    const model = buildSheetModel(loadDoublerInput());

    // Prose nested 1,000 levels deep, put into a model by hand (renderProse would never make it):
    // the renderer draws it only down to the prose limit.
    let deep: ProseBlock[] = [{ type: "paragraph", children: [{ type: "text", value: "at the bottom" }] }];
    for (let i = 0; i < 1000; i++) deep = [{ type: "quote", children: deep }];
    const hostile = structuredClone(model);
    hostile.prose[0].blocks = deep;
    const hostileText = pdfText(await pool.render(hostile));
    expect(hostileText).toContain("nested too deeply to show");
    expect(hostileText).not.toContain("at the bottom");

    const headless = { ...model, header: undefined } as unknown as SheetModel;
    expect((await refusal(pool.render(headless))).code).toBe("internal");

    const text = pdfText(await pool.render(model));
    expect(text).toContain(model.header.partNumber);
    expect(text).toContain(model.specifications.rows[0].typ.text);
  });
});

function pdfText(pdf: Buffer): string {
  expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  const file = path.join(mkdtempSync(path.join(tmpdir(), "benchfold-pool-")), "sheet.pdf");
  writeFileSync(file, pdf);
  // poppler reads the PDF independently of the renderer that wrote it.
  return execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
}
