import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { PumpCurveFit } from '../../../shared/hydraulics';
import type { CurveDeclaredRange } from './curve-declared-range';
import type { CurveImport } from './curve-import';
import type { CurvePoint } from './curve-point';
import type { Pump } from './pump';

/**
 * One version of a pump's curve, numbered 1, 2, ... per pump. Revisions are never changed or
 * deleted by an import, so a selection that names a revision can always be re-read.
 */
export class CurveRevision extends Model<InferAttributes<CurveRevision>, InferCreationAttributes<CurveRevision>> {
  declare id: CreationOptional<number>;
  declare pumpId: ForeignKey<Pump['id']>;
  declare number: number;
  declare importId: ForeignKey<CurveImport['id']>;
  declare sourceFileName: string;
  /** sha-256 of the source file's bytes, hex. */
  declare sourceChecksum: string;
  /** sha-256 of the stored curve (see curve-content-hash.ts): equal hashes, unchanged curve. */
  declare contentHash: string;
  /** The units the source file declared, e.g. `{ flow: 'gpm', head: 'ft' }`. */
  declare fileUnits: Record<string, string>;
  declare notes: string | null;
  declare pointCount: number;
  declare flowMinM3s: number;
  declare flowMaxM3s: number;
  declare headMinM: number;
  declare headMaxM: number;
  declare bepFlowM3s: number | null;
  declare bepHeadM: number | null;
  declare bepEfficiency: number | null;
  declare fit: PumpCurveFit;
  declare createdAt: CreationOptional<Date>;

  declare points?: NonAttribute<CurvePoint[]>;
  declare declaredRanges?: NonAttribute<CurveDeclaredRange[]>;
  declare import?: NonAttribute<CurveImport>;

  static initialise(sequelize: Sequelize): void {
    CurveRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sourceFileName: { type: DataTypes.STRING(255), allowNull: false },
        sourceChecksum: { type: DataTypes.CHAR(64), allowNull: false },
        contentHash: { type: DataTypes.CHAR(64), allowNull: false },
        fileUnits: { type: DataTypes.JSON, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: true },
        pointCount: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        flowMinM3s: { type: DataTypes.DOUBLE, allowNull: false, field: 'flow_min_m3s' },
        flowMaxM3s: { type: DataTypes.DOUBLE, allowNull: false, field: 'flow_max_m3s' },
        headMinM: { type: DataTypes.DOUBLE, allowNull: false, field: 'head_min_m' },
        headMaxM: { type: DataTypes.DOUBLE, allowNull: false, field: 'head_max_m' },
        bepFlowM3s: { type: DataTypes.DOUBLE, allowNull: true, field: 'bep_flow_m3s' },
        bepHeadM: { type: DataTypes.DOUBLE, allowNull: true, field: 'bep_head_m' },
        bepEfficiency: { type: DataTypes.DOUBLE, allowNull: true },
        fit: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'curve_revisions', updatedAt: false },
    );
  }
}
