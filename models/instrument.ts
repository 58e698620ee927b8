import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { InstrumentUncertainty } from "../lib/domain/instruments";

export type { InstrumentUncertainty };

export class Instrument extends Model<InferAttributes<Instrument>, InferCreationAttributes<Instrument>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare kind: string;
  declare model: string;
  declare serial: string;
  /** ISO dates (YYYY-MM-DD). */
  declare calibratedOn: string;
  declare calibrationDueOn: string;
  declare uncertainty: InstrumentUncertainty[];
  declare retiredAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Instrument.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.STRING(64), allowNull: false },
        model: { type: DataTypes.STRING(160), allowNull: false },
        serial: { type: DataTypes.STRING(64), allowNull: false },
        calibratedOn: { type: DataTypes.DATEONLY, allowNull: false },
        calibrationDueOn: { type: DataTypes.DATEONLY, allowNull: false },
        uncertainty: { type: DataTypes.JSON, allowNull: false },
        retiredAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "Instrument", tableName: "instruments" },
    );
  }
}
