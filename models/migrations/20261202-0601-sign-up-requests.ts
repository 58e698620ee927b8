import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("sign_up_requests", {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    company: { type: DataTypes.STRING(160), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("sign_up_requests", ["email"]);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("sign_up_requests");
}
