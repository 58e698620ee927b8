import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
// A row per object key that a transaction is about to write and refer to: the writer locks it (INSERT …
// ON DUPLICATE KEY UPDATE) before putting the object and holds the lock until it commits, and the
// orphan sweep locks it before deleting, so a sweep never deletes an object that an upload of the
// same bytes is about to refer to (lib/server/storage/claim-object-key.ts). And an index for the
// sweep's per-key look-up of stored_files (sheet_revisions is looked up by its indexed pdf_sha256).
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("stored_object_claims", {
    storage_key: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    claimed_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("stored_files", ["storage_key"], { name: "stored_files_storage_key" });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex("stored_files", "stored_files_storage_key");
  await qi.dropTable("stored_object_claims");
}
