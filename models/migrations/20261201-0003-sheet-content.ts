import { DataTypes, type QueryInterface } from "sequelize";

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const ref = (table: string, allowNull = false, onDelete: "CASCADE" | "RESTRICT" | "SET NULL" = "RESTRICT") => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
  onUpdate: "CASCADE",
});

export async function up({ context: qi }: { context: QueryInterface }) {
  // What the organization accepts as capable, and the tolerance interval its sheets quote.
  await qi.addColumn("organizations", "cpk_threshold", { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.33 });
  await qi.addColumn("organizations", "tolerance_coverage", { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.99 });
  await qi.addColumn("organizations", "tolerance_confidence", { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.95 });

  await qi.createTable("spec_limits", {
    id,
    organization_id: ref("organizations"),
    device_id: ref("devices", false, "CASCADE"),
    parameter: { type: DataTypes.STRING(64), allowNull: false },
    conditions_key: { type: DataTypes.STRING(255), allowNull: false },
    min_value: { type: DataTypes.DOUBLE, allowNull: true },
    typ_value: { type: DataTypes.DOUBLE, allowNull: true },
    max_value: { type: DataTypes.DOUBLE, allowNull: true },
    unit: { type: DataTypes.STRING(16), allowNull: false },
    basis: { type: DataTypes.ENUM("test", "characterization", "design"), allowNull: false },
    footnote: { type: DataTypes.STRING(500), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex("spec_limits", ["device_id", "parameter", "conditions_key"], { unique: true, name: "spec_limits_device_parameter_conditions" });

  await qi.createTable("sheet_contents", {
    id,
    organization_id: ref("organizations"),
    device_id: { ...ref("devices", false, "CASCADE"), unique: true },
    prose: { type: DataTypes.JSON, allowNull: false },
    absolute_maximum_ratings: { type: DataTypes.JSON, allowNull: false },
    measurement_uncertainty: { type: DataTypes.JSON, allowNull: false },
    updated_by_id: ref("users", true, "SET NULL"),
    ...timestamps,
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("sheet_contents");
  await qi.dropTable("spec_limits");
  for (const column of ["cpk_threshold", "tolerance_coverage", "tolerance_confidence"]) await qi.removeColumn("organizations", column);
}
