import { DataTypes, type QueryInterface } from "sequelize";

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const createdAt = { created_at: { type: DataTypes.DATE(3), allowNull: false } };
const timestamps = { ...createdAt, updated_at: { type: DataTypes.DATE(3), allowNull: false } };
const ref = (table: string, opts: { allowNull?: boolean; onDelete?: "CASCADE" | "RESTRICT" | "SET NULL" } = {}) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: opts.allowNull ?? false,
  references: { model: table, key: "id" },
  onDelete: opts.onDelete ?? "RESTRICT",
  onUpdate: "CASCADE",
});

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("stored_files", {
    id,
    organization_id: ref("organizations"),
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    original_name: { type: DataTypes.STRING(255), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    bytes: { type: DataTypes.BLOB("long"), allowNull: false },
    ...createdAt,
  });
  await qi.addIndex("stored_files", ["organization_id", "sha256"]);

  await qi.createTable("instruments", {
    id,
    organization_id: ref("organizations"),
    kind: { type: DataTypes.STRING(64), allowNull: false },
    model: { type: DataTypes.STRING(160), allowNull: false },
    serial: { type: DataTypes.STRING(64), allowNull: false },
    calibrated_on: { type: DataTypes.DATEONLY, allowNull: false },
    calibration_due_on: { type: DataTypes.DATEONLY, allowNull: false },
    uncertainty: { type: DataTypes.JSON, allowNull: false },
    retired_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex("instruments", ["organization_id", "serial"], { unique: true, name: "instruments_org_serial" });

  await qi.createTable("bench_tokens", {
    id,
    organization_id: ref("organizations"),
    created_by_id: ref("users"),
    name: { type: DataTypes.STRING(120), allowNull: false },
    token_prefix: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    last_used_at: { type: DataTypes.DATE(3), allowNull: true },
    revoked_at: { type: DataTypes.DATE(3), allowNull: true },
    ...createdAt,
  });

  await qi.createTable("column_mappings", {
    id,
    organization_id: ref("organizations"),
    created_by_id: ref("users"),
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.STRING(32), allowNull: false },
    header_signature: { type: DataTypes.CHAR(64), allowNull: false },
    mapping: { type: DataTypes.JSON, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex("column_mappings", ["organization_id", "header_signature"], { unique: true, name: "column_mappings_org_signature" });

  await qi.createTable("measurement_sets", {
    id,
    organization_id: ref("organizations"),
    device_id: ref("devices"),
    stored_file_id: ref("stored_files"),
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    kind: { type: DataTypes.STRING(32), allowNull: false },
    state: { type: DataTypes.ENUM("submitted", "approved", "rejected"), allowNull: false },
    supersedes_id: ref("measurement_sets", { allowNull: true, onDelete: "SET NULL" }),
    superseded_by_id: ref("measurement_sets", { allowNull: true, onDelete: "SET NULL" }),
    conditions: { type: DataTypes.JSON, allowNull: false },
    parsed: { type: DataTypes.JSON, allowNull: false },
    parameters: { type: DataTypes.JSON, allowNull: false },
    curves: { type: DataTypes.JSON, allowNull: false },
    warnings: { type: DataTypes.JSON, allowNull: false },
    measured_on: { type: DataTypes.DATEONLY, allowNull: true },
    source: { type: DataTypes.ENUM("browser", "bench-api"), allowNull: false },
    uploaded_by_id: ref("users", { allowNull: true, onDelete: "SET NULL" }),
    bench_token_id: ref("bench_tokens", { allowNull: true, onDelete: "SET NULL" }),
    reviewed_by_id: ref("users", { allowNull: true, onDelete: "SET NULL" }),
    reviewed_at: { type: DataTypes.DATE(3), allowNull: true },
    rejection_reason: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  // The same file twice on one device is refused; the index is the backstop under concurrency.
  await qi.addIndex("measurement_sets", ["device_id", "sha256"], { unique: true, name: "measurement_sets_device_sha256" });
  await qi.addIndex("measurement_sets", ["organization_id", "state"]);

  await qi.createTable("measurement_set_instruments", {
    measurement_set_id: { ...ref("measurement_sets", { onDelete: "CASCADE" }), primaryKey: true },
    instrument_id: { ...ref("instruments"), primaryKey: true },
    calibration_lapsed: { type: DataTypes.BOOLEAN, allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ["measurement_set_instruments", "measurement_sets", "column_mappings", "bench_tokens", "instruments", "stored_files"]) {
    await qi.dropTable(table);
  }
}
