import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { accountMailKinds, type AccountMailKind } from "../lib/domain/accounts";

/** One sign-up or password-reset mail asked for: what the per-address and per-recipient limits count. */
export class AccountMailRequest extends Model<InferAttributes<AccountMailRequest>, InferCreationAttributes<AccountMailRequest>> {
  declare id: CreationOptional<number>;
  declare kind: AccountMailKind;
  declare email: string;
  declare ipAddress: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AccountMailRequest.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.ENUM(...accountMailKinds), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        ipAddress: { type: DataTypes.STRING(64), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "AccountMailRequest", tableName: "account_mail_requests", updatedAt: false },
    );
  }
}
