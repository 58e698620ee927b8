import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { signatureMeanings, type SignatureMeaning } from "../lib/domain/reviews";

/**
 * One electronic signature on a candidate (append-only by trigger): printed name, role and
 * organization as they stood at signing, the meaning, the UTC time, and the digest of the
 * candidate signed — which a trigger checks against the candidate (21 CFR Part 11 §11.50, §11.70).
 */
export class SheetSignature extends Model<InferAttributes<SheetSignature>, InferCreationAttributes<SheetSignature>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare candidateId: number;
  declare signerId: number;
  declare printedName: string;
  declare roleWord: string;
  declare organizationName: string;
  declare meaning: SignatureMeaning;
  declare candidateDigest: string;
  declare signedAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetSignature.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        candidateId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        signerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        printedName: { type: DataTypes.STRING(120), allowNull: false },
        roleWord: { type: DataTypes.STRING(40), allowNull: false },
        organizationName: { type: DataTypes.STRING(160), allowNull: false },
        meaning: { type: DataTypes.ENUM(...signatureMeanings), allowNull: false },
        candidateDigest: { type: DataTypes.CHAR(64), allowNull: false },
        signedAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "SheetSignature", tableName: "sheet_signatures", updatedAt: false },
    );
  }
}
