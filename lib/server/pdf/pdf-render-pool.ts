import "server-only";
import os from "node:os";
import { type ResourceLimits, Worker } from "node:worker_threads";
import { AppError } from "../../errors";
import { onShutdown } from "../../shutdown";
import type { SheetModel } from "../../sheet/types";
import type { RenderReply, RenderRequest } from "./pdf-render-protocol";

export interface PdfRenderLimits {
  /** Worker threads laying out PDFs at the same time. */
  workers: number;
  /** Wall time one render may take once a worker has it, ms. */
  timeoutMs: number;
  /** V8 heap (old generation) of one worker, MB. */
  heapMb: number;
  /** Renders waiting for a worker before further ones are refused. */
  maxQueued: number;
  /**
   * A worker with nothing to do for this long is stopped, and its heap goes back to the system
   * (the next render starts one again, about two seconds); leave it out to keep workers forever.
   */
  idleMs?: number;
}

/** Starts one render worker with the given limits (the pool calls it again to replace a worker it threw away). */
export type SpawnRenderWorker = (resourceLimits: ResourceLimits) => Worker;

type Job = { id: number; model: SheetModel; resolve: (pdf: Buffer) => void; reject: (error: Error) => void };

type Slot = { worker: Worker; ready: boolean; job: Job | null; timer: NodeJS.Timeout | null; idle: NodeJS.Timeout | null; retired: boolean };

/**
 * Lays out PDFs in worker threads, one render per worker at a time, each under a time and a heap
 * limit. A render that throws, runs out of time or out of memory costs that render only: its
 * caller gets an AppError in words, the worker is terminated (with whatever state the failure left
 * in it: react-pdf's WebAssembly layout engine stays broken after it traps) and a fresh one takes
 * its place, and the renders of other sheets go on.
 */
export class PdfRenderPool {
  private readonly slots = new Set<Slot>();
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;

  constructor(
    private readonly spawn: SpawnRenderWorker,
    readonly limits: PdfRenderLimits,
  ) {}

  render(model: SheetModel): Promise<Buffer> {
    if (this.closed) return Promise.reject(new AppError("unavailable", "The PDF renderer is shutting down; try again in a moment."));
    if (this.queue.length >= this.limits.maxQueued) {
      return Promise.reject(new AppError("unavailable", "Too many PDFs are being laid out right now; try again in a minute.", { pdf: "busy" }));
    }
    return new Promise<Buffer>((resolve, reject) => {
      this.queue.push({ id: this.nextId++, model, resolve, reject });
      this.pump();
    });
  }

  /** Workers alive now (started or starting): for tests and the bench. */
  get workerCount(): number {
    return this.slots.size;
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) job.reject(new AppError("unavailable", "The PDF renderer is shutting down; try again in a moment."));
    await Promise.all([...this.slots].map((slot) => this.retire(slot, { replace: false })));
  }

  private pump(): void {
    for (const slot of this.slots) {
      if (slot.ready && !slot.job && !slot.retired) {
        if (this.queue.length > 0) this.dispatch(slot, this.queue.shift()!);
        else this.armIdle(slot);
      }
    }
    const starting = [...this.slots].filter((slot) => !slot.ready).length;
    for (let waiting = this.queue.length - starting; waiting > 0 && this.slots.size < this.limits.workers; waiting--) this.start();
  }

  private start(): void {
    let worker: Worker;
    try {
      worker = this.spawn({ maxOldGenerationSizeMb: this.limits.heapMb });
    } catch (error) {
      console.error("[benchfold] PDF render worker could not be started", error);
      if (this.slots.size === 0) this.refuseWaiting();
      return;
    }
    // An idle pool must not keep a script or a test run alive; a server stays up for its own reasons.
    worker.unref();
    const slot: Slot = { worker, ready: false, job: null, timer: null, idle: null, retired: false };
    this.slots.add(slot);
    worker.on("message", (reply: RenderReply) => this.onReply(slot, reply));
    worker.on("error", (error) => this.onFailure(slot, error));
    worker.on("exit", (code) => this.onFailure(slot, new Error(`The render worker exited with code ${code}.`)));
  }

  /** Stops a worker that stays without work for `idleMs` (its memory is returned); the next render starts one. */
  private armIdle(slot: Slot): void {
    if (this.limits.idleMs === undefined || slot.idle) return;
    slot.idle = setTimeout(() => {
      slot.idle = null;
      if (!slot.job && !slot.retired) void this.retire(slot, { replace: false });
    }, this.limits.idleMs);
    slot.idle.unref();
  }

  private dispatch(slot: Slot, job: Job): void {
    if (slot.idle) clearTimeout(slot.idle);
    slot.idle = null;
    slot.job = job;
    slot.timer = setTimeout(() => {
      slot.job = null;
      console.error(`[benchfold] PDF render of ${describe(job.model)} stopped after ${this.limits.timeoutMs} ms`);
      job.reject(
        new AppError(
          "unavailable",
          `The PDF of this sheet took longer than ${formatSeconds(this.limits.timeoutMs)} to lay out and was stopped. Other sheets are not affected; the web sheet shows the same content.`,
          { pdf: "time-limit", limitMs: this.limits.timeoutMs },
        ),
      );
      void this.retire(slot, { replace: true });
    }, this.limits.timeoutMs);
    try {
      slot.worker.postMessage({ id: job.id, model: job.model } satisfies RenderRequest);
    } catch (error) {
      clearTimeout(slot.timer);
      slot.timer = null;
      slot.job = null;
      console.error(`[benchfold] PDF render of ${describe(job.model)} could not be handed to a worker`, error);
      job.reject(renderFailed());
      this.pump();
    }
  }

  private onReply(slot: Slot, reply: RenderReply): void {
    if (slot.retired) return;
    if ("ready" in reply) {
      slot.ready = true;
      this.pump();
      return;
    }
    const job = slot.job;
    if (!job || job.id !== reply.id) return;
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    slot.job = null;
    if (reply.ok) {
      job.resolve(Buffer.from(reply.pdf.buffer, reply.pdf.byteOffset, reply.pdf.byteLength));
      this.pump();
      return;
    }
    console.error(`[benchfold] PDF render of ${describe(job.model)} failed: ${reply.message}`);
    job.reject(renderFailed());
    void this.retire(slot, { replace: true });
  }

  /** The worker died: an uncaught error, its heap limit, or an exit nobody asked for. */
  private onFailure(slot: Slot, error: Error): void {
    if (slot.retired) return;
    const job = slot.job;
    const outOfMemory = (error as { code?: string }).code === "ERR_WORKER_OUT_OF_MEMORY";
    slot.job = null;
    console.error(`[benchfold] PDF render worker failed${job ? ` while rendering ${describe(job.model)}` : ""}: ${error.message}`);
    if (job) {
      job.reject(
        outOfMemory
          ? new AppError(
              "unavailable",
              `The PDF of this sheet needed more than ${this.limits.heapMb} MB to lay out and was stopped. Other sheets are not affected; the web sheet shows the same content.`,
              { pdf: "memory-limit", limitMb: this.limits.heapMb },
            )
          : renderFailed(),
      );
    }
    // A worker that never became ready cannot render anything: say so to whoever waits instead of
    // starting workers in a loop.
    const replace = slot.ready;
    void this.retire(slot, { replace });
    if (!replace && this.slots.size === 0) this.refuseWaiting();
  }

  private refuseWaiting(): void {
    for (const waiting of this.queue.splice(0)) waiting.reject(new AppError("internal", "The PDF renderer could not start; the web sheet is not affected.", { pdf: "no-renderer" }));
  }

  private async retire(slot: Slot, opts: { replace: boolean }): Promise<void> {
    if (slot.retired) return;
    slot.retired = true;
    if (slot.timer) clearTimeout(slot.timer);
    if (slot.idle) clearTimeout(slot.idle);
    // Only close() retires a worker in the middle of a render; every failure has answered its render already.
    slot.job?.reject(new AppError("unavailable", "The PDF renderer is shutting down; try again in a moment."));
    slot.job = null;
    this.slots.delete(slot);
    const stopped = slot.worker.terminate();
    // The replacement starts now, so the next render finds a loaded worker.
    if (opts.replace && !this.closed) {
      this.start();
      this.pump();
    }
    await stopped;
  }
}

