/**
 * The notice outbox against the real MariaDB, without the app: enqueueNotices writes in the
 * caller's transaction and ignores repeats, claims exclude each other while their leases hold,
 * a lease that ran out is taken over, failures back off on the database's clock, and
 * organizationMembers lists the active members of the roles asked. Every row here is in a lane
 * of its own, so the run's shared outbox worker (lane "mail") never touches them.
 */
import { randomBytes } from "node:crypto";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb, db } from "@/models";
import { assertLoopbackDatabase } from "./helpers/loopback";
import { makeOrganization } from "./helpers/factories";
import { waitForMail } from "./helpers/mailbox";

vi.mock("server-only", () => ({}));

const { enqueueNotices } = await import("@/lib/server/outbox/enqueue-notices");
const { claimOutboxBatch } = await import("@/lib/server/outbox/claim-outbox-batch");
const { drainOutbox } = await import("@/lib/server/outbox/drain-outbox");
const { organizationMembers } = await import("@/lib/server/outbox/organization-members");

type Row = { id: number; recipient: string; attempts: number; sentAt: Date | null; claimToken: string | null; lastError: string | null; messageId: string; delayMs: number | null };

const tag = randomBytes(4).toString("hex");
const newLane = (name: string) => `${name}-${tag}`;
const settings = (lane: string) => ({ lane, batchSize: 7, leaseMs: 60_000, retryBaseMs: 5_000, retryCapMs: 600_000 });

async function rowsOf(lane: string): Promise<Row[]> {
  return db().sequelize.query<Row>(
    `SELECT id, recipient, attempts, sent_at AS sentAt, claim_token AS claimToken, last_error AS lastError, message_id AS messageId,
            TIMESTAMPDIFF(MICROSECOND, updated_at, next_attempt_at) DIV 1000 AS delayMs
       FROM outbox_messages WHERE lane = :lane ORDER BY id`,
    { type: QueryTypes.SELECT, replacements: { lane } },
  );
}

async function enqueue(lane: string, count: number, eventKey = `claims:${lane}`) {
  await db().sequelize.transaction(async (transaction) => {
    await enqueueNotices(
      transaction,
      Array.from({ length: count }, (_, i) => ({ organizationId: null, eventKey, to: `reader-${i}-${tag}@outbox.example`, subject: `Notice ${i}`, text: `Body ${i}`, lane })),
    );
  });
}

beforeAll(() => assertLoopbackDatabase());
afterAll(async () => {
  await closeDb();
});

describe("enqueueNotices", () => {
  it("writes nothing when the event's transaction rolls back", async () => {
    const lane = newLane("rollback");
    await expect(
      db().sequelize.transaction(async (transaction) => {
        await enqueueNotices(transaction, [{ organizationId: null, eventKey: `rollback:${tag}`, to: `a-${tag}@outbox.example`, subject: "s", text: "t", lane }]);
        throw new Error("the event failed");
      }),
    ).rejects.toThrow("the event failed");
    expect(await rowsOf(lane)).toEqual([]);
  });

  it("queues one mail per (event, recipient), however often and in whatever case it is enqueued", async () => {
    const lane = newLane("repeat");
    const eventKey = `repeat:${tag}`;
    const to = `Repeat-${tag}@Outbox.example`;
    for (const subject of ["first", "second"]) {
      await db().sequelize.transaction((transaction) =>
        enqueueNotices(transaction, [
          { organizationId: null, eventKey, to, subject, text: "t", lane },
          { organizationId: null, eventKey, to: to.toLowerCase(), subject, text: "t", lane },
          { organizationId: null, eventKey: `${eventKey}:other`, to, subject, text: "t", lane },
        ]),
      );
    }
    const rows = await rowsOf(lane);
    expect(rows.map((r) => r.recipient)).toEqual([to.toLowerCase(), to.toLowerCase()]);
    const [first] = await db().sequelize.query<{ subject: string }>("SELECT subject FROM outbox_messages WHERE id = :id", { type: QueryTypes.SELECT, replacements: { id: rows[0].id } });
    expect(first.subject).toBe("first");
    expect(new Set(rows.map((r) => r.messageId)).size).toBe(2);
    expect(rows[0].messageId).toMatch(/^<outbox\.[0-9a-f-]{36}@[a-z0-9.-]+>$/);
  });

  it("refuses a subject over one line, a recipient that is not one bare address, and a value over its column", async () => {
    const notice = { organizationId: null, eventKey: `bad:${tag}`, to: `b-${tag}@outbox.example`, subject: "s", text: "t" };
    await db().sequelize.transaction(async (transaction) => {
      await expect(enqueueNotices(transaction, [{ ...notice, subject: "a\r\nBcc: x@y.example" }])).rejects.toThrow("one line");
      await expect(enqueueNotices(transaction, [{ ...notice, subject: "s".repeat(256) }])).rejects.toThrow("subject");
      for (const to of [`b-${tag}@outbox.example, c@outbox.example`, `Someone <b-${tag}@outbox.example>`, "b@outbox.example\nBcc: c@outbox.example", "no-at-sign.example", "a@b"]) {
        await expect(enqueueNotices(transaction, [{ ...notice, to }])).rejects.toThrow("recipient");
      }
      await expect(enqueueNotices(transaction, [{ ...notice, lane: "No Lane" }])).rejects.toThrow("lane");
    });
    expect(await db().OutboxMessage.count({ where: { eventKey: `bad:${tag}` } })).toBe(0);
  });
});

