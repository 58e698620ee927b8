/**
 * How long a notice waits before its next delivery attempt after `failedAttempts` failures
 * (1 or more): capped exponential backoff, base · 2^(failures − 1), never more than the cap
 * (with the defaults 5 s, 10 s, 20 s, … 320 s, then 10 min for every later attempt).
 * No jitter: a worker sends one row at a time, so rows that fall due together (after an outage)
 * still reach the relay one after another.
 */
export function outboxRetryDelayMs(failedAttempts: number, settings: { retryBaseMs: number; retryCapMs: number }): number {
  if (!Number.isInteger(failedAttempts) || failedAttempts < 1) throw new RangeError(`failedAttempts must be a whole number from 1, not ${failedAttempts}`);
  // Compare exponents rather than computing 2^n, which overflows to Infinity for a long outage.
  const doublings = failedAttempts - 1;
  if (doublings >= 1024 || settings.retryBaseMs * 2 ** doublings >= settings.retryCapMs) return settings.retryCapMs;
  return settings.retryBaseMs * 2 ** doublings;
}
