import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from a model. The catalog's search index of released
// revisions: written by the release transaction (lib/server/catalog/index-released-revision.ts) from the
// frozen model; the revisions released before this migration are filled below, in SQL, from the same
// frozen model (JSON_TABLE over its specification rows) and the device's key conditions.

const ref = (table: string) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull: false,
  references: { model: table, key: "id" },
  onDelete: "RESTRICT",
  onUpdate: "RESTRICT",
});
const double = { type: DataTypes.DOUBLE, allowNull: true };

const releasedSheetColumns = `revision_id, organization_id, device_id, device_class, part_number, title, letter,
  input_min_hz, input_max_hz, output_min_hz, output_max_hz, drive_dbm, released_at`;

/** The released_sheets rows of the revisions released before this migration (exported for the test that compares them with the release path's). */
export const releasedSheetsSelect = `
  SELECT r.id, r.organization_id, r.device_id,
         JSON_VALUE(r.model_json, '$.template.deviceClass'),
         JSON_VALUE(r.model_json, '$.header.partNumber'),
         LEFT(JSON_VALUE(r.model_json, '$.header.title'), 200),
         r.letter,
         JSON_VALUE(d.key_conditions, '$.inputFrequencyHz.min'), JSON_VALUE(d.key_conditions, '$.inputFrequencyHz.max'),
         JSON_VALUE(d.key_conditions, '$.outputFrequencyHz.min'), JSON_VALUE(d.key_conditions, '$.outputFrequencyHz.max'),
         JSON_VALUE(d.key_conditions, '$.driveLevelDbm'),
         r.released_at
    FROM sheet_revisions r JOIN devices d ON d.id = r.device_id`;

const releasedSpecValueColumns = `revision_id, organization_id, device_id, device_class, row_id, parameter, conditions_key,
  min_value, typ_value, max_value, unit`;

/** The released_spec_values rows of those revisions: every specification row of the frozen model. */
export const releasedSpecValuesSelect = `
  SELECT r.id, r.organization_id, r.device_id, JSON_VALUE(r.model_json, '$.template.deviceClass'),
         j.row_id, j.parameter, j.conditions_key, j.min_value, j.typ_value, j.max_value, j.unit
    FROM sheet_revisions r,
         JSON_TABLE(r.model_json, '$.specifications.rows[*]' COLUMNS (
           row_id VARCHAR(64) PATH '$.rowId',
           parameter VARCHAR(64) PATH '$.parameter',
           conditions_key VARCHAR(255) PATH '$.conditionsKey',
           min_value DOUBLE PATH '$.min.value',
           typ_value DOUBLE PATH '$.typ.value',
           max_value DOUBLE PATH '$.max.value',
           unit VARCHAR(32) PATH '$.unit'
         )) AS j`;

export async function up({ context: qi }: { context: QueryInterface }) {
  // One row per released revision: what the catalog lists, and the facts it searches by.
  await qi.createTable("released_sheets", {
    revision_id: { ...ref("sheet_revisions"), primaryKey: true },
    organization_id: ref("organizations"),
    device_id: ref("devices"),
    device_class: { type: DataTypes.STRING(64), allowNull: false },
    part_number: { type: DataTypes.STRING(64), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    letter: { type: DataTypes.STRING(8), allowNull: false },
    input_min_hz: double,
    input_max_hz: double,
    output_min_hz: double,
    output_max_hz: double,
    drive_dbm: double,
    released_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("released_sheets", ["device_class", "part_number"], { name: "released_sheets_class_part" });
  await qi.addIndex("released_sheets", ["organization_id", "part_number"], { name: "released_sheets_org_part" });
  await qi.addIndex("released_sheets", ["part_number"], { name: "released_sheets_part" });
  await qi.addIndex("released_sheets", ["input_min_hz", "input_max_hz"], { name: "released_sheets_input_band" });
  await qi.addIndex("released_sheets", ["output_min_hz", "output_max_hz"], { name: "released_sheets_output_band" });
  await qi.addIndex("released_sheets", ["drive_dbm"], { name: "released_sheets_drive" });

  // One row per released revision, specification row and condition group, limits in the row's unit.
  await qi.createTable("released_spec_values", {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
    revision_id: ref("sheet_revisions"),
    organization_id: ref("organizations"),
    device_id: ref("devices"),
    device_class: { type: DataTypes.STRING(64), allowNull: false },
    row_id: { type: DataTypes.STRING(64), allowNull: false },
    parameter: { type: DataTypes.STRING(64), allowNull: false },
    conditions_key: { type: DataTypes.STRING(255), allowNull: false },
    min_value: double,
    typ_value: double,
    max_value: double,
    unit: { type: DataTypes.STRING(32), allowNull: false },
  });
  await qi.addIndex("released_spec_values", ["revision_id", "row_id", "conditions_key"], { unique: true, name: "released_spec_values_group" });
  // Covering: a condition's GROUP BY revision HAVING MAX(max_value) … and the sort's aggregate read the index alone.
  const limits = ["max_value", "min_value", "typ_value"];
  await qi.addIndex("released_spec_values", ["parameter", "revision_id", ...limits], { name: "released_spec_values_parameter" });
  await qi.addIndex("released_spec_values", ["row_id", "revision_id", ...limits], { name: "released_spec_values_row" });

  await qi.sequelize.query(`INSERT INTO released_sheets (${releasedSheetColumns}) ${releasedSheetsSelect}`);
  await qi.sequelize.query(`INSERT INTO released_spec_values (${releasedSpecValueColumns}) ${releasedSpecValuesSelect}`);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable("released_spec_values");
  await qi.dropTable("released_sheets");
}