describe("claiming", () => {
  it("two claims never hold the same row while their leases last", async () => {
    const lane = newLane("leases");
    await enqueue(lane, 10);
    const first = await claimOutboxBatch({ lane, batchSize: 6, leaseMs: 60_000 });
    const second = await claimOutboxBatch({ lane, batchSize: 6, leaseMs: 60_000 });
    const third = await claimOutboxBatch({ lane, batchSize: 6, leaseMs: 60_000 });
    expect(first.rows).toHaveLength(6);
    expect(second.rows).toHaveLength(4);
    expect(third.rows).toHaveLength(0);
    const firstIds = first.rows.map((r) => r.id);
    expect(second.rows.filter((r) => firstIds.includes(r.id))).toEqual([]);
    // A drain in the meantime finds nothing it may send.
    const sent: string[] = [];
    expect(await drainOutbox({ settings: settings(lane), send: async (mail) => void sent.push(mail.to) })).toMatchObject({ claimed: 0, sent: 0 });
    expect(sent).toEqual([]);
  });

  it("a lease that ran out (its worker died) is taken over and sent once, with the row's Message-ID", async () => {
    const lane = newLane("takeover");
    await enqueue(lane, 3);
    const dead = await claimOutboxBatch({ lane, batchSize: 3, leaseMs: 60_000 });
    expect(dead.rows).toHaveLength(3);
    // The dead worker's lease ends: moved into the past rather than waited for.
    await db().sequelize.query("UPDATE outbox_messages SET claimed_until = NOW(3) - INTERVAL 1 SECOND WHERE claim_token = :token", { replacements: { token: dead.claimToken } });
    const sent: { to: string; messageId: string }[] = [];
    expect(await drainOutbox({ settings: settings(lane), send: async (mail) => void sent.push(mail) })).toMatchObject({ claimed: 3, sent: 3, failed: 0 });
    expect(sent.map((m) => m.messageId)).toEqual(dead.rows.map((r) => r.messageId));
    const rows = await rowsOf(lane);
    expect(rows.every((r) => r.sentAt !== null && r.claimToken === null && r.attempts === 1)).toBe(true);
    expect(await drainOutbox({ settings: settings(lane), send: async (mail) => void sent.push(mail) })).toMatchObject({ claimed: 0 });
  });

  it("four workers draining one lane at once send every row exactly once", async () => {
    const lane = newLane("concurrent");
    const count = 150;
    await enqueue(lane, count);
    const sends: string[] = [];
    const worker = async () => {
      for (;;) {
        const result = await drainOutbox({
          settings: settings(lane),
          send: async (mail) => {
            sends.push(mail.messageId);
            // Let the other workers' queries run between this send's steps.
            await new Promise((resolve) => setImmediate(resolve));
          },
        });
        if (result.claimed === 0) return;
      }
    };
    await Promise.all([worker(), worker(), worker(), worker()]);
    const rows = await rowsOf(lane);
    expect(sends).toHaveLength(count);
    expect(new Set(sends).size).toBe(count);
    expect(new Set(sends)).toEqual(new Set(rows.map((r) => r.messageId)));
    expect(rows.filter((r) => r.sentAt === null || r.attempts !== 1)).toEqual([]);
  });

  it("a row another worker took over after this pass's lease ran out is left to it", async () => {
    const lane = newLane("lost-lease");
    await enqueue(lane, 3);
    const sent: number[] = [];
    let stolen = false;
    const result = await drainOutbox({
      settings: settings(lane),
      send: async (mail) => {
        sent.push(Number(mail.to.split("-")[1]));
        if (!stolen) {
          stolen = true;
          // While this pass sends its first row, the others' leases end and another worker claims them.
          await db().sequelize.query("UPDATE outbox_messages SET claim_token = 'another-worker-claim-token-00000000', claimed_until = NOW(3) + INTERVAL 1 MINUTE WHERE lane = :lane AND sent_at IS NULL AND id > (SELECT MIN(id) FROM (SELECT id FROM outbox_messages WHERE lane = :lane) x)", { replacements: { lane } });
        }
      },
    });
    expect(result).toEqual({ claimed: 3, sent: 1, failed: 0, lostLease: 2 });
    expect(sent).toEqual([0]);
  });
});

