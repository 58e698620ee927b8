import "server-only";

export type OutboxSettings = {
  /** The worker drains only rows of this lane; enqueueNotices writes "mail". */
  lane: string;
  /** Rows claimed at once. */
  batchSize: number;
  /** How long a claim holds; longer than one send can take (the worker's SMTP timeouts add up to well under it). */
  leaseMs: number;
  /** Pause between polls when the outbox had nothing due. */
  pollMs: number;
  /** Retry delay after the first failure; it doubles with every further failure … */
  retryBaseMs: number;
  /** … up to this. */
  retryCapMs: number;
};

export const defaultOutboxLane = "mail";
export const lanePattern = /^[a-z0-9][a-z0-9-]{0,39}$/;

function positiveInteger(env: Record<string, string | undefined>, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === "") return fallback;
  if (!/^\d+$/.test(raw) || Number(raw) < 1) throw new Error(`${name} must be a positive whole number, not '${raw}'`);
  return Number(raw);
}

/** The worker's settings from BENCHFOLD_OUTBOX_* variables; a malformed value stops the worker at start. */
export function readOutboxSettings(env: Record<string, string | undefined> = process.env): OutboxSettings {
  const lane = env.BENCHFOLD_OUTBOX_LANE || defaultOutboxLane;
  if (!lanePattern.test(lane)) throw new Error(`BENCHFOLD_OUTBOX_LANE must be 1–40 lower-case letters, digits and hyphens, not '${lane}'`);
  const settings = {
    lane,
    batchSize: positiveInteger(env, "BENCHFOLD_OUTBOX_BATCH", 20),
    leaseMs: positiveInteger(env, "BENCHFOLD_OUTBOX_LEASE_MS", 120_000),
    pollMs: positiveInteger(env, "BENCHFOLD_OUTBOX_POLL_MS", 1_000),
    retryBaseMs: positiveInteger(env, "BENCHFOLD_OUTBOX_RETRY_BASE_MS", 5_000),
    retryCapMs: positiveInteger(env, "BENCHFOLD_OUTBOX_RETRY_CAP_MS", 600_000),
  };
  if (settings.retryCapMs < settings.retryBaseMs) throw new Error("BENCHFOLD_OUTBOX_RETRY_CAP_MS must not be below BENCHFOLD_OUTBOX_RETRY_BASE_MS");
  return settings;
}
