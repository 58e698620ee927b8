/**
 * Outbox drain rate (run by `npm run bench`, not by `npm test`): notices queued through
 * enqueueNotices and mailed by drainOutbox, the worker's own pass, to an SMTP server started
 * here that takes every message. Reported: queueing time, mails per second from one worker with
 * its pooled connection, from two workers at once, and from one worker opening a connection per
 * mail (what the pool saves). Nothing is asserted on the figures; each run checks only that every
 * row was sent exactly once.
 *
 * It needs the MariaDB instance (`npm run db:start`) with a migrated database: by default
 * benchfold_test, which every `npm test` run makes afresh; DB_NAME picks another. Its rows are in
 * a lane of their own (no running worker takes them) and are deleted afterwards.
 */
import { randomBytes } from "node:crypto";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

const perRun = Number(process.env.BENCH_OUTBOX_MAILS ?? 300);

it("times queueing and draining the notice outbox", { timeout: 600_000 }, async () => {
  let received = 0;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, callback) {
      stream.resume();
      stream.on("end", () => {
        received += 1;
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => smtp.listen(0, "127.0.0.1", resolve));
  process.env.SMTP_HOST = "127.0.0.1";
  process.env.SMTP_PORT = String((smtp.server.address() as AddressInfo).port);
  process.env.BENCHFOLD_FAKE_SMTP = "1";
  process.env.DB_NAME ??= "benchfold_test";

  const { db, closeDb } = await import("@/models");
  const { OutboxMessage, sequelize } = db();
  try {
    await OutboxMessage.count();
  } catch (error) {
    console.log(`outbox bench skipped: no migrated database ${process.env.DB_NAME} (${(error as Error).message.split("\n")[0]}); run npm run db:start, and npm test once`);
    smtp.close();
    expect(true).toBe(true);
    return;
  }
  const nodemailer = (await import("nodemailer")).default;
  const { enqueueNotices } = await import("@/lib/server/outbox/enqueue-notices");
  const { drainOutbox } = await import("@/lib/server/outbox/drain-outbox");
  const { createOutboxSender } = await import("@/lib/server/outbox/create-outbox-sender");
  const { smtpTransportOptions } = await import("@/lib/server/mail/send-mail");

  const tag = randomBytes(4).toString("hex");
  const lines: string[] = [];
  const settings = (lane: string) => ({ lane, batchSize: 20, leaseMs: 120_000, retryBaseMs: 5_000, retryCapMs: 600_000 });

  async function queue(lane: string): Promise<number> {
    const started = performance.now();
    await sequelize.transaction((transaction) =>
      enqueueNotices(
        transaction,
        Array.from({ length: perRun }, (_, i) => ({
          organizationId: null,
          eventKey: `bench:${lane}`,
          to: `reader-${i}-${tag}@bench.example`,
          subject: "Revision B of FX-BENCH released",
          text: "Revision B of FX-BENCH, a frequency doubler you follow, was released.\n".repeat(8),
          lane,
        })),
      ),
    );
    return performance.now() - started;
  }

  async function drain(name: string, laneName: string, workers: { send: Parameters<typeof drainOutbox>[0]["send"] }[]) {
    const lane = `bench-${laneName}-${tag}`;
    const queueMs = await queue(lane);
    received = 0;
    const started = performance.now();
    await Promise.all(
      workers.map(async (worker) => {
        for (;;) if ((await drainOutbox({ settings: settings(lane), send: worker.send })).claimed === 0) return;
      }),
    );
    const seconds = (performance.now() - started) / 1000;
    const [unsent] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM outbox_messages WHERE lane = :lane AND sent_at IS NULL", { type: "SELECT" as never, replacements: { lane } });
    expect(Number(unsent.n)).toBe(0);
    expect(received).toBe(perRun);
    lines.push(`${name.padEnd(34)} ${perRun} mails in ${seconds.toFixed(2)} s = ${(perRun / seconds).toFixed(1)} mails/s (queued in one transaction in ${queueMs.toFixed(0)} ms)`);
    await sequelize.query("DELETE FROM outbox_messages WHERE lane = :lane", { replacements: { lane } });
  }

  const pooled = createOutboxSender();
  await drain("one worker, pooled connection", "pooled", [pooled]);
  const second = createOutboxSender();
  await drain("two workers, a pooled connection each", "two", [pooled, second]);
  second.close();
  pooled.close();
  const perMail = nodemailer.createTransport(smtpTransportOptions());
  await drain("one worker, a connection per mail", "unpooled", [{ send: async (mail) => void (await perMail.sendMail({ from: "bench@bench.example", ...mail })) }]);
  perMail.close();

  console.log(["", "outbox drain (drainOutbox → local SMTP server, MariaDB on this machine):", ...lines.map((l) => `  ${l}`), ""].join("\n"));
  smtp.close();
  await closeDb();
});
