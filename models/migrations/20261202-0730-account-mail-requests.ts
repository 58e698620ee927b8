import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
const kinds = ["sign-up", "password-reset"];

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("account_mail_requests", {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    kind: { type: DataTypes.ENUM(...kinds), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip_address: { type: DataTypes.STRING(64), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("account_mail_requests", ["email", "created_at"]);
  await qi.addIndex("account_mail_requests", ["ip_address", "created_at"]);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("account_mail_requests");
}
