import { QueryTypes, type Sequelize, type Transaction } from "sequelize";

/**
 * Locks the object key's row of stored_object_claims in `transaction` (made when missing), until
 * that transaction ends. Every write that will refer to an object (putObject) claims its key before
 * putting the bytes, and the orphan sweep claims a key before it checks the key's references and
 * deletes the object: so a sweep either sees the writer's committed row (and keeps the object), or
 * deletes first and the writer, which waited, puts the bytes again after it. Content keys make two
 * uploads of the same bytes share a key; they take turns here, from the write to their commit.
 */
export async function claimObjectKey(sequelize: Sequelize, key: string, transaction: Transaction): Promise<void> {
  await sequelize.query("INSERT INTO stored_object_claims (storage_key, claimed_at) VALUES (:key, NOW(3)) ON DUPLICATE KEY UPDATE claimed_at = NOW(3)", {
    type: QueryTypes.INSERT,
    replacements: { key },
    transaction,
  });
}
