import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { deviceClasses, type DeviceClass } from "../lib/domain/device-classes";

/**
 * A customer following a released part (`deviceId`) or an organization's device class
 * (`deviceClass`): exactly one of the two (a CHECK constraint). A new revision or a withdrawal
 * queues one notice per follower (lib/server/reviews/notices.ts).
 */
export class Subscription extends Model<InferAttributes<Subscription>, InferCreationAttributes<Subscription>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare organizationId: number;
  declare deviceId: number | null;
  declare deviceClass: DeviceClass | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Subscription.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        deviceClass: { type: DataTypes.STRING(64), allowNull: true, validate: { isIn: { args: [deviceClasses as DeviceClass[]], msg: "Unknown device class." } } },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "Subscription", tableName: "subscriptions", updatedAt: false },
    );
  }
}