function renderFailed(): AppError {
  return new AppError(
    "internal",
    "The PDF of this sheet could not be laid out. Other sheets are not affected, and the web sheet shows the same content; shorter, simpler prose sections may help.",
    { pdf: "render-failed" },
  );
}

function describe(model: SheetModel): string {
  return `${model.header?.organizationName ?? "?"} / ${model.header?.partNumber ?? "?"}`;
}

function formatSeconds(ms: number): string {
  return `${Number((ms / 1000).toPrecision(3))} s`;
}

function readPositive(name: string, fallback: number): number {
  const value = Number(process.env[name]);
  return Number.isFinite(value) && value > 0 ? value : fallback;
}

/** The pool's limits from the environment (see DEVELOPERS.md), with defaults for a small server. */
export function pdfRenderLimitsFromEnv(): PdfRenderLimits {
  return {
    // One core stays with the web server.
    workers: Math.floor(readPositive("BENCHFOLD_PDF_WORKERS", Math.max(1, Math.min(2, os.availableParallelism() - 1)))),
    timeoutMs: readPositive("BENCHFOLD_PDF_TIMEOUT_MS", 60_000),
    heapMb: readPositive("BENCHFOLD_PDF_HEAP_MB", 512),
    maxQueued: Math.floor(readPositive("BENCHFOLD_PDF_QUEUE", 32)),
    idleMs: readPositive("BENCHFOLD_PDF_IDLE_MS", 10 * 60_000),
  };
}

// `new Worker(new URL(…, import.meta.url))` written out in full: the bundler sees it, builds the
// worker file with the same code as the app, and points the URL at the built file.
function spawnRenderWorker(resourceLimits: ResourceLimits): Worker {
  return new Worker(new URL("./pdf-render-worker.ts", import.meta.url), { resourceLimits });
}

const POOL = Symbol.for("benchfold.pdf-render-pool");

/**
 * The server's one pool, shared by every bundled copy of this module. In development a copy
 * reloaded after an edit brings a rebuilt worker file, so its pool replaces the one before.
 */
export function sheetPdfRenderPool(): PdfRenderPool {
  const holder = globalThis as { [POOL]?: { pool: PdfRenderPool; spawn: SpawnRenderWorker; forget: () => void } };
  const held = holder[POOL];
  if (held && (held.spawn === spawnRenderWorker || process.env.NODE_ENV === "production")) return held.pool;
  if (held) {
    held.forget();
    void held.pool.close();
  }
  const pool = new PdfRenderPool(spawnRenderWorker, pdfRenderLimitsFromEnv());
  // The app server stops the workers on SIGTERM, after the requests in flight (lib/shutdown.ts).
  holder[POOL] = { pool, spawn: spawnRenderWorker, forget: onShutdown("PDF render workers", () => pool.close()) };
  return pool;
}
