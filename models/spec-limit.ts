import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { limitBases, type LimitBasis } from "../lib/domain/sheets";

/** A min/typ/max line of the electrical specifications, for one parameter under one condition group. */
export class SpecLimit extends Model<InferAttributes<SpecLimit>, InferCreationAttributes<SpecLimit>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare parameter: string;
  /** lib/sheet's makeConditionsKey of the condition group. */
  declare conditionsKey: string;
  declare minValue: number | null;
  declare typValue: number | null;
  declare maxValue: number | null;
  /** The decimals each figure was typed with (9.5 → 1, 10.0 → 1); null when not known. */
  declare minDecimals: CreationOptional<number | null>;
  declare typDecimals: CreationOptional<number | null>;
  declare maxDecimals: CreationOptional<number | null>;
  declare unit: string;
  declare basis: LimitBasis;
  declare footnote: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SpecLimit.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        parameter: { type: DataTypes.STRING(64), allowNull: false },
        conditionsKey: { type: DataTypes.STRING(255), allowNull: false },
        minValue: { type: DataTypes.DOUBLE, allowNull: true },
        typValue: { type: DataTypes.DOUBLE, allowNull: true },
        maxValue: { type: DataTypes.DOUBLE, allowNull: true },
        minDecimals: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
        typDecimals: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
        maxDecimals: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
        unit: { type: DataTypes.STRING(16), allowNull: false },
        basis: { type: DataTypes.ENUM(...limitBases), allowNull: false },
        footnote: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "SpecLimit", tableName: "spec_limits" },
    );
  }
}
