/**
 * The outbox worker: mails the notices that review and release events queue in outbox_messages
 * (lib/server/outbox/enqueue-notices.ts), in its own process beside the app server. `npm start`
 * and `npm test` start it; run it alone with
 *
 *   node --conditions=react-server --import tsx scripts/outbox-worker.ts
 *
 * (the condition makes lib/server's `server-only` guard the empty module it is in the app's
 * server bundles). It polls every BENCHFOLD_OUTBOX_POLL_MS (1 s), claims up to
 * BENCHFOLD_OUTBOX_BATCH rows of its lane (BENCHFOLD_OUTBOX_LANE, "mail") for
 * BENCHFOLD_OUTBOX_LEASE_MS (2 min), sends each through the app's SMTP settings with the row's
 * fixed Message-ID and marks it sent; a failed send is retried after 5 s, 10 s, 20 s … up to
 * 10 min (BENCHFOLD_OUTBOX_RETRY_BASE_MS, BENCHFOLD_OUTBOX_RETRY_CAP_MS). Any number of workers
 * may run at once: a claimed row belongs to one of them until its lease ends.
 *
 * Delivery guarantee: none is lost, and a crash costs at most one duplicate. A notice is marked
 * sent only after the relay accepted it, so an outage of the relay or of the database delays
 * it and never drops it. A worker that dies after the relay accepted a notice and before it
 * marked the row sent leaves the row claimed; when the lease ends a worker sends it again, with
 * the same Message-ID, so a mail client that drops repeated Message-IDs shows it once. SIGTERM
 * and SIGINT finish the mail in flight, release the rest of the batch and exit 0.
 */
import { closeDb } from "../models";
import { createOutboxSender } from "../lib/server/outbox/create-outbox-sender";
import { drainOutbox, type DrainResult } from "../lib/server/outbox/drain-outbox";
import { readOutboxSettings } from "../lib/server/outbox/outbox-settings";

const log = (message: string) => console.log(`${new Date().toISOString()} outbox-worker[${process.pid}] ${message}`);

async function main() {
  const settings = readOutboxSettings();
  const sender = createOutboxSender();
  let stopping = false;
  let wake: (() => void) | undefined;
  const stop = (signal: string) => {
    if (!stopping) log(`${signal}: stopping after the mail in flight`);
    stopping = true;
    wake?.();
  };
  process.on("SIGTERM", () => stop("SIGTERM"));
  process.on("SIGINT", () => stop("SIGINT"));

  log(`draining lane '${settings.lane}' to ${process.env.SMTP_HOST ?? "127.0.0.1"}:${process.env.SMTP_PORT ?? 2525} (batch ${settings.batchSize}, lease ${settings.leaseMs} ms, poll ${settings.pollMs} ms)`);
  let failing = false;
  while (!stopping) {
    let result: DrainResult | null = null;
    try {
      result = await drainOutbox({ settings, send: sender.send, shouldStop: () => stopping });
      if (failing) log("draining again");
      failing = false;
      if (result.claimed > 0) log(`claimed ${result.claimed}: sent ${result.sent}, failed ${result.failed}${result.lostLease ? `, lease lost ${result.lostLease}` : ""}`);
    } catch (error) {
      // The database is down or a query failed: claimed rows stay claimed until their lease ends.
      if (!failing) log(`drain failed, retrying every ${settings.pollMs} ms: ${String((error as Error).message).split("\n")[0]}`);
      failing = true;
    }
    // A full batch means more may be due at once; otherwise wait for the next poll (or a signal).
    if (!stopping && (result === null || result.claimed < settings.batchSize)) {
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, settings.pollMs);
        wake = () => {
          clearTimeout(timer);
          resolve();
        };
      });
      wake = undefined;
    }
  }
  sender.close();
  await closeDb();
  log("stopped");
}

main().catch(async (error) => {
  log(`stopped on an error: ${(error as Error).stack ?? error}`);
  await closeDb().catch(() => undefined);
  process.exit(1);
});
