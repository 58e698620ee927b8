import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { organizationKinds, type OrganizationKind } from "../lib/domain/accounts";

export type { OrganizationKind };

export class Organization extends Model<InferAttributes<Organization>, InferCreationAttributes<Organization>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  declare kind: OrganizationKind;
  /** A spec limit whose Cpk falls below this is flagged on the sheet. */
  declare cpkThreshold: CreationOptional<number>;
  /** Cpk is printed only from this many units or more; below, the statistics annex says why it is absent. */
  declare cpkMinUnits: CreationOptional<number>;
  /** Fewer units than this behind a limit guaranteed by characterization is an open issue of the sheet. */
  declare limitMinUnits: CreationOptional<number>;
  declare toleranceCoverage: CreationOptional<number>;
  declare toleranceConfidence: CreationOptional<number>;
  /** Signatures a sheet candidate needs before it may be released (1, or 2 e.g. engineering and quality). */
  declare requiredSignatures: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Organization.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.ENUM(...organizationKinds), allowNull: false },
        cpkThreshold: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1.33 },
        cpkMinUnits: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 10 },
        limitMinUnits: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 5 },
        toleranceCoverage: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.99 },
        toleranceConfidence: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.95 },
        requiredSignatures: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, modelName: "Organization", tableName: "organizations" },
    );
  }
}
