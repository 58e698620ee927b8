import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export type AbsoluteMaximumRating = { label: string; value: string; unit: string };
export type PinFunctionRow = { pin: string; name: string; function: string };
export type OrderingRow = { partNumber: string; options: string; packing: string };
export type OperatingConditionRow = { parameter: string; min: string; typ: string; max: string; unit: string };

/** The engineer's words and ratings for a device's sheet: markdown per section, ratings, stated uncertainty. */
export class SheetContent extends Model<InferAttributes<SheetContent>, InferCreationAttributes<SheetContent>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare prose: Record<string, string>;
  declare absoluteMaximumRatings: AbsoluteMaximumRating[];
  /** Expanded uncertainty U (k = 2) per parameter name, in the parameter's unit. */
  declare measurementUncertainty: Record<string, number>;
  declare pinFunctions: CreationOptional<PinFunctionRow[] | null>;
  declare orderingInformation: CreationOptional<OrderingRow[] | null>;
  declare recommendedOperatingConditions: CreationOptional<OperatingConditionRow[] | null>;
  /** The package outline as the sheet prints it (a PNG stored file), and its caption. */
  declare packageOutlineFileId: CreationOptional<number | null>;
  declare packageOutlineCaption: CreationOptional<string | null>;
  declare updatedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetContent.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        prose: { type: DataTypes.JSON, allowNull: false },
        absoluteMaximumRatings: { type: DataTypes.JSON, allowNull: false },
        measurementUncertainty: { type: DataTypes.JSON, allowNull: false },
        pinFunctions: { type: DataTypes.JSON, allowNull: true },
        orderingInformation: { type: DataTypes.JSON, allowNull: true },
        recommendedOperatingConditions: { type: DataTypes.JSON, allowNull: true },
        packageOutlineFileId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        packageOutlineCaption: { type: DataTypes.STRING(200), allowNull: true },
        updatedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "SheetContent", tableName: "sheet_contents" },
    );
  }
}
