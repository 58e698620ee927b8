/**
 * The fault suite's mail part: the outbox worker (scripts/outbox-worker.ts, the real process)
 * against an SMTP server of this test's own, on a free port, which the test stops, starts, makes
 * refuse, and uses to kill the worker in the middle of a delivery.
 *
 * (a) Relay outage: notices queued while nothing listens are retried (attempts grow, nothing is
 *     marked sent), then refused with 451 for a while, and once the relay accepts, each
 *     recipient gets exactly one mail. None lost, none twice.
 * (b) Crash between sending and marking sent: the relay kills the worker (SIGKILL) after it has
 *     taken the whole message and before its reply, so the worker never learns that the send
 *     worked and cannot mark the row. That is the window the design accepts: when the lease ends,
 *     the next worker sends the row again, with the same Message-ID. The count shows at most one
 *     duplicate per crash and none lost. No switch in the worker makes it crash: the test kills
 *     it from outside, so nothing of the kind exists in production.
 *
 * (c) The same outage for the run's own worker (scripts/test.sh starts it beside the app server,
 *     as npm start does), lane "mail", production retry settings: the run's fake SMTP server
 *     closes its port (DELETE /smtp on its read-out) and opens it again.
 *
 * The rows of (a) and (b) live in lanes of their own (BENCHFOLD_OUTBOX_LANE), so the run's shared
 * worker, which drains lane "mail" into the shared fake SMTP server, never takes them.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { simpleParser } from "mailparser";
import { QueryTypes } from "sequelize";
import { SMTPServer, type SMTPServerOptions } from "smtp-server";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb, db } from "@/models";
import { assertLoopbackDatabase } from "./helpers/loopback";
import { mailsTo, setFakeSmtpListening } from "./helpers/mailbox";

vi.mock("server-only", () => ({}));
const { enqueueNotices } = await import("@/lib/server/outbox/enqueue-notices");

const ROOT = path.resolve(__dirname, "../..");
const tag = randomBytes(4).toString("hex");

type Received = { to: string; messageId: string; subject: string };
type Row = { id: number; recipient: string; attempts: number; sentAt: Date | null; lastError: string | null; messageId: string };

/** An SMTP server of this test's own that can be stopped, started on the same port, and told how to answer. */
class TestRelay {
  received: Received[] = [];
  port = 0;
  /** Answer to each message: accept, refuse with a temporary 451, or run a hook once the whole message is in. */
  mode: "accept" | "refuse" = "accept";
  afterData: ((mail: Received) => void) | null = null;
  private server: SMTPServer | null = null;

