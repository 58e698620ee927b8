/**
 * Health and shutdown (DEVELOPERS.md, "Health and shutdown"):
 *
 * (a) GET /api/health/ready on the run's server: 200 with every check, then 503 naming the
 *     database while the run's MariaDB is killed, and 200 again once it is started
 *     (tests/integration/helpers/database-process.ts, as the database fault test does); 503 naming
 *     the storage while the run's fake S3 refuses requests; the answers fit the OpenAPI document and
 *     name no address.
 * (b) A second app server (scripts/server.mjs, the run's build, the run's database) on a port of
 *     its own gets SIGTERM while a request is in flight (a PATCH whose body is still arriving) and
 *     another has begun (a readiness request whose headers are still arriving): a new connection
 *     is refused at once, the readiness request answers 503 "stopping", the PATCH completes with
 *     200 and is saved, and the process exits 0 after closing its database pools.
 * (c) The outbox worker (the real process) gets SIGTERM while the relay holds the mail it is
 *     sending: it marks that row sent, leaves the rest of its batch unclaimed and exits 0; a second
 *     worker sends the rest. Each recipient gets exactly one mail.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import net, { type AddressInfo } from "node:net";
import path from "node:path";
import { simpleParser } from "mailparser";
import { QueryTypes } from "sequelize";
import { SMTPServer } from "smtp-server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb, db } from "@/models";
import { openApiValidator } from "../helpers/openapi-validator";
import { TestClient } from "./helpers/client";
import { killDatabase, startDatabase } from "./helpers/database-process";
import { setFakeS3Faults } from "./helpers/object-store";
import { factoryPassword, makeDevice, makeOrganization } from "./helpers/factories";
import { assertLoopbackDatabase } from "./helpers/loopback";

vi.mock("server-only", () => ({}));
const { enqueueNotices } = await import("@/lib/server/outbox/enqueue-notices");

const ROOT = path.resolve(__dirname, "../..");
const tag = randomBytes(4).toString("hex");
const anyone = new TestClient();

type Child = { child: ChildProcess; output: () => string; exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }> };
const children = new Set<Child>();

function startChild(args: string[], env: Record<string, string>): Child {
  const child = spawn(process.execPath, args, { cwd: ROOT, env: { ...process.env, ...env }, stdio: ["ignore", "pipe", "pipe"] });
  let output = "";
  child.stdout!.on("data", (chunk) => (output += chunk));
  child.stderr!.on("data", (chunk) => (output += chunk));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.once("exit", (code, signal) => resolve({ code, signal })));
  const started = { child, output: () => output, exited };
  children.add(started);
  void exited.then(() => children.delete(started));
  return started;
}

async function waitFor<T>(what: string, probe: () => Promise<T | false>, timeoutMs = 60_000, context?: () => string): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe().catch(() => false as const);
    if (value !== false) return value;
    if (Date.now() > until) throw new Error(`${what}: not within ${timeoutMs} ms${context ? `\n${context()}` : ""}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", () => resolve()));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

/** A raw HTTP/1.1 connection, so the test decides when each byte of a request goes out. */
class RawConnection {
  private readonly socket: net.Socket;
  private received = "";
  readonly closed: Promise<void>;

  private constructor(socket: net.Socket) {
    this.socket = socket;
    socket.setEncoding("utf8");
    socket.on("data", (chunk: string) => (this.received += chunk));
    this.closed = new Promise((resolve) => socket.once("close", () => resolve()));
  }

  static open(port: number): Promise<RawConnection> {
    return new Promise((resolve, reject) => {
      const socket = net.connect({ host: "127.0.0.1", port }, () => resolve(new RawConnection(socket)));
      socket.once("error", reject);
    });
  }

  write(text: string): void {
    this.socket.write(text);
  }

