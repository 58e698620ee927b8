import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from the model.
// The conformity watch: a measurement set approved after a release that falls outside a guaranteed
// limit of the current revision, or completes a control-chart test, raises one alert, open until an
// engineer closes it with a reason. A set is checked once against a revision (the UNIQUE pair), so a
// retried approval cannot raise it twice.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable("conformity_alerts", {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    organization_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "organizations", key: "id" }, onDelete: "CASCADE", onUpdate: "CASCADE" },
    device_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "devices", key: "id" }, onDelete: "CASCADE", onUpdate: "CASCADE" },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "sheet_revisions", key: "id" }, onDelete: "RESTRICT", onUpdate: "RESTRICT" },
    measurement_set_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: "measurement_sets", key: "id" }, onDelete: "RESTRICT", onUpdate: "RESTRICT" },
    // What was found: limits the unit falls outside, tests that signalled (lib/sheet/conformity-watch findings).
    findings: { type: DataTypes.JSON, allowNull: false },
    summary: { type: DataTypes.STRING(500), allowNull: false },
    raised_at: { type: DataTypes.DATE(3), allowNull: false },
    // The reviewer whose approval raised it.
    raised_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL", onUpdate: "CASCADE" },
    closed_at: { type: DataTypes.DATE(3), allowNull: true },
    closed_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL", onUpdate: "CASCADE" },
    close_reason: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("conformity_alerts", ["revision_id", "measurement_set_id"], { unique: true, name: "conformity_alerts_revision_set" });
  // The device page and the sheet's open issues: a device's alerts, open ones first.
  await qi.addIndex("conformity_alerts", ["device_id", "closed_at"], { name: "conformity_alerts_device_open" });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("conformity_alerts");
}
