import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
// Notices (review and release events) are written here in the event's own transaction and sent
// by the outbox worker (scripts/outbox-worker.ts); see DEVELOPERS.md, "Notices (outbox)".
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("outbox_messages", {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    // A worker drains only the rows of its own lane ("mail" unless configured otherwise).
    lane: { type: DataTypes.STRING(40), allowNull: false, defaultValue: "mail" },
    organization_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: true,
      references: { model: "organizations", key: "id" },
      onDelete: "SET NULL",
      onUpdate: "CASCADE",
    },
    event_key: { type: DataTypes.STRING(191), allowNull: false },
    recipient: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(255), allowNull: false },
    body_text: { type: DataTypes.TEXT("medium"), allowNull: false },
    // Fixed when the row is written, so every delivery attempt carries the same Message-ID.
    message_id: { type: DataTypes.STRING(255), allowNull: false, unique: true },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    claim_token: { type: DataTypes.CHAR(36), allowNull: true },
    claimed_until: { type: DataTypes.DATE(3), allowNull: true },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    last_error: { type: DataTypes.STRING(500), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  // One event never queues two mails to one person.
  await qi.addIndex("outbox_messages", ["event_key", "recipient"], { unique: true, name: "outbox_messages_event_recipient" });
  // The worker's claim: unsent rows of a lane that are due, oldest first.
  await qi.addIndex("outbox_messages", ["lane", "sent_at", "next_attempt_at"], { name: "outbox_messages_due" });
  await qi.addIndex("outbox_messages", ["claim_token"], { name: "outbox_messages_claim" });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("outbox_messages");
}