  /** The answer once the server has closed the connection (every answer during shutdown carries Connection: close). */
  async response(): Promise<{ status: number; headers: Record<string, string>; body: string }> {
    await this.closed;
    const split = this.received.indexOf("\r\n\r\n");
    const [statusLine, ...lines] = this.received.slice(0, split).split("\r\n");
    const headers = Object.fromEntries(lines.map((line) => [line.slice(0, line.indexOf(":")).toLowerCase(), line.slice(line.indexOf(":") + 1).trim()]));
    let body = this.received.slice(split + 4);
    if (headers["transfer-encoding"] === "chunked") {
      let decoded = "";
      for (let rest = body; ; ) {
        const eol = rest.indexOf("\r\n");
        const size = parseInt(rest.slice(0, eol), 16);
        if (!size) break;
        decoded += rest.slice(eol + 2, eol + 2 + size);
        rest = rest.slice(eol + 2 + size + 2);
      }
      body = decoded;
    }
    return { status: Number(statusLine.split(" ")[1]), headers, body };
  }
}

let validator: ReturnType<typeof openApiValidator>;

beforeAll(async () => {
  assertLoopbackDatabase();
  validator = openApiValidator((await (await anyone.request("/api/v1/openapi.json")).json()) as never);
});

afterAll(async () => {
  for (const { child } of children) child.kill("SIGKILL");
  await closeDb();
});

type ReadinessBody = { status: string; notReady: string[]; checks: Record<string, { status: string; ms: number; message?: string }>; note: string };

async function readiness(): Promise<{ status: number; body: ReadinessBody; text: string; cacheControl: string | null }> {
  const r = await anyone.request("/api/health/ready");
  const text = await r.text();
  return { status: r.status, body: JSON.parse(text) as ReadinessBody, text, cacheControl: r.headers.get("cache-control") };
}

const port = (url: string) => new URL(url).port;

describe("(a) readiness", () => {
  it("answers 200 with each check, 503 naming the database while it is down, 200 again once it is back", async () => {
    const ready = await waitFor("ready", async () => {
      const r = await readiness();
      return r.status === 200 && r;
    });
    expect(ready.cacheControl).toBe("no-store");
    expect(ready.body).toMatchObject({ status: "ready", notReady: [] });
    expect(Object.keys(ready.body.checks).sort()).toEqual(["database", "mail", "storage"]);
    expect(ready.body.note).toMatch(/S3-compatible object store/);
    expect(validator.check("/api/health/ready", "get", 200, ready.body)).toBeNull();
    // No address, port or user of the database or the relay in a public answer.
    const secrets = [process.env.DB_PORT, process.env.SMTP_PORT, process.env.BENCHFOLD_FAKE_S3_PORT, process.env.S3_BUCKET, process.env.DB_USER ?? "benchfold", "127.0.0.1", "localhost"].filter(Boolean) as string[];
    for (const secret of secrets) expect(ready.text).not.toContain(secret);

    killDatabase();
    try {
      const down = await waitFor("503 while the database is down", async () => {
        const r = await readiness();
        return r.status === 503 && r;
      }, 30_000);
      expect(down.body.status).toBe("not-ready");
      // The files are in the object store, which does not go down with the database.
      expect(down.body.notReady).toEqual(["database"]);
      expect(down.body.checks.database).toMatchObject({ status: "failing" });
      expect(down.body.checks.mail).toMatchObject({ status: "ok" });
      expect(down.cacheControl).toBe("no-store");
      expect(validator.check("/api/health/ready", "get", 503, down.body)).toBeNull();
      for (const secret of secrets) expect(down.text).not.toContain(secret);
      expect(down.text).not.toMatch(/ECONNREFUSED|ER_|connect /);
    } finally {
      await startDatabase();
    }
    const back = await waitFor("200 once the database is back", async () => {
      const r = await readiness();
      return r.status === 200 && r;
    }, 60_000);
    expect(back.body.status).toBe("ready");

    await setFakeS3Faults({ reads: "fail" });
    try {
      const noStore = await waitFor("503 while the store refuses requests", async () => {
        const r = await readiness();
        return r.status === 503 && r;
      }, 30_000);
      expect(noStore.body.notReady).toEqual(["storage"]);
      expect(noStore.body.checks.storage).toMatchObject({ status: "failing", message: "The file store cannot be reached." });
      expect(validator.check("/api/health/ready", "get", 503, noStore.body)).toBeNull();
      for (const secret of secrets) expect(noStore.text).not.toContain(secret);
    } finally {
      await setFakeS3Faults({});
    }
    await waitFor("200 once the store answers", async () => (await readiness()).status === 200, 30_000);
  }, 150_000);
});

