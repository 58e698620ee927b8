import "server-only";
import { QueryTypes, type Sequelize } from "sequelize";
import { isAppError } from "@/lib/errors";
import { onShutdown } from "@/lib/shutdown";
import { db } from "@/models";
import { createSequelize, readDatabaseSettings, readReplicaHosts } from "@/models/connection";
import { isDatabaseUnavailable } from "./database-unavailable";

/**
 * Reads of released, public data (the catalog search, the sitemap, a released sheet's page, JSON,
 * compare and PDF lookup, the verification of a printout) that may come from a MariaDB read replica
 * when DB_REPLICA_HOSTS names some; everything else, and these too without replicas, goes to the
 * primary through db().
 *
 * Why a second Sequelize and not `replication` on db()'s: Sequelize sends every SELECT outside a
 * transaction to its read pool, so the workspace would read its own writes from a replica that may
 * not have them yet (save a sheet, reload, see the old one). db() stays on the primary; only the
 * calls below use this instance, whose `replication` has the replicas as `read` (taken in turn) and
 * the primary as `write`.
 *
 * Sequelize neither notices a replica that is down nor one that lags, so this does:
 *   - a replica that cannot be reached (connection refused, lost, timed out) is passed over for
 *     DOWN_MS and the read runs on the primary at once, so the caller never sees the failure;
 *   - at most every DB_REPLICA_CHECK_MS (2000) a probe reads SHOW SLAVE STATUS on a replica: when
 *     replication is stopped (Seconds_Behind_Master NULL) or further behind than
 *     DB_REPLICA_MAX_LAG_SECONDS (5), reads go to the primary until a later probe finds it caught up.
 *     The probe needs SLAVE MONITOR on the replica (scripts/replica.sh grants it); without it the
 *     replica counts as lagging and a warning is logged once.
 * Only SELECT (or WITH) statements are accepted: a write is refused here, before any connection.
 */

const DOWN_MS = 5_000;

type State = { sequelize: Sequelize; downUntil: number; checkedAt: number; fresh: boolean; probing: Promise<void> | null; warned: boolean };
let state: State | null | undefined;

function replicaState(): State | null {
  if (state === undefined) {
    const replicas = readReplicaHosts();
    if (!replicas.length) {
      state = null;
    } else {
      state = { sequelize: createSequelize(readDatabaseSettings(), replicas), downUntil: 0, checkedAt: 0, fresh: false, probing: null, warned: false };
      onShutdown("replica pool", closePublicReads);
    }
  }
  return state;
}

/** Closes the replica pool (on shutdown, and in tests before settings change). */
export async function closePublicReads(): Promise<void> {
  const closing = state;
  state = undefined;
  if (closing) await closing.sequelize.close();
}

const checkMs = () => Number(process.env.DB_REPLICA_CHECK_MS ?? 2000);
const maxLagS = () => Number(process.env.DB_REPLICA_MAX_LAG_SECONDS ?? 5);

/** Where the next public read goes, after a probe of the replica's lag when the last one is old. */
async function replicaUsable(s: State): Promise<boolean> {
  if (Date.now() < s.downUntil) return false;
  if (Date.now() - s.checkedAt >= checkMs()) {
    s.probing ??= probe(s).finally(() => {
      s.probing = null;
    });
    await s.probing;
  }
  return s.fresh && Date.now() >= s.downUntil;
}

async function probe(s: State): Promise<void> {
  try {
    const [status] = await s.sequelize.query<{ Seconds_Behind_Master: number | null }>("SHOW SLAVE STATUS", { type: QueryTypes.SELECT });
    const behind = status?.Seconds_Behind_Master;
    s.fresh = behind !== null && behind !== undefined && Number(behind) <= maxLagS();
  } catch (error) {
    s.fresh = false;
    if (isDatabaseUnavailable(error)) {
      s.downUntil = Date.now() + DOWN_MS;
    } else if (!s.warned) {
      s.warned = true;
      console.warn(`[benchfold] cannot read the replica's lag (${(error as Error).message}); public reads stay on the primary`);
    }
  }
  s.checkedAt = Date.now();
}

/** How a read-only statement reaches the database: publicSelect or primarySelect. */
export type SelectRows = <T extends object>(sql: string, replacements?: unknown[] | Record<string, unknown>) => Promise<T[]>;

/** A read-only statement on the primary (db()): what the workspace reads, so it always sees its own writes. */
export const primarySelect: SelectRows = (sql, replacements) => db().sequelize.query(sql, { type: QueryTypes.SELECT, replacements });

/** A read-only statement over released data, from a replica when one is up and caught up, else from the primary. */
export async function publicSelect<T extends object>(sql: string, replacements?: unknown[] | Record<string, unknown>): Promise<T[]> {
  if (!/^\s*\(?\s*(SELECT|WITH)\b/i.test(sql)) throw new Error("publicSelect runs SELECT statements only");
  const s = replicaState();
  const options = { type: QueryTypes.SELECT, replacements } as const;
  if (s && (await replicaUsable(s))) {
    try {
      return await s.sequelize.query<T>(sql, options);
    } catch (error) {
      if (!isDatabaseUnavailable(error)) throw error;
      s.downUntil = Date.now() + DOWN_MS;
      console.warn(`[benchfold] a read replica did not answer (${(error as Error).message}); public reads go to the primary for ${DOWN_MS / 1000} s`);
    }
  }
  return primarySelect<T>(sql, replacements);
}

/**
 * A public lookup by address (a released revision, a verification reference, a printout's hash):
 * `find` runs with publicSelect, and once more with primarySelect when that answers AppError
 * "not-found" while replicas are configured. A replica may lag a little behind (at most
 * DB_REPLICA_MAX_LAG_SECONDS), and the release panel links to the new revision's page at once: so a
 * revision released a moment ago is found on the primary rather than answered 404. Anything a
 * replica has, the primary has too, so a lookup the replica answers needs no second look.
 */
export async function publicLookup<T>(find: (select: SelectRows) => Promise<T>): Promise<T> {
  if (!replicaState()) return find(primarySelect);
  try {
    return await find(publicSelect);
  } catch (error) {
    if (isAppError(error) && error.code === "not-found") return find(primarySelect);
    throw error;
  }
}
