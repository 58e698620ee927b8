import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Organization } from "./organization";

/**
 * One notice waiting to be mailed, or mailed: written in the same transaction as the event it
 * tells of (lib/server/outbox/enqueue-notices.ts) and sent by the outbox worker
 * (lib/server/outbox/drain-outbox.ts). (eventKey, recipient) is unique, so one event never
 * queues two mails to one person. The worker claims a row with a lease (claimToken,
 * claimedUntil), sends it with the row's fixed messageId and sets sentAt.
 */
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  declare lane: CreationOptional<string>;
  declare organizationId: ForeignKey<Organization["id"]> | null;
  declare eventKey: string;
  declare recipient: string;
  declare subject: string;
  declare bodyText: string;
  declare messageId: string;
  /** Extra mail headers (List-Unsubscribe), or null. */
  declare headers: CreationOptional<Record<string, string> | null>;
  /** Delivery attempts that ended, sent or failed (a worker that crashed mid-send counts none). */
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare claimToken: CreationOptional<string | null>;
  declare claimedUntil: CreationOptional<Date | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare lastError: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OutboxMessage.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        lane: { type: DataTypes.STRING(40), allowNull: false, defaultValue: "mail" },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        eventKey: { type: DataTypes.STRING(191), allowNull: false },
        recipient: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(255), allowNull: false },
        bodyText: { type: DataTypes.TEXT("medium"), allowNull: false },
        messageId: { type: DataTypes.STRING(255), allowNull: false, unique: true },
        headers: { type: DataTypes.JSON, allowNull: true },
        attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
        claimToken: { type: DataTypes.CHAR(36), allowNull: true },
        claimedUntil: { type: DataTypes.DATE(3), allowNull: true },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        lastError: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "OutboxMessage", tableName: "outbox_messages" },
    );
  }
}
