import { createServer, type Server } from "node:net";
import type { AddressInfo } from "node:net";
import { afterEach, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
const { checkReadiness } = await import("@/lib/server/health/check-readiness");
const { probeMailRelay, ReadinessFailure } = await import("@/lib/server/health/readiness-checks");

const ok = async () => undefined;
const never = () => new Promise<void>(() => undefined);
const SHUTTING_DOWN = Symbol.for("benchfold.shutting-down");

afterEach(() => {
  delete (globalThis as Record<symbol, unknown>)[SHUTTING_DOWN];
});

describe("checkReadiness", () => {
  it("is ready when every check answers", async () => {
    const r = await checkReadiness({ probes: { database: ok, storage: ok, mail: ok }, timeoutMs: 200 });
    expect(r.status).toBe("ready");
    expect(r.notReady).toEqual([]);
    expect(Object.values(r.checks).map((c) => c.status)).toEqual(["ok", "ok", "ok"]);
  });

  it("names each failing check, with its public sentence and not the driver's message", async () => {
    const r = await checkReadiness({
      probes: {
        database: async () => {
          throw new ReadinessFailure("The database cannot be reached.", new Error("connect ECONNREFUSED 10.1.2.3:3306"));
        },
        storage: ok,
        mail: async () => {
          throw new Error("getaddrinfo ENOTFOUND relay.internal.example");
        },
      },
      timeoutMs: 200,
    });
    expect(r.status).toBe("not-ready");
    expect(r.notReady).toEqual(["database", "mail"]);
    expect(r.checks.database).toMatchObject({ status: "failing", message: "The database cannot be reached." });
    expect(r.checks.mail).toMatchObject({ status: "failing", message: "The mail check failed." });
    expect(JSON.stringify(r)).not.toMatch(/10\.1\.2\.3|3306|relay\.internal|ECONNREFUSED|ENOTFOUND/);
  });

  it("gives a check that never answers its time limit and no more", async () => {
    const started = Date.now();
    const r = await checkReadiness({ probes: { database: never, storage: ok, mail: never }, timeoutMs: 150 });
    expect(Date.now() - started).toBeLessThan(1_000);
    expect(r.notReady).toEqual(["database", "mail"]);
    expect(r.checks.database?.message).toBe("No answer within 150 ms.");
  });

  it("answers 'stopping' at once, without checks, once shutdown has begun", async () => {
    (globalThis as Record<symbol, unknown>)[SHUTTING_DOWN] = true;
    const database = vi.fn(ok);
    const r = await checkReadiness({ probes: { database, storage: ok, mail: ok } });
    expect(r).toMatchObject({ status: "stopping", notReady: ["instance"], checks: {} });
    expect(database).not.toHaveBeenCalled();
  });
});

describe("probeMailRelay", () => {
  let server: Server | null = null;
  afterEach(async () => {
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
    server = null;
    vi.unstubAllEnvs();
  });

  /** A TCP server that greets each connection with `greeting` (or says nothing) and records what it is sent. */
  async function relay(greeting: string | null): Promise<{ port: number; heard: string[] }> {
    const heard: string[] = [];
    server = createServer((socket) => {
      socket.setEncoding("latin1");
      socket.on("data", (chunk: string) => heard.push(chunk));
      socket.on("error", () => undefined);
      if (greeting !== null) socket.write(greeting);
    });
    await new Promise<void>((resolve) => server!.listen(0, "127.0.0.1", () => resolve()));
    const port = (server.address() as AddressInfo).port;
    vi.stubEnv("SMTP_HOST", "127.0.0.1");
    vi.stubEnv("SMTP_PORT", String(port));
    vi.stubEnv("SMTP_SECURE", "");
    return { port, heard };
  }

  it("passes on a 220 greeting (also a multi-line one) and says QUIT", async () => {
    const { heard } = await relay("220-relay.example ESMTP\r\n220 ready\r\n");
    await expect(probeMailRelay(1_000)).resolves.toBeUndefined();
    await vi.waitFor(() => expect(heard.join("")).toBe("QUIT\r\n"));
  });

  it("fails on a refusal (554, RFC 5321 §3.1), naming the code only", async () => {
    await relay("554 relay.internal.example no service\r\n");
    await expect(probeMailRelay(1_000)).rejects.toThrow("The mail relay refused the connection (reply 554).");
  });

  it("fails when the relay says nothing in time", async () => {
    await relay(null);
    await expect(probeMailRelay(150)).rejects.toThrow("The mail relay did not greet in time.");
  });

  it("fails when nothing listens", async () => {
    const { port } = await relay(null);
    await new Promise<void>((resolve) => server!.close(() => resolve()));
    server = null;
    vi.stubEnv("SMTP_PORT", String(port));
    const failure = await probeMailRelay(1_000).catch((error: unknown) => error);
    expect(failure).toBeInstanceOf(ReadinessFailure);
    expect((failure as Error).message).toBe("The mail relay cannot be reached.");
    expect((failure as InstanceType<typeof ReadinessFailure>).detail).toMatch(/ECONNREFUSED/);
  });
});
