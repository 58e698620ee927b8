import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
// Secrets every app instance must share (next-auth's signing secret), made once per database by
// the first instance that starts (models/instance-secrets.ts), so no host has one of its own.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("instance_secrets", {
    name: { type: DataTypes.STRING(64), primaryKey: true, allowNull: false },
    value: { type: DataTypes.STRING(255), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("instance_secrets");
}
