import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * A released revision (append-only by trigger): the frozen sheet model, the PDF bytes rendered from
 * it once, their SHA-256, the letter, the release notes. A later revision names this one as
 * `previousRevisionId`, which is what makes it superseded.
 */
export class SheetRevision extends Model<InferAttributes<SheetRevision>, InferCreationAttributes<SheetRevision>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare candidateId: number;
  declare sequence: number;
  declare letter: string;
  declare previousRevisionId: number | null;
  declare modelJson: string;
  declare modelDigest: string;
  declare pdf: Buffer;
  declare pdfSha256: string;
  declare pdfBytes: number;
  /** The short verification reference printed in the PDF's footer. */
  declare reference: string;
  declare releaseNotes: string[];
  declare engineerNote: string;
  declare releasedById: number;
  declare releasedAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        candidateId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sequence: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        letter: { type: DataTypes.STRING(4), allowNull: false },
        previousRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        modelJson: { type: DataTypes.TEXT("long"), allowNull: false },
        modelDigest: { type: DataTypes.CHAR(64), allowNull: false },
        pdf: { type: DataTypes.BLOB("long"), allowNull: false },
        pdfSha256: { type: DataTypes.CHAR(64), allowNull: false },
        pdfBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        reference: { type: DataTypes.STRING(16), allowNull: false },
        releaseNotes: { type: DataTypes.JSON, allowNull: false },
        engineerNote: { type: DataTypes.TEXT, allowNull: false },
        releasedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        releasedAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      {
        sequelize,
        modelName: "SheetRevision",
        tableName: "sheet_revisions",
        updatedAt: false,
        // The PDF bytes are read only by the download: everything else leaves them in the database.
        defaultScope: { attributes: { exclude: ["pdf", "modelJson"] } },
      },
    );
  }
}