describe("(b) an app server on SIGTERM", () => {
  it("refuses new connections, answers readiness 503, completes the request in flight with 200, exits 0", async () => {
    const serverPort = await freePort();
    const url = `http://localhost:${serverPort}`;
    const server = startChild(["scripts/server.mjs"], { PORT: String(serverPort), NEXTAUTH_URL: url, BENCHFOLD_SHUTDOWN_GRACE_MS: "20000" });
    await waitFor("the second server answering", async () => (await fetch(`${url}/api/health/live`)).ok, 90_000, server.output);
    expect(port(url)).not.toBe(port(process.env.BENCHFOLD_TEST_URL ?? "http://localhost:3100"));

    const made = await makeOrganization();
    const device = await makeDevice(made.organization.id);
    const engineer = new TestClient({ baseUrl: url });
    expect((await engineer.signIn(made.users.engineer.email, factoryPassword)).ok).toBe(true);
    expect((await new TestClient({ baseUrl: url }).request("/api/health/ready")).status).toBe(200);

    const title = `Renamed while stopping ${tag}`;
    const body = JSON.stringify({ partNumber: device.partNumber, deviceClass: "frequency-multiplier", title, keyConditions: { multiplicationFactor: 2 } });
    const cookie = [...engineer.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    // In flight: the headers and half the body are sent; the rest waits for the test.
    const patch = await RawConnection.open(serverPort);
    patch.write(
      `PATCH /api/devices/${device.id} HTTP/1.1\r\nHost: localhost:${serverPort}\r\nOrigin: ${url}\r\nX-Forwarded-For: ${engineer.address}\r\n` +
        `Cookie: ${cookie}\r\nContent-Type: application/json\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n${body.slice(0, 20)}`,
    );
    // Begun: the request line and one header are sent, not yet the blank line that ends them.
    const ready = await RawConnection.open(serverPort);
    ready.write(`GET /api/health/ready HTTP/1.1\r\nHost: localhost:${serverPort}\r\n`);
    await new Promise((resolve) => setTimeout(resolve, 500));

    server.child.kill("SIGTERM");
    const connectOutcome = () =>
      new Promise<string>((resolve) => {
        const socket = net.connect({ host: "127.0.0.1", port: serverPort }, () => {
          socket.destroy();
          resolve("connected");
        });
        socket.once("error", (error: NodeJS.ErrnoException) => resolve(error.code ?? "error"));
      });
    // Once the signal is handled, a new connection is refused (while the two above stay open).
    await waitFor("a new connection refused", async () => (await connectOutcome()) === "ECONNREFUSED", 10_000, server.output);

    ready.write("\r\n");
    const readyAnswer = await ready.response();
    expect(readyAnswer.status).toBe(503);
    expect(readyAnswer.headers.connection).toBe("close");
    expect(JSON.parse(readyAnswer.body)).toMatchObject({ status: "stopping", notReady: ["instance"] });

    await new Promise((resolve) => setTimeout(resolve, 300));
    patch.write(body.slice(20));
    const patchAnswer = await patch.response();
    expect(patchAnswer.status, patchAnswer.body).toBe(200);
    expect((JSON.parse(patchAnswer.body) as { device: { title: string } }).device.title).toBe(title);

    expect(await server.exited).toEqual({ code: 0, signal: null });
    expect(server.output()).toMatch(/SIGTERM: stopping; new connections refused, 1 request\(s\) in flight/);
    expect(server.output()).toMatch(/requests finished in \d+ ms/);
    expect(server.output()).toMatch(/stopped after \d+ ms: .*database pool closed/);
    const { Device } = db();
    expect((await Device.findByPk(device.id))?.title).toBe(title);
  }, 180_000);
});

type Received = { to: string; messageId: string };
type Row = { recipient: string; sentAt: Date | null; claimToken: string | null; messageId: string };

describe("(c) the outbox worker on SIGTERM", () => {
  it("marks the mail in flight sent, leaves the rest unclaimed and exits 0; nothing lost, nothing twice", async () => {
    const lane = `stop-${tag}`;
    const received: Received[] = [];
    let hold: (() => void) | null = null;
    let holdNext = true;
    const relay = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS", "AUTH"],
      logger: false,
      onData: (stream, session, callback) => {
        simpleParser(stream)
          .then((parsed) => {
            received.push({ to: session.envelope.rcptTo.map((r) => r.address).join(", "), messageId: parsed.messageId ?? "" });
            // The first mail's "250 accepted" waits for the test: the worker is in the middle of a send.
            if (holdNext) {
              holdNext = false;
              hold = () => callback();
            } else callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
    await new Promise<void>((resolve) => relay.listen(0, "127.0.0.1", () => resolve()));
    const smtpPort = (relay.server.address() as AddressInfo).port;
    try {
      const recipients = Array.from({ length: 4 }, (_, i) => `stop-${i}-${tag}@shutdown.example`);
      await db().sequelize.transaction((transaction) =>
        enqueueNotices(transaction, recipients.map((to) => ({ organizationId: null, eventKey: `shutdown-test:${lane}`, to, subject: "Revision released", text: "A revision you follow was released.", lane }))),
      );
      const rows = () =>
        db().sequelize.query<Row>(`SELECT recipient, sent_at AS sentAt, claim_token AS claimToken, message_id AS messageId FROM outbox_messages WHERE lane = :lane ORDER BY id`, {
          type: QueryTypes.SELECT,
          replacements: { lane },
        });
      const workerEnv = { SMTP_HOST: "127.0.0.1", SMTP_PORT: String(smtpPort), BENCHFOLD_FAKE_SMTP: "1", BENCHFOLD_OUTBOX_LANE: lane, BENCHFOLD_OUTBOX_POLL_MS: "100" };
      const workerArgs = ["--conditions=react-server", "--import", "tsx", "scripts/outbox-worker.ts"];

      const first = startChild(workerArgs, workerEnv);
      await waitFor("the relay holding the first mail", async () => hold !== null, 60_000, first.output);
      // The whole batch is claimed by the first worker while it sends.
      expect((await rows()).every((r) => r.claimToken !== null)).toBe(true);
      first.child.kill("SIGTERM");
      await waitFor("the worker saying it stops", async () => /SIGTERM: stopping/.test(first.output()), 10_000, first.output);
      hold!();
      expect(await first.exited).toEqual({ code: 0, signal: null });

      const afterStop = await rows();
      expect(afterStop.filter((r) => r.sentAt !== null).map((r) => r.recipient)).toEqual([received[0].to]);
      expect(afterStop.filter((r) => r.sentAt === null).map((r) => r.claimToken)).toEqual([null, null, null]);
      expect(received).toHaveLength(1);

      const second = startChild(workerArgs, workerEnv);
      const done = await waitFor("every row sent by the second worker", async () => {
        const all = await rows();
        return all.every((r) => r.sentAt !== null) && all;
      }, 60_000, second.output);
      second.child.kill("SIGTERM");
      expect(await second.exited).toEqual({ code: 0, signal: null });

      expect(received.map((m) => m.to).sort()).toEqual([...recipients].sort());
      for (const row of done) expect(received.filter((m) => m.to === row.recipient).map((m) => m.messageId)).toEqual([row.messageId]);
    } finally {
      await new Promise<void>((resolve) => relay.close(() => resolve()));
    }
  }, 180_000);
});
