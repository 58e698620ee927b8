import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Maps a foreign CSV's columns to our quantities; found again by the signature of its header row. */
export type ColumnMappingEntry = { column: string; target: string; unit: string };
/** Columns to quantities, plus `# key: value` metadata the foreign files lack (e.g. wanted_order). */
export type StoredColumnMapping = { entries: ColumnMappingEntry[]; metadata: Record<string, string> };

export class ColumnMapping extends Model<InferAttributes<ColumnMapping>, InferCreationAttributes<ColumnMapping>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare createdById: number;
  declare name: string;
  declare kind: string;
  declare headerSignature: string;
  declare mapping: StoredColumnMapping;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ColumnMapping.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(32), allowNull: false },
        headerSignature: { type: DataTypes.CHAR(64), allowNull: false },
        mapping: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "ColumnMapping", tableName: "column_mappings" },
    );
  }
}
