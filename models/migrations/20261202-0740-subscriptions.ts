import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
// A customer follows a released part (a device) or an organization's device class; a new revision
// or a withdrawal queues one notice per follower. Outbox rows may now carry extra mail headers
// (List-Unsubscribe), and a printout is verified by its PDF's SHA-256, so that column is indexed.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("subscriptions", {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE", onUpdate: "CASCADE" },
    // The organization whose part or class is followed (not the follower's own).
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "organizations", key: "id" }, onDelete: "CASCADE", onUpdate: "CASCADE" },
    // Exactly one of the two: a part, or a device class of the organization.
    // RESTRICT, not CASCADE: MariaDB allows no CHECK on a column with a referential action (devices are never deleted).
    device_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: "devices", key: "id" }, onDelete: "RESTRICT", onUpdate: "RESTRICT" },
    device_class: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  // NULLs never collide in a UNIQUE index, so each index holds one kind of row.
  await qi.addIndex("subscriptions", ["user_id", "device_id"], { unique: true, name: "subscriptions_user_device" });
  await qi.addIndex("subscriptions", ["user_id", "organization_id", "device_class"], { unique: true, name: "subscriptions_user_class" });
  // The notice's recipient queries: followers of a device, followers of an organization's class.
  await qi.addIndex("subscriptions", ["device_id"], { name: "subscriptions_device" });
  await qi.addIndex("subscriptions", ["organization_id", "device_class"], { name: "subscriptions_class" });
  await qi.sequelize.query(
    "ALTER TABLE subscriptions ADD CONSTRAINT subscriptions_one_target CHECK ((device_id IS NULL) <> (device_class IS NULL))",
  );

  await qi.addColumn("outbox_messages", "headers", { type: DataTypes.JSON, allowNull: true });
  await qi.addIndex("sheet_revisions", ["pdf_sha256"], { name: "sheet_revisions_pdf_sha256" });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex("sheet_revisions", "sheet_revisions_pdf_sha256");
  await qi.removeColumn("outbox_messages", "headers");
  await qi.dropTable("subscriptions");
}
