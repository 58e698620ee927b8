import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * A released revision (append-only by trigger): the frozen sheet model, the PDF rendered from it
 * once (its bytes an object in the file store, here their SHA-256, size and key), the letter, the
 * release notes. A later revision names this one as
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
  declare pdfSha256: string;
  declare pdfBytes: number;
  /**
   * The PDF's key in the file store: a generated column of pdf_sha256 (the content key of
   * lib/server/storage/object-key.ts), never written, so a revision row never needs an UPDATE.
   */
  declare pdfKey: CreationOptional<string>;
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
        pdfSha256: { type: DataTypes.CHAR(64), allowNull: false },
        pdfBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        pdfKey: { type: DataTypes.STRING(80) },
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
        defaultScope: { attributes: { exclude: ["modelJson"] } },
      },
    );
  }
}
