import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { candidateStates, type CandidateState } from "../lib/domain/reviews";

export type IssueAcknowledgement = { code: string; message: string; reason: string };

/**
 * A sheet submitted for review: the sheet model exactly as submitted (frozen by a trigger) and its
 * SHA-256. The reviewer reviews and signs this and nothing else.
 */
export class SheetCandidate extends Model<InferAttributes<SheetCandidate>, InferCreationAttributes<SheetCandidate>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  /** The device id while the candidate is open, null once closed (one open candidate per device). */
  declare openDeviceId: number | null;
  declare state: CandidateState;
  declare modelJson: string;
  declare modelDigest: string;
  /** The date printed in the candidate model (YYYY-MM-DD). */
  declare modelDate: string;
  declare acknowledgements: IssueAcknowledgement[];
  declare note: string;
  declare requiredSignatures: number;
  /** The released revision the review compares against (null: a first release). */
  declare comparedRevisionId: number | null;
  declare submittedById: number;
  declare submittedAt: Date;
  declare decidedById: CreationOptional<number | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare changeRequest: CreationOptional<string | null>;
  declare staleReason: CreationOptional<string | null>;
  declare closedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetCandidate.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        openDeviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        state: { type: DataTypes.ENUM(...candidateStates), allowNull: false },
        modelJson: { type: DataTypes.TEXT("long"), allowNull: false },
        modelDigest: { type: DataTypes.CHAR(64), allowNull: false },
        modelDate: { type: DataTypes.DATEONLY, allowNull: false },
        acknowledgements: { type: DataTypes.JSON, allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: false },
        requiredSignatures: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false },
        comparedRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        submittedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        submittedAt: { type: DataTypes.DATE(3), allowNull: false },
        decidedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        changeRequest: { type: DataTypes.TEXT, allowNull: true },
        staleReason: { type: DataTypes.TEXT, allowNull: true },
        closedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "SheetCandidate", tableName: "sheet_candidates" },
    );
  }
}
