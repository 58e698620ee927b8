import "server-only";
import { isShuttingDown } from "@/lib/shutdown";
import { probeDatabase, probeMailRelay, probeStorage, ReadinessFailure } from "./readiness-checks";

export const readinessCheckNames = ["database", "storage", "mail"] as const;
export type ReadinessCheckName = (typeof readinessCheckNames)[number];

export type ReadinessCheck = { status: "ok" | "failing"; ms: number; message?: string };

export type Readiness = {
  status: "ready" | "not-ready" | "stopping";
  /** What is not ready, by name: a check, or "instance" while this instance shuts down. */
  notReady: (ReadinessCheckName | "instance")[];
  checks: Partial<Record<ReadinessCheckName, ReadinessCheck>>;
  note: string;
};

export type ReadinessProbes = Record<ReadinessCheckName, (timeoutMs: number) => Promise<void>>;

const defaultProbes: ReadinessProbes = { database: probeDatabase, storage: probeStorage, mail: probeMailRelay };

const storageNote = "Stored files (bench files, released PDFs, drawings) are kept in an S3-compatible object store; the storage check asks for its bucket.";

/** BENCHFOLD_READY_TIMEOUT_MS (2000): how long each check may take; the checks run at once. */
export function readinessTimeoutMs(env: Record<string, string | undefined> = process.env): number {
  const value = Number(env.BENCHFOLD_READY_TIMEOUT_MS);
  return Number.isInteger(value) && value > 0 ? value : 2_000;
}

async function runCheck(name: ReadinessCheckName, probe: (timeoutMs: number) => Promise<void>, timeoutMs: number): Promise<ReadinessCheck> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  const limit = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new ReadinessFailure(`No answer within ${timeoutMs} ms.`)), timeoutMs);
  });
  try {
    await Promise.race([probe(timeoutMs), limit]);
    noteOutcome(name, null);
    return { status: "ok", ms: Math.round(performance.now() - started) };
  } catch (error) {
    const failure = error instanceof ReadinessFailure ? error : new ReadinessFailure(`The ${name} check failed.`, error);
    noteOutcome(name, failure.detail);
    return { status: "failing", ms: Math.round(performance.now() - started), message: failure.message };
  } finally {
    clearTimeout(timer);
  }
}

const lastFailure = new Map<ReadinessCheckName, string | null>();

/** Logs a check's failure once when it starts (or its reason changes) and once when it recovers, not on every probe. */
function noteOutcome(name: ReadinessCheckName, detail: string | null): void {
  const before = lastFailure.get(name) ?? null;
  if (before === detail) return;
  lastFailure.set(name, detail);
  if (detail === null) console.log(`[benchfold] readiness: ${name} ok again`);
  else console.error(`[benchfold] readiness: ${name} failing: ${detail}`);
}

let shared: { at: number; answer: Promise<Readiness> } | null = null;

/**
 * Whether this app instance should get traffic: the database, the file storage and the mail relay
 * each answered within the time limit, and the instance is not shutting down (then it answers at
 * once, without checks). Concurrent callers, and callers within `reuseMs` of the last run, share
 * one run of the checks, so a flood of probes cannot multiply connections to the database or the
 * relay; the shutdown state is read on every call.
 */
export async function checkReadiness(options: { probes?: ReadinessProbes; timeoutMs?: number; reuseMs?: number } = {}): Promise<Readiness> {
  if (isShuttingDown()) {
    return { status: "stopping", notReady: ["instance"], checks: {}, note: "This instance is shutting down and finishes only the requests it already has." };
  }
  const { probes = defaultProbes, timeoutMs = readinessTimeoutMs(), reuseMs = 1_000 } = options;
  const now = Date.now();
  if (shared && now - shared.at < reuseMs && options.probes === undefined) return shared.answer;
  const answer = (async (): Promise<Readiness> => {
    const results = await Promise.all(readinessCheckNames.map(async (name) => [name, await runCheck(name, probes[name], timeoutMs)] as const));
    const checks = Object.fromEntries(results) as Record<ReadinessCheckName, ReadinessCheck>;
    const notReady = readinessCheckNames.filter((name) => checks[name].status !== "ok");
    return { status: notReady.length === 0 ? "ready" : "not-ready", notReady, checks, note: storageNote };
  })();
  if (options.probes === undefined) shared = { at: now, answer };
  return answer;
}
