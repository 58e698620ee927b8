import { DataTypes, type QueryInterface } from "sequelize";

// The lists as they stood when this step was written: a migration describes the schema of its
// day, so it copies the values instead of importing the live lists (lib/domain), which grow.
const organizationKinds = ["vendor", "lab", "customer"];
const userRoles = ["admin", "engineer", "reviewer", "customer"];
const deviceClasses = ["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"];

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const ref = (table: string, onDelete: "CASCADE" | "RESTRICT" | "SET NULL" = "RESTRICT", allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
  onUpdate: "CASCADE",
});

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("organizations", {
    id,
    slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.ENUM(...organizationKinds), allowNull: false },
    ...timestamps,
  });
  await qi.createTable("users", {
    id,
    organization_id: ref("organizations"),
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.ENUM(...userRoles), allowNull: false },
    disabled_at: { type: DataTypes.DATE(3), allowNull: true },
    token_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    last_sign_in_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex("users", ["organization_id"]);
  await qi.createTable("invitations", {
    id,
    organization_id: ref("organizations", "CASCADE"),
    invited_by_id: ref("users"),
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM(...userRoles), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    accepted_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.createTable("password_resets", {
    id,
    user_id: ref("users", "CASCADE"),
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.createTable("sign_in_attempts", {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip_address: { type: DataTypes.STRING(64), allowNull: false },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("sign_in_attempts", ["email", "created_at"]);
  await qi.addIndex("sign_in_attempts", ["ip_address", "created_at"]);
  await qi.createTable("audit_events", {
    id,
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    actor_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    action: { type: DataTypes.STRING(64), allowNull: false },
    subject_type: { type: DataTypes.STRING(64), allowNull: false },
    subject_id: { type: DataTypes.STRING(64), allowNull: false },
    before: { type: DataTypes.JSON, allowNull: true },
    after: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("audit_events", ["organization_id", "created_at"]);
  await qi.addIndex("audit_events", ["subject_type", "subject_id"]);
  // Append-only in the database itself, not only by convention in the code.
  for (const op of ["UPDATE", "DELETE"]) {
    await qi.sequelize.query(
      `CREATE TRIGGER audit_events_no_${op.toLowerCase()} BEFORE ${op} ON audit_events FOR EACH ROW ` +
        `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_events is append-only'`,
    );
  }
  await qi.createTable("devices", {
    id,
    organization_id: ref("organizations"),
    created_by_id: ref("users", "SET NULL", true),
    part_number: { type: DataTypes.STRING(64), allowNull: false },
    device_class: { type: DataTypes.ENUM(...deviceClasses), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    key_conditions: { type: DataTypes.JSON, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex("devices", ["organization_id", "part_number"], { unique: true, name: "devices_org_part_number" });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("devices");
  await qi.sequelize.query("DROP TRIGGER IF EXISTS audit_events_no_update");
  await qi.sequelize.query("DROP TRIGGER IF EXISTS audit_events_no_delete");
  for (const table of ["audit_events", "sign_in_attempts", "password_resets", "invitations", "users", "organizations"]) {
    await qi.dropTable(table);
  }
}
