import { randomBytes } from "node:crypto";
import { QueryTypes, type Sequelize } from "sequelize";

/**
 * A secret shared by every app instance on one database, by name: the row in instance_secrets,
 * made on first use from `candidate` (or 32 random bytes) with INSERT IGNORE, so instances that
 * start together agree on the first one written and none keeps a secret of its own.
 */
export async function sharedSecret(sequelize: Sequelize, name: string, candidate?: string): Promise<string> {
  const value = candidate && candidate.length >= 32 ? candidate : randomBytes(32).toString("base64url");
  await sequelize.query("INSERT IGNORE INTO instance_secrets (name, value, created_at) VALUES (:name, :value, NOW(3))", {
    type: QueryTypes.INSERT,
    replacements: { name, value },
  });
  const [row] = await sequelize.query<{ value: string }>("SELECT value FROM instance_secrets WHERE name = :name", {
    type: QueryTypes.SELECT,
    replacements: { name },
  });
  return row.value;
}

/**
 * Runs `fn` while this process holds MariaDB's named lock `name` (GET_LOCK, server-wide, so the
 * name carries the database's), waiting up to `timeoutS` for it: two instances that boot together
 * migrate and seed one after the other, and the second finds nothing left to do. The lock is held
 * by one pooled connection, pinned by an otherwise empty transaction, and released when `fn` ends
 * (or when that connection drops, if the process dies).
 */
export async function withDatabaseLock<T>(sequelize: Sequelize, name: string, timeoutS: number, fn: () => Promise<T>): Promise<T> {
  const lock = `${sequelize.getDatabaseName()}:${name}`.slice(0, 64);
  const transaction = await sequelize.transaction();
  try {
    const [row] = await sequelize.query<{ got: number | null }>("SELECT GET_LOCK(:lock, :timeoutS) AS got", {
      type: QueryTypes.SELECT,
      transaction,
      replacements: { lock, timeoutS },
    });
    if (Number(row?.got) !== 1) throw new Error(`another instance held the database lock "${lock}" for more than ${timeoutS} s`);
    try {
      return await fn();
    } finally {
      await sequelize.query("SELECT RELEASE_LOCK(:lock)", { type: QueryTypes.SELECT, transaction, replacements: { lock } });
    }
  } finally {
    await transaction.commit();
  }
}
