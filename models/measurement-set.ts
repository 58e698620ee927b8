import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import {
  measurementSetStates,
  measurementSources,
  type DerivedParameter,
  type MeasurementConditions,
  type MeasurementSetState,
  type MeasurementSource,
} from "../lib/domain/measurements";

export type { DerivedParameter, MeasurementConditions, MeasurementSetState };

export class MeasurementSet extends Model<InferAttributes<MeasurementSet>, InferCreationAttributes<MeasurementSet>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare storedFileId: number;
  declare sha256: string;
  declare kind: string;
  declare state: MeasurementSetState;
  declare supersedesId: number | null;
  declare supersededById: CreationOptional<number | null>;
  declare conditions: MeasurementConditions;
  declare parsed: unknown;
  declare parameters: DerivedParameter[];
  /** Plot-ready series derived with the parameters (decimated), so pages never re-derive. */
  declare curves: unknown;
  declare warnings: string[];
  declare measuredOn: string | null;
  declare source: MeasurementSource;
  declare uploadedById: number | null;
  declare benchTokenId: number | null;
  declare reviewedById: CreationOptional<number | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  declare rejectionReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    MeasurementSet.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        storedFileId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        kind: { type: DataTypes.STRING(32), allowNull: false },
        state: { type: DataTypes.ENUM(...measurementSetStates), allowNull: false },
        supersedesId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        supersededById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        conditions: { type: DataTypes.JSON, allowNull: false },
        parsed: { type: DataTypes.JSON, allowNull: false },
        parameters: { type: DataTypes.JSON, allowNull: false },
        curves: { type: DataTypes.JSON, allowNull: false },
        warnings: { type: DataTypes.JSON, allowNull: false },
        measuredOn: { type: DataTypes.DATEONLY, allowNull: true },
        source: { type: DataTypes.ENUM(...measurementSources), allowNull: false },
        uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        benchTokenId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        reviewedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        reviewedAt: { type: DataTypes.DATE(3), allowNull: true },
        rejectionReason: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "MeasurementSet", tableName: "measurement_sets", defaultScope: { attributes: { exclude: ["parsed", "curves"] } } },
    );
  }
}

/** Which instruments a set was measured with, and whether calibration had lapsed on the measurement date. */
export class MeasurementSetInstrument extends Model<InferAttributes<MeasurementSetInstrument>, InferCreationAttributes<MeasurementSetInstrument>> {
  declare measurementSetId: number;
  declare instrumentId: number;
  declare calibrationLapsed: boolean;

  static initModel(sequelize: Sequelize) {
    MeasurementSetInstrument.init(
      {
        measurementSetId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        instrumentId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        calibrationLapsed: { type: DataTypes.BOOLEAN, allowNull: false },
      },
      { sequelize, modelName: "MeasurementSetInstrument", tableName: "measurement_set_instruments", timestamps: false },
    );
  }
}