describe("failures", () => {
  it("count an attempt, keep the error and wait 5 s, then 10 s, on the database's clock; the claim is released", async () => {
    const lane = newLane("failures");
    await enqueue(lane, 1);
    const refuse = async () => {
      throw Object.assign(new Error("Connection refused"), { code: "ECONNREFUSED" });
    };
    expect(await drainOutbox({ settings: settings(lane), send: refuse })).toMatchObject({ claimed: 1, sent: 0, failed: 1 });
    let [row] = await rowsOf(lane);
    expect(row).toMatchObject({ attempts: 1, sentAt: null, claimToken: null, lastError: "ECONNREFUSED Connection refused" });
    expect(Number(row.delayMs)).toBe(5_000);
    // Not due yet: nothing to claim.
    expect(await drainOutbox({ settings: settings(lane), send: refuse })).toMatchObject({ claimed: 0 });

    const makeDue = () => db().sequelize.query("UPDATE outbox_messages SET next_attempt_at = NOW(3) WHERE lane = :lane", { replacements: { lane } });
    await makeDue();
    expect(await drainOutbox({ settings: settings(lane), send: refuse })).toMatchObject({ failed: 1 });
    [row] = await rowsOf(lane);
    expect(row.attempts).toBe(2);
    expect(Number(row.delayMs)).toBe(10_000);

    await makeDue();
    const sent: string[] = [];
    expect(await drainOutbox({ settings: settings(lane), send: async (mail) => void sent.push(mail.messageId) })).toMatchObject({ sent: 1 });
    [row] = await rowsOf(lane);
    expect(row).toMatchObject({ attempts: 3, claimToken: null, lastError: null });
    expect(row.sentAt).not.toBeNull();
    expect(sent).toEqual([row.messageId]);
  });

  it("stopping (SIGTERM) releases the rest of the batch for the next worker at once", async () => {
    const lane = newLane("stop");
    await enqueue(lane, 4);
    let sends = 0;
    const result = await drainOutbox({ settings: settings(lane), send: async () => void (sends += 1), shouldStop: () => sends >= 1 });
    expect(result).toMatchObject({ claimed: 4, sent: 1 });
    const rows = await rowsOf(lane);
    expect(rows.filter((r) => r.sentAt === null).map((r) => r.claimToken)).toEqual([null, null, null]);
    expect((await claimOutboxBatch({ lane, batchSize: 10, leaseMs: 60_000 })).rows).toHaveLength(3);
  });
});

describe("the run's own worker", () => {
  // scripts/test.sh starts scripts/outbox-worker.ts beside the app server, as npm start does.
  it("mails a notice queued in lane mail to the run's fake SMTP server and marks it sent", async () => {
    const to = `notice-${tag}@outbox.example`;
    await db().sequelize.transaction((transaction) =>
      enqueueNotices(transaction, [{ organizationId: null, eventKey: `shared-worker:${tag}`, to, subject: "Sheet submitted for review", text: `Candidate ${tag} awaits review.` }]),
    );
    const mail = await waitForMail(to, 20_000);
    expect(mail.subject).toBe("Sheet submitted for review");
    expect(mail.text).toContain(`Candidate ${tag} awaits review.`);
    const rows = await rowsOf("mail").then((all) => all.filter((r) => r.recipient === to));
    expect(rows).toHaveLength(1);
    await expect.poll(async () => (await rowsOf("mail")).find((r) => r.recipient === to)?.sentAt ?? null, { timeout: 20_000 }).not.toBeNull();
  });
});

describe("organizationMembers", () => {
  it("lists the active members of the roles asked, of that organization only", async () => {
    const made = await makeOrganization();
    const other = await makeOrganization();
    const { User } = db();
    const secondReviewer = await User.create({ organizationId: made.organization.id, email: `z-reviewer-${tag}@factory.example`, name: "Second reviewer", role: "reviewer", passwordHash: "x" });
    await User.create({ organizationId: made.organization.id, email: `disabled-reviewer-${tag}@factory.example`, name: "Disabled", role: "reviewer", passwordHash: "x", disabledAt: new Date() });
    const members = await db().sequelize.transaction((transaction) => organizationMembers(made.organization.id, ["reviewer", "admin"], transaction));
    expect(members).toEqual([made.users.admin.email, made.users.reviewer.email, secondReviewer.email].sort());
    expect(members).not.toContain(other.users.reviewer.email);
    expect(await db().sequelize.transaction((transaction) => organizationMembers(made.organization.id, [], transaction))).toEqual([]);
  });
});
