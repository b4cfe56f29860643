import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { Supplier } from './supplier';

export const curveImportChannels = ['api', 'command', 'demo-seed'] as const;
export type CurveImportChannel = (typeof curveImportChannels)[number];

/** One committed curve-table file: who loaded it, when, from where, and the report it produced. */
export class CurveImport extends Model<InferAttributes<CurveImport>, InferCreationAttributes<CurveImport>> {
  declare id: CreationOptional<number>;
  declare supplierId: ForeignKey<Supplier['id']>;
  declare importedByUserId: number | null;
  /** A readable name of who imported: the account's e-mail, or the command line's user. */
  declare importedBy: string;
  declare channel: CurveImportChannel;
  declare fileName: string;
  /** sha-256 of the file's bytes, hex. */
  declare fileChecksum: string;
  declare fileUnits: Record<string, string>;
  declare rowCount: number;
  declare pumpCount: number;
  declare newCount: number;
  declare changedCount: number;
  declare unchangedCount: number;
  declare report: unknown;
  declare createdAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    CurveImport.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        importedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        importedBy: { type: DataTypes.STRING(200), allowNull: false },
        channel: { type: DataTypes.ENUM(...curveImportChannels), allowNull: false },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        fileChecksum: { type: DataTypes.CHAR(64), allowNull: false },
        fileUnits: { type: DataTypes.JSON, allowNull: false },
        rowCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        pumpCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        newCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        changedCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        unchangedCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        report: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'curve_imports', updatedAt: false },
    );
  }
}