  async start(): Promise<void> {
    const options: SMTPServerOptions = {
      authOptional: true,
      disabledCommands: ["STARTTLS", "AUTH"],
      logger: false,
      onRcptTo: (address, _session, callback) => {
        if (this.mode === "refuse") return callback(Object.assign(new Error("Try again later"), { responseCode: 451 }));
        callback();
      },
      onData: (stream, session, callback) => {
        simpleParser(stream)
          .then((parsed) => {
            const mail = { to: session.envelope.rcptTo.map((r) => r.address).join(", "), messageId: parsed.messageId ?? "", subject: parsed.subject ?? "" };
            this.received.push(mail);
            this.afterData?.(mail);
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    };
    this.server = new SMTPServer(options);
    await new Promise<void>((resolve, reject) => {
      this.server!.once("error", reject);
      this.server!.listen(this.port, "127.0.0.1", () => resolve());
    });
    this.port = (this.server.server.address() as AddressInfo).port;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}

type Worker = { child: ChildProcess; output: () => string; exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }> };

function startWorker(lane: string, smtpPort: number): Worker {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "scripts/outbox-worker.ts"], {
    cwd: ROOT,
    env: {
      ...process.env,
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(smtpPort),
      BENCHFOLD_FAKE_SMTP: "1",
      BENCHFOLD_OUTBOX_LANE: lane,
      BENCHFOLD_OUTBOX_POLL_MS: "100",
      BENCHFOLD_OUTBOX_LEASE_MS: "2000",
      BENCHFOLD_OUTBOX_RETRY_BASE_MS: "100",
      BENCHFOLD_OUTBOX_RETRY_CAP_MS: "400",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout!.on("data", (chunk) => (output += chunk));
  child.stderr!.on("data", (chunk) => (output += chunk));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.once("exit", (code, signal) => resolve({ code, signal })));
  return { child, output: () => output, exited };
}

const running = new Set<Worker>();
function track(worker: Worker): Worker {
  running.add(worker);
  void worker.exited.then(() => running.delete(worker));
  return worker;
}

async function waitFor<T>(what: string, probe: () => Promise<T | false>, worker?: Worker, timeoutMs = 90_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== false) return value;
    if (Date.now() > until) throw new Error(`${what}: not within ${timeoutMs} ms${worker ? `\nworker output:\n${worker.output()}` : ""}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

async function rowsOf(lane: string, eventKey?: string): Promise<Row[]> {
  return db().sequelize.query<Row>(
    `SELECT id, recipient, attempts, sent_at AS sentAt, last_error AS lastError, message_id AS messageId
       FROM outbox_messages WHERE lane = :lane AND (:eventKey IS NULL OR event_key = :eventKey) ORDER BY id`,
    { type: QueryTypes.SELECT, replacements: { lane, eventKey: eventKey ?? null } },
  );
}

const eventKeyOf = (lane: string) => `fault-test:${lane}:released`;

/** Queues one event's notices; `lane` undefined is the app's own lane, "mail". */
async function enqueueEvent(lane: string | undefined, recipients: string[]): Promise<void> {
  await db().sequelize.transaction((transaction) =>
    enqueueNotices(
      transaction,
      recipients.map((to) => ({ organizationId: null, eventKey: eventKeyOf(lane ?? `mail-${tag}`), to, subject: "Revision released", text: `A revision you follow was released (${lane ?? "mail"}).`, lane })),
    ),
  );
}

function copiesByRecipient(received: Received[]): Map<string, Received[]> {
  const copies = new Map<string, Received[]>();
  for (const mail of received) copies.set(mail.to, [...(copies.get(mail.to) ?? []), mail]);
  return copies;
}

const relay = new TestRelay();

beforeAll(async () => {
  assertLoopbackDatabase();
  // A free port, kept for the whole file so the workers can be pointed at it before it listens.
  await relay.start();
  await relay.stop();
});

afterAll(async () => {
  await setFakeSmtpListening(true);
  for (const worker of running) worker.child.kill("SIGKILL");
  await relay.stop();
  await closeDb();
});

describe("outbox under mail faults", () => {
  it("(a) an SMTP outage delays notices and loses none; afterwards each recipient gets exactly one", async () => {
    const lane = `fault-outage-${tag}`;
    const recipients = Array.from({ length: 6 }, (_, i) => `subscriber-${i}-${tag}@outage.example`);
    relay.received = [];
    await enqueueEvent(lane, recipients);
    const worker = track(startWorker(lane, relay.port));

    // Nothing listens: every row is tried again and again, none is marked sent.
    const refused = await waitFor("attempts growing while the relay is down", async () => {
      const rows = await rowsOf(lane);
      return rows.every((r) => r.attempts >= 3) && rows;
    }, worker);
    expect(refused.filter((r) => r.sentAt !== null)).toEqual([]);
    expect(refused.every((r) => /ECONNREFUSED/.test(r.lastError ?? ""))).toBe(true);
    expect(relay.received).toEqual([]);

    // The relay is back but refuses every recipient for now (451): still nothing sent.
    relay.mode = "refuse";
    await relay.start();
    const deferred = await waitFor("451 answers recorded", async () => {
      const rows = await rowsOf(lane);
      return rows.every((r) => /451/.test(r.lastError ?? "")) && rows;
    }, worker);
    expect(deferred.filter((r) => r.sentAt !== null)).toEqual([]);
    expect(relay.received).toEqual([]);

    relay.mode = "accept";
    const sent = await waitFor("every notice marked sent", async () => {
      const rows = await rowsOf(lane);
      return rows.every((r) => r.sentAt !== null) && rows;
    }, worker);

    const copies = copiesByRecipient(relay.received);
    expect([...copies.keys()].sort()).toEqual([...recipients].sort());
    for (const row of sent) expect(copies.get(row.recipient)?.map((m) => m.messageId)).toEqual([row.messageId]);
    expect(sent.every((r) => r.lastError === null && r.attempts > 3)).toBe(true);
    console.log(
      `[outbox faults] outage: ${recipients.length} notices, ${sent.reduce((n, r) => n + r.attempts, 0)} attempts through refused and 451, ` +
        `${recipients.length - copies.size} lost, ${relay.received.length} mails delivered`,
    );

    worker.child.kill("SIGTERM");
    expect(await worker.exited).toEqual({ code: 0, signal: null });
    expect(worker.output()).toContain("stopped");
  }, 180_000);

  it("(b) a worker killed between sending and marking sent costs at most one duplicate per crash, with the same Message-ID", async () => {
    const lane = `fault-crash-${tag}`;
    const recipients = Array.from({ length: 5 }, (_, i) => `subscriber-${i}-${tag}@crash.example`);
    const crashes = 2;
    relay.received = [];
    relay.mode = "accept";
    await enqueueEvent(lane, recipients);

    let current: Worker | null = null;
    let killed = 0;
    // The relay has the whole message; the worker dies before it hears "250 accepted".
    relay.afterData = () => {
      if (killed < crashes && current) {
        killed += 1;
        current.child.kill("SIGKILL");
        current = null;
      }
    };
    for (let crash = 1; crash <= crashes; crash++) {
      const worker = track(startWorker(lane, relay.port));
      current = worker;
      expect(await worker.exited).toEqual({ code: null, signal: "SIGKILL" });
      // The mail went out; its row is not marked sent.
      expect(relay.received).toHaveLength(crash);
      expect((await rowsOf(lane)).filter((r) => r.sentAt !== null)).toEqual([]);
    }
    relay.afterData = null;

    const survivor = track(startWorker(lane, relay.port));
    const rows = await waitFor("every notice marked sent after the crashes", async () => {
      const all = await rowsOf(lane);
      return all.every((r) => r.sentAt !== null) && all;
    }, survivor);

    const copies = copiesByRecipient(relay.received);
    expect([...copies.keys()].sort()).toEqual([...recipients].sort());
    const duplicates = [...copies.values()].reduce((sum, list) => sum + list.length - 1, 0);
    expect(duplicates).toBeGreaterThan(0);
    expect(duplicates).toBeLessThanOrEqual(crashes);
    console.log(
      `[outbox faults] ${crashes} workers killed between send and mark: ${recipients.length} notices, ` +
        `${recipients.length - copies.size} lost, ${duplicates} duplicate(s), ${relay.received.length} mails delivered`,
    );
    // Every copy of a notice carries its row's Message-ID, so a client can drop the repeat.
    for (const row of rows) expect(new Set(copies.get(row.recipient)!.map((m) => m.messageId))).toEqual(new Set([row.messageId]));

    survivor.child.kill("SIGTERM");
    expect(await survivor.exited).toEqual({ code: 0, signal: null });
  }, 180_000);

  it("(c) the run's own worker loses nothing while the run's fake SMTP server is stopped, and sends each notice once", async () => {
    const recipients = Array.from({ length: 3 }, (_, i) => `member-${i}-${tag}@shared-outage.example`);
    const eventKey = eventKeyOf(`mail-${tag}`);
    await setFakeSmtpListening(false);
    try {
      await enqueueEvent(undefined, recipients);
      // Production settings: the second attempt comes 5 s after the first.
      const failing = await waitFor("the run's worker retrying while the relay is down", async () => {
        const rows = await rowsOf("mail", eventKey);
        return rows.length === recipients.length && rows.every((r) => r.attempts >= 2) && rows;
      });
      expect(failing.filter((r) => r.sentAt !== null)).toEqual([]);
      for (const to of recipients) expect(await mailsTo(to)).toEqual([]);
    } finally {
      await setFakeSmtpListening(true);
    }
    const sent = await waitFor("every notice marked sent by the run's worker", async () => {
      const rows = await rowsOf("mail", eventKey);
      return rows.every((r) => r.sentAt !== null) && rows;
    });
    for (const row of sent) expect((await mailsTo(row.recipient)).map((m) => m.messageId)).toEqual([row.messageId]);
  }, 180_000);
});
