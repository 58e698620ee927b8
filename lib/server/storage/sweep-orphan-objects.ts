import { QueryTypes, type Sequelize } from "sequelize";
import { claimObjectKey } from "./claim-object-key";
import { contentKeySha256 } from "./object-key";
import { keyReferencesSql, referencedObjectsSql } from "./object-references";
import type { ListedObject, ObjectStore } from "./object-store";

/** What the sweep did with one object of the bucket. */
export type SweepOutcome =
  /** a row of objectReferences refers to it */
  | "referenced"
  /** unreferenced, but written less than the grace period ago (perhaps by a write whose commit is still to come) */
  | "young"
  /** not a content key (sha256/xx/…): not ours to judge */
  | "foreign"
  /** a row came to refer to it after the listing, found under the key's claim */
  | "referenced-since-listing"
  | "deleted"
  /** dry run: it would have been deleted */
  | "would-delete"
  /** the delete (or the claim) failed; the object stays */
  | "failed";

export type SweptObject = ListedObject & { outcome: SweepOutcome; detail?: string };

export type SweepReport = { at: Date; graceMs: number; dryRun: boolean; objects: SweptObject[]; counts: Record<SweepOutcome, number>; deletedBytes: number };

/**
 * Deletes the objects of the store that nothing in the database refers to and that are older than
 * the grace period: copies left by a write whose transaction then rolled back (the store took the
 * bytes, the commit failed). Objects are content-keyed and may be shared by several rows, so the
 * rule is per key, over every column of objectReferences.
 *
 * 1. List the bucket (each object with the store's LastModified), then read every referenced key
 *    from the primary: a row committed before that read keeps its object.
 * 2. An unreferenced object younger than `graceMs` (measured by `now`, injectable for tests) is kept.
 * 3. Each remaining one, in a transaction of its own: claim its key (claimObjectKey: waits for any
 *    write of the same bytes still on its way to its commit, and holds it off until we are done),
 *    count its references again (that plain read is the transaction's first, so its snapshot is
 *    taken after the claim and sees what such a writer committed), and only when there are none
 *    delete the object and the claim row. A writer that comes later waits for the claim and then
 *    puts the bytes again, so it never refers to a deleted object.
 * Run one at a time (scripts/storage-sweep.ts holds withDatabaseLock); `dryRun` decides and deletes nothing.
 */
export async function sweepOrphanObjects(opts: {
  store: ObjectStore;
  sequelize: Sequelize;
  graceMs: number;
  dryRun?: boolean;
  now?: () => Date;
}): Promise<SweepReport> {
  const { store, sequelize, graceMs } = opts;
  const dryRun = opts.dryRun ?? false;
  const listed: ListedObject[] = [];
  for await (const object of store.list("sha256/")) listed.push(object);
  const referenced = new Set(
    (await sequelize.query<{ k: string }>(referencedObjectsSql, { type: QueryTypes.SELECT })).map((r) => r.k),
  );
  const at = (opts.now ?? (() => new Date()))();
  const objects: SweptObject[] = [];
  for (const object of listed) {
    const sha256 = contentKeySha256(object.key);
    if (!sha256) objects.push({ ...object, outcome: "foreign" });
    else if (referenced.has(object.key)) objects.push({ ...object, outcome: "referenced" });
    else if (at.getTime() - object.lastModified.getTime() < graceMs) objects.push({ ...object, outcome: "young" });
    else if (dryRun) objects.push({ ...object, outcome: "would-delete" });
    else objects.push(await deleteUnlessReferenced(opts, object, sha256));
  }
  const counts = { referenced: 0, young: 0, foreign: 0, "referenced-since-listing": 0, deleted: 0, "would-delete": 0, failed: 0 } satisfies Record<SweepOutcome, number>;
  for (const o of objects) counts[o.outcome] += 1;
  const deletedBytes = objects.filter((o) => o.outcome === "deleted").reduce((sum, o) => sum + o.sizeBytes, 0);
  return { at, graceMs, dryRun, objects, counts, deletedBytes };
}

async function deleteUnlessReferenced({ store, sequelize }: { store: ObjectStore; sequelize: Sequelize }, object: ListedObject, sha256: string): Promise<SweptObject> {
  try {
    const outcome = await sequelize.transaction(async (transaction) => {
      await claimObjectKey(sequelize, object.key, transaction);
      const [row] = await sequelize.query<{ n: number }>(keyReferencesSql, { type: QueryTypes.SELECT, replacements: { key: object.key, sha256 }, transaction });
      if (Number(row.n) > 0) return "referenced-since-listing" as const;
      await store.delete(object.key);
      await sequelize.query("DELETE FROM stored_object_claims WHERE storage_key = :key", { replacements: { key: object.key }, transaction });
      return "deleted" as const;
    });
    return { ...object, outcome };
  } catch (error) {
    const e = error as Error & { detail?: string };
    return { ...object, outcome: "failed", detail: e.detail || e.message };
  }
}
