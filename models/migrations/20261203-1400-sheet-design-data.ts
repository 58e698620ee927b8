import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the columns of its day, not imported from a model.
// What a designer needs beside the specifications: pin functions, ordering information and the
// recommended operating conditions (JSON lists), and the package outline drawing (a stored file:
// the PNG the sheet prints, an SVG upload rasterised on the server) with its caption.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn("sheet_contents", "pin_functions", { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn("sheet_contents", "ordering_information", { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn("sheet_contents", "recommended_operating_conditions", { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn("sheet_contents", "package_outline_file_id", { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.addColumn("sheet_contents", "package_outline_caption", { type: DataTypes.STRING(200), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn("sheet_contents", "package_outline_caption");
  await qi.removeColumn("sheet_contents", "package_outline_file_id");
  await qi.removeColumn("sheet_contents", "recommended_operating_conditions");
  await qi.removeColumn("sheet_contents", "ordering_information");
  await qi.removeColumn("sheet_contents", "pin_functions");
}
