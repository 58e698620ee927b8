import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * The append-only audit trail: who did what, when, with the state before and after.
 * The database refuses UPDATE and DELETE on this table (triggers in the first migration).
 */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare organizationId: number | null;
  declare actorUserId: number | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: string;
  declare before: unknown;
  declare after: unknown;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        actorUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        action: { type: DataTypes.STRING(64), allowNull: false },
        subjectType: { type: DataTypes.STRING(64), allowNull: false },
        subjectId: { type: DataTypes.STRING(64), allowNull: false },
        before: { type: DataTypes.JSON, allowNull: true },
        after: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "AuditEvent", tableName: "audit_events", updatedAt: false },
    );
  }
}
