import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A bench's credential for the upload API: shown once, stored as SHA-256, scoped to one organization. */
export class BenchToken extends Model<InferAttributes<BenchToken>, InferCreationAttributes<BenchToken>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare createdById: number;
  declare name: string;
  declare tokenPrefix: string;
  declare tokenHash: string;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BenchToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        tokenPrefix: { type: DataTypes.STRING(16), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        lastUsedAt: { type: DataTypes.DATE(3), allowNull: true },
        revokedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "BenchToken", tableName: "bench_tokens", updatedAt: false },
    );
  }
}
