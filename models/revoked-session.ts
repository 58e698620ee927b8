import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { User } from "./user";

/**
 * A signed-out session: its id (a claim in the session cookie) is refused from then on. Kept
 * until the session would have ended anyway (sign-in + the session's maximum age), then pruned.
 */
export class RevokedSession extends Model<InferAttributes<RevokedSession>, InferCreationAttributes<RevokedSession>> {
  declare sessionId: string;
  declare userId: ForeignKey<User["id"]>;
  declare expiresAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RevokedSession.init(
      {
        sessionId: { type: DataTypes.CHAR(36), primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "RevokedSession", tableName: "revoked_sessions", updatedAt: false },
    );
  }
}
