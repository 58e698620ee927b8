import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Organization } from "./organization";
import type { User } from "./user";
import { deviceClasses, type DeviceClass } from "../lib/domain/device-classes";
import type { KeyConditions } from "../lib/domain/devices";

export type { DeviceClass, KeyConditions };

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
        // Text in the database (migration 20261202-0001): the class list grows without a migration, and is checked here.
        deviceClass: {
          type: DataTypes.STRING(64),
          allowNull: false,
          validate: { isIn: { args: [deviceClasses as DeviceClass[]], msg: "Unknown device class." } },
        },
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
