import {
  DataTypes,
  Model,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { CurveRevision } from './curve-revision';

export const declaredRegions = ['preferred', 'allowable'] as const;
export type DeclaredRegion = (typeof declaredRegions)[number];

/** A flow range the supplier declares for a curve revision: its preferred or allowable operating region. */
export class CurveDeclaredRange extends Model<
  InferAttributes<CurveDeclaredRange>,
  InferCreationAttributes<CurveDeclaredRange>
> {
  declare revisionId: ForeignKey<CurveRevision['id']>;
  declare region: DeclaredRegion;
  declare flowMinM3s: number;
  declare flowMaxM3s: number;

  static initialise(sequelize: Sequelize): void {
    CurveDeclaredRange.init(
      {
        revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
        region: { type: DataTypes.ENUM(...declaredRegions), allowNull: false, primaryKey: true },
        flowMinM3s: { type: DataTypes.DOUBLE, allowNull: false, field: 'flow_min_m3s' },
        flowMaxM3s: { type: DataTypes.DOUBLE, allowNull: false, field: 'flow_max_m3s' },
      },
      { sequelize, tableName: 'curve_declared_ranges', timestamps: false },
    );
  }
}
