import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ConformityFinding } from "../lib/sheet/conformity-watch";

/**
 * A conformity alert: a measurement set approved after a release fell outside a guaranteed limit of
 * the current revision, or completed a control-chart test (lib/sheet/conformity-watch). Open while
 * `closedAt` is null; an engineer closes it with a reason (lib/server/conformity/close-conformity-alert.ts).
 */
export class ConformityAlert extends Model<InferAttributes<ConformityAlert>, InferCreationAttributes<ConformityAlert>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare revisionId: number;
  declare measurementSetId: number;
  declare findings: ConformityFinding[];
  declare summary: string;
  declare raisedAt: Date;
  declare raisedById: number | null;
  declare closedAt: CreationOptional<Date | null>;
  declare closedById: CreationOptional<number | null>;
  declare closeReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ConformityAlert.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        measurementSetId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        findings: { type: DataTypes.JSON, allowNull: false },
        summary: { type: DataTypes.STRING(500), allowNull: false },
        raisedAt: { type: DataTypes.DATE(3), allowNull: false },
        raisedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        closedAt: { type: DataTypes.DATE(3), allowNull: true },
        closedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        closeReason: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "ConformityAlert", tableName: "conformity_alerts" },
    );
  }
}
