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
import { pumpKinds, pumpStatuses, type PumpKind, type PumpStatus } from '../../../shared/vocabularies';
import type { CurveRevision } from './curve-revision';
import type { Supplier } from './supplier';

/** A supplier's pump model; its curves are the revisions, the current one named by currentRevisionId. */
export class Pump extends Model<InferAttributes<Pump>, InferCreationAttributes<Pump>> {
  declare id: CreationOptional<number>;
  declare supplierId: ForeignKey<Supplier['id']>;
  /** The supplier's own code for the model, unique per supplier. */
  declare modelCode: string;
  declare displayName: string;
  declare kind: PumpKind;
  declare nominalSpeedRpm: number | null;
  declare voltageV: number | null;
  declare phaseCount: number | null;
  /** The motor's full-load (rated) current, A, when the supplier gives it. */
  declare fullLoadCurrentA: number | null;
  /** The continuous speed range on a drive or controller, rpm, both or neither. */
  declare speedMinRpm: number | null;
  declare speedMaxRpm: number | null;
  /** The fixed speeds of a multi-speed pump, rpm ascending, as `1450;2900` (fixedSpeedsText). */
  declare fixedSpeedsRpm: string | null;
  declare dischargeSizeMm: number | null;
  declare solidsHandlingMm: number | null;
  /** Decimal text as MariaDB returns DECIMAL, e.g. "412.50". */
  declare listPrice: string | null;
  declare priceCurrency: string | null;
  /** The motor's efficiency at its rating, 0-1, when the supplier gives it. */
  declare motorEfficiency: number | null;
  declare status: CreationOptional<PumpStatus>;
  declare currentRevisionId: ForeignKey<CurveRevision['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare supplier?: NonAttribute<Supplier>;
  declare currentRevision?: NonAttribute<CurveRevision>;

  static initialise(sequelize: Sequelize): void {
    Pump.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        modelCode: { type: DataTypes.STRING(64), allowNull: false },
        displayName: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.ENUM(...pumpKinds), allowNull: false },
        nominalSpeedRpm: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        voltageV: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        phaseCount: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
        fullLoadCurrentA: { type: DataTypes.DOUBLE, allowNull: true },
        speedMinRpm: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        speedMaxRpm: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        fixedSpeedsRpm: { type: DataTypes.STRING(120), allowNull: true },
        dischargeSizeMm: { type: DataTypes.DOUBLE, allowNull: true },
        solidsHandlingMm: { type: DataTypes.DOUBLE, allowNull: true },
        listPrice: { type: DataTypes.DECIMAL(12, 2), allowNull: true },
        priceCurrency: { type: DataTypes.CHAR(3), allowNull: true },
        motorEfficiency: { type: DataTypes.DOUBLE, allowNull: true },
        status: { type: DataTypes.ENUM(...pumpStatuses), allowNull: false, defaultValue: 'active' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'pumps' },
    );
  }
}

/** A multi-speed pump's speeds as the pumps table keeps them: rpm joined by `;`, or null. */
export function fixedSpeedsText(speeds: readonly number[] | null): string | null {
  return speeds === null || speeds.length === 0 ? null : speeds.join(';');
}

/** The speeds of fixedSpeedsText back as numbers, or null. */
export function fixedSpeedsOf(text: string | null): number[] | null {
  return text === null || text === '' ? null : text.split(';').map(Number);
}
