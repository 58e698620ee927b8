import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A released revision withdrawn, with the reason (append-only by trigger; the revision itself stays). */
export class SheetRevisionWithdrawal extends Model<InferAttributes<SheetRevisionWithdrawal>, InferCreationAttributes<SheetRevisionWithdrawal>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare revisionId: number;
  declare reason: string;
  declare withdrawnById: number;
  declare withdrawnAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetRevisionWithdrawal.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false },
        withdrawnById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        withdrawnAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "SheetRevisionWithdrawal", tableName: "sheet_revision_withdrawals", updatedAt: false },
    );
  }
}
