/**
 * npm run storage:sweep [-- --dry-run] [--grace-hours N]: deletes the objects of the file store that
 * no database row refers to and that the store last wrote more than the grace period ago (default
 * 24 h, or BENCHFOLD_SWEEP_GRACE_HOURS): copies left by a write whose database commit then failed.
 * The rules are sweepOrphanObjects' (lib/server/storage/sweep-orphan-objects.ts). Prints every object
 * it deleted (or, with --dry-run, would delete) and every unreferenced one it kept, and how many
 * referenced ones it kept. Runs under the database lock "benchfold-storage-sweep", so two instances
 * never sweep at once; exits 1 when that lock is held, or when a delete failed.
 * Settings: DB_* as the app (scripts/lib.sh), S3_* (lib/server/storage/storage-config.ts).
 */
import { formatByteSize } from "../lib/format/byte-size";
import { createS3ObjectStore } from "../lib/server/storage/object-store";
import { readStorageSettings } from "../lib/server/storage/storage-config";
import { sweepOrphanObjects, type SweepOutcome } from "../lib/server/storage/sweep-orphan-objects";
import { createSequelize, readDatabaseSettings, withDatabaseLock } from "../models";

const HOUR_MS = 3_600_000;

/** The grace period in hours: --grace-hours, else BENCHFOLD_SWEEP_GRACE_HOURS, else 24; a number of 0 or more. */
function graceHours(argv: string[], env: Record<string, string | undefined>): number {
  const i = argv.indexOf("--grace-hours");
  const [text, from] = i >= 0 ? [argv[i + 1], "--grace-hours"] : [env.BENCHFOLD_SWEEP_GRACE_HOURS, "BENCHFOLD_SWEEP_GRACE_HOURS"];
  if (text === undefined || text === "") {
    if (i >= 0) throw new Error("--grace-hours needs a number of hours (0 or more)");
    return 24;
  }
  const hours = Number(text);
  if (!/^\d+(\.\d+)?$/.test(text.trim()) || !Number.isFinite(hours)) throw new Error(`${from}: "${text}" is not a number of hours (0 or more)`);
  return hours;
}

const words: Record<SweepOutcome, string> = {
  referenced: "kept (referenced)",
  young: "kept (younger than the grace period)",
  foreign: "kept (not a content key)",
  "referenced-since-listing": "kept (referenced since the listing)",
  deleted: "deleted",
  "would-delete": "would delete",
  failed: "kept (delete failed)",
};

async function main(): Promise<number> {
  const argv = process.argv.slice(2);
  const unknown = argv.filter((a, i) => a.startsWith("--") && a !== "--dry-run" && a !== "--grace-hours" && argv[i - 1] !== "--grace-hours");
  if (unknown.length) throw new Error(`unknown option ${unknown.join(", ")} (use --dry-run and --grace-hours N)`);
  const hours = graceHours(argv, process.env);
  const dryRun = argv.includes("--dry-run");
  const store = createS3ObjectStore(readStorageSettings());
  const sequelize = createSequelize(readDatabaseSettings());
  try {
    const report = await withDatabaseLock(sequelize, "benchfold-storage-sweep", 5, () => sweepOrphanObjects({ store, sequelize, graceMs: hours * HOUR_MS, dryRun }));
    for (const o of report.objects) {
      if (o.outcome === "referenced") continue;
      const age = (report.at.getTime() - o.lastModified.getTime()) / HOUR_MS;
      console.log(`${words[o.outcome]}: ${o.key} (${formatByteSize(o.sizeBytes, { plain: true })}, written ${o.lastModified.toISOString()}, ${age.toFixed(1)} h ago)${o.detail ? `: ${o.detail}` : ""}`);
    }
    const c = report.counts;
    console.log(
      `[benchfold] storage sweep${dryRun ? " (dry run: nothing deleted)" : ""} of ${store.description}, grace ${hours} h: ${report.objects.length} objects; ` +
        `kept ${c.referenced} referenced, ${c.young} younger than ${hours} h, ${c["referenced-since-listing"]} referenced since the listing, ${c.foreign} not content keys; ` +
        `${dryRun ? `would delete ${c["would-delete"]}` : `deleted ${c.deleted} (${formatByteSize(report.deletedBytes, { plain: true })})`}; ${c.failed} failed`,
    );
    return c.failed ? 1 : 0;
  } finally {
    await sequelize.close();
  }
}

main().then(
  (code) => process.exit(code),
  (error: Error) => {
    console.error(`[benchfold] storage sweep failed: ${error.message}`);
    process.exit(1);
  },
);
