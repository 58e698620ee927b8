import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { commentAnchorKinds, type CommentAnchorKind } from "../lib/domain/reviews";

/** A review comment on a candidate, anchored to the sheet, a row, a chart or a prose section; replies name a parent. */
export class SheetComment extends Model<InferAttributes<SheetComment>, InferCreationAttributes<SheetComment>> {
  declare id: CreationOptional<number>;
  declare organizationId: number;
  declare deviceId: number;
  declare candidateId: number;
  declare parentId: number | null;
  declare authorId: number;
  declare anchorKind: CommentAnchorKind;
  declare anchorId: string | null;
  /** What the anchor was called when the comment was written ("Conversion loss, 2.4 GHz"). */
  declare anchorLabel: string;
  declare body: string;
  declare resolvedById: CreationOptional<number | null>;
  declare resolvedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SheetComment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        organizationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        deviceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        candidateId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        parentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        anchorKind: { type: DataTypes.ENUM(...commentAnchorKinds), allowNull: false },
        anchorId: { type: DataTypes.STRING(200), allowNull: true },
        anchorLabel: { type: DataTypes.STRING(300), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        resolvedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        resolvedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "SheetComment", tableName: "sheet_comments" },
    );
  }
}
