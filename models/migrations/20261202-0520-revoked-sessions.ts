import { DataTypes, type QueryInterface } from "sequelize";

// Sign-out ends one session on the server: its id is listed here until the session would have expired.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("revoked_sessions", {
    session_id: { type: DataTypes.CHAR(36), primaryKey: true, allowNull: false },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: "users", key: "id" },
      onDelete: "CASCADE",
      onUpdate: "CASCADE",
    },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("revoked_sessions", ["expires_at"]);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("revoked_sessions");
}
