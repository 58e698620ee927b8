import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const { retryOnDeadlock } = await import("@/lib/server/outbox/retry-on-deadlock");

// Sequelize wraps the driver's error: the MariaDB errno sits on `parent` (and `original`).
const wrapped = (errno: number) => Object.assign(new Error(`errno ${errno}`), { parent: { errno } });

describe("retryOnDeadlock", () => {
  it.each([1213, 1205])("runs a statement again after errno %i (deadlock, lock wait timeout)", async (errno) => {
    let calls = 0;
    const result = await retryOnDeadlock(async () => {
      calls += 1;
      if (calls < 3) throw wrapped(errno);
      return "done";
    });
    expect(result).toBe("done");
    expect(calls).toBe(3);
  });

  it("gives up after the tries allowed, with the last error", async () => {
    let calls = 0;
    await expect(retryOnDeadlock(async () => {
      calls += 1;
      throw wrapped(1213);
    }, 4)).rejects.toThrow("errno 1213");
    expect(calls).toBe(4);
  });

  it.each([[wrapped(1062)], [new Error("connect ECONNREFUSED")], [null]])("does not repeat any other failure (%s)", async (error) => {
    let calls = 0;
    await expect(retryOnDeadlock(async () => {
      calls += 1;
      throw error;
    })).rejects.toBe(error);
    expect(calls).toBe(1);
  });
});
