import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const { outboxRetryDelayMs } = await import("@/lib/server/outbox/retry-delay");
const { readOutboxSettings } = await import("@/lib/server/outbox/outbox-settings");

const defaults = { retryBaseMs: 5_000, retryCapMs: 600_000 };

describe("outboxRetryDelayMs", () => {
  // Capped exponential backoff, sleep = min(cap, base · 2^attempt) as in the AWS Architecture
  // Blog's "Exponential Backoff And Jitter" (2015), counted from the first failure (attempt 0).
  // The figures are worked out by hand: 5 s · 2^(n−1), and 5 s · 2^7 = 640 s is over the 600 s cap.
  it.each([
    [1, 5_000],
    [2, 10_000],
    [3, 20_000],
    [4, 40_000],
    [5, 80_000],
    [6, 160_000],
    [7, 320_000],
    [8, 600_000],
    [9, 600_000],
    [50, 600_000],
    [5_000, 600_000],
  ])("after %i failures waits %i ms", (failures, expectedMs) => {
    expect(outboxRetryDelayMs(failures, defaults)).toBe(expectedMs);
  });

  it("stays finite for an outage of any length", () => {
    expect(outboxRetryDelayMs(Number.MAX_SAFE_INTEGER, defaults)).toBe(600_000);
  });

  it("never goes down as failures grow", () => {
    let previous = 0;
    for (let failures = 1; failures <= 40; failures++) {
      const delay = outboxRetryDelayMs(failures, { retryBaseMs: 300, retryCapMs: 45_000 });
      expect(delay).toBeGreaterThanOrEqual(previous);
      expect(delay).toBeLessThanOrEqual(45_000);
      previous = delay;
    }
  });

  it.each([0, -1, 1.5, Number.NaN])("refuses %s failures", (failures) => {
    expect(() => outboxRetryDelayMs(failures, defaults)).toThrow(RangeError);
  });
});

describe("readOutboxSettings", () => {
  it("defaults to the mail lane, 20 a batch, a 2-minute lease, a 1 s poll and 5 s … 10 min retries", () => {
    expect(readOutboxSettings({})).toEqual({ lane: "mail", batchSize: 20, leaseMs: 120_000, pollMs: 1_000, retryBaseMs: 5_000, retryCapMs: 600_000 });
  });

  it("reads every BENCHFOLD_OUTBOX_* variable", () => {
    const env = {
      BENCHFOLD_OUTBOX_LANE: "fault-test-1",
      BENCHFOLD_OUTBOX_BATCH: "5",
      BENCHFOLD_OUTBOX_LEASE_MS: "3000",
      BENCHFOLD_OUTBOX_POLL_MS: "50",
      BENCHFOLD_OUTBOX_RETRY_BASE_MS: "100",
      BENCHFOLD_OUTBOX_RETRY_CAP_MS: "400",
    };
    expect(readOutboxSettings(env)).toEqual({ lane: "fault-test-1", batchSize: 5, leaseMs: 3000, pollMs: 50, retryBaseMs: 100, retryCapMs: 400 });
  });

  it.each([
    ["BENCHFOLD_OUTBOX_LANE", "Mail"],
    ["BENCHFOLD_OUTBOX_LANE", "mail lane"],
    ["BENCHFOLD_OUTBOX_LANE", "x".repeat(41)],
    ["BENCHFOLD_OUTBOX_BATCH", "0"],
    ["BENCHFOLD_OUTBOX_BATCH", "0x10"],
    ["BENCHFOLD_OUTBOX_LEASE_MS", "-5"],
    ["BENCHFOLD_OUTBOX_POLL_MS", "1e3"],
    ["BENCHFOLD_OUTBOX_RETRY_CAP_MS", "1000"],
  ])("refuses %s=%s", (name, value) => {
    expect(() => readOutboxSettings({ [name]: value })).toThrow(name);
  });
});
