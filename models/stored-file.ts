import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * An uploaded file, exactly as received: its bytes are an object in the file store under
 * `storage_key` (lib/server/storage), its size and SHA-256 are here, and a read checks both.
 */
export class StoredFile extends Model<InferAttributes<StoredFile>, InferCreationAttributes<StoredFile>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare sha256: string;
  declare sizeBytes: number;
  declare originalName: string;
  declare contentType: string;
  declare storageKey: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StoredFile.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        originalName: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        storageKey: { type: DataTypes.STRING(255), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "StoredFile", tableName: "stored_files", updatedAt: false },
    );
  }
}
