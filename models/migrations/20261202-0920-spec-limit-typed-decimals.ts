import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from a model.
// A spec limit prints with the digits the engineer typed (9.5 stays 9.5, 10.0 stays 10.0): the number
// of decimals each figure was typed with. NULL for limits saved before, or through the API as a JSON
// number: those print the stored number's shortest exact form (lib/sheet/format.ts formatLimitValue).
// The organization's minimum of units behind a printed Cpk (default 10).
const decimals = { type: DataTypes.TINYINT.UNSIGNED, allowNull: true };

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn("spec_limits", "min_decimals", decimals);
  await qi.addColumn("spec_limits", "typ_decimals", decimals);
  await qi.addColumn("spec_limits", "max_decimals", decimals);
  await qi.addColumn("organizations", "cpk_min_units", { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 10 });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn("organizations", "cpk_min_units");
  await qi.removeColumn("spec_limits", "max_decimals");
  await qi.removeColumn("spec_limits", "typ_decimals");
  await qi.removeColumn("spec_limits", "min_decimals");
}
