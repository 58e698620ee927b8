import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Raw bytes of an uploaded file, exactly as received, with their SHA-256. */
export class StoredFile extends Model<InferAttributes<StoredFile>, InferCreationAttributes<StoredFile>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare sha256: string;
  declare sizeBytes: number;
  declare originalName: string;
  declare contentType: string;
  declare bytes: Buffer;
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
        bytes: { type: DataTypes.BLOB("long"), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "StoredFile", tableName: "stored_files", updatedAt: false, defaultScope: { attributes: { exclude: ["bytes"] } } },
    );
  }
}
