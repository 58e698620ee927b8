import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Organization } from "./organization";
import type { User } from "./user";

export const deviceClasses = ["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"] as const;
export type DeviceClass = (typeof deviceClasses)[number];

/** Conditions that identify the part: ranges in Hz, drive class in dBm. */
export type KeyConditions = {
  inputFrequencyHz?: { min: number; max: number };
  outputFrequencyHz?: { min: number; max: number };
  driveLevelDbm?: number;
  multiplicationFactor?: number;
};

export class Device extends Model<InferAttributes<Device>, InferCreationAttributes<Device>> {
  declare id: CreationOptional<number>;
  declare organizationId: ForeignKey<Organization["id"]>;
  declare createdById: ForeignKey<User["id"]> | null;
  declare partNumber: string;
  declare deviceClass: DeviceClass;
  declare title: string;
  declare description: string;
  declare keyConditions: KeyConditions;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Device.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        partNumber: { type: DataTypes.STRING(64), allowNull: false },
        deviceClass: { type: DataTypes.ENUM(...deviceClasses), allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        keyConditions: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      {
        sequelize, modelName: "Device",
        tableName: "devices",
        indexes: [{ unique: true, fields: ["organization_id", "part_number"] }],
      },
    );
  }
}
