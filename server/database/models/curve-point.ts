import {
  DataTypes,
  Model,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { CurveRevision } from './curve-revision';

/** One published point of a curve revision, in SI as the engine takes it. */
export class CurvePoint extends Model<InferAttributes<CurvePoint>, InferCreationAttributes<CurvePoint>> {
  declare revisionId: ForeignKey<CurveRevision['id']>;
  /** 0, 1, ... in order of increasing flow. */
  declare position: number;
  declare flowM3s: number;
  declare headM: number;
  declare powerW: number | null;
  /** Fraction 0-1. */
  declare efficiency: number | null;
  declare npshRequiredM: number | null;

  static initialise(sequelize: Sequelize): void {
    CurvePoint.init(
      {
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, primaryKey: true },
        flowM3s: { type: DataTypes.DOUBLE, allowNull: false, field: 'flow_m3s' },
        headM: { type: DataTypes.DOUBLE, allowNull: false, field: 'head_m' },
        powerW: { type: DataTypes.DOUBLE, allowNull: true, field: 'power_w' },
        efficiency: { type: DataTypes.DOUBLE, allowNull: true },
        npshRequiredM: { type: DataTypes.DOUBLE, allowNull: true, field: 'npsh_required_m' },
      },
      { sequelize, tableName: 'curve_points', timestamps: false },
    );
  }
}
