import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable(
    'curve_revisions',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      pump_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'pumps', key: 'id' },
        onDelete: 'CASCADE',
        onUpdate: 'CASCADE',
      },
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      import_id: {
        type: DataTypes.INTEGER.UNSIGNED,
        allowNull: false,
        references: { model: 'curve_imports', key: 'id' },
        onDelete: 'RESTRICT',
        onUpdate: 'CASCADE',
      },
      source_file_name: { type: DataTypes.STRING(255), allowNull: false },
      source_checksum: { type: DataTypes.CHAR(64), allowNull: false },
      // sha-256 of the curve as stored (points in SI, declared ranges, power basis): equal hashes mean an unchanged curve.
      content_hash: { type: DataTypes.CHAR(64), allowNull: false },
      file_units: { type: DataTypes.JSON, allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      point_count: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
      // Copied out of the fit so the catalog can filter and sort in SQL (m3/s, m, fraction).
      flow_min_m3s: { type: DataTypes.DOUBLE, allowNull: false },
      flow_max_m3s: { type: DataTypes.DOUBLE, allowNull: false },
      head_min_m: { type: DataTypes.DOUBLE, allowNull: false },
      head_max_m: { type: DataTypes.DOUBLE, allowNull: false },
      bep_flow_m3s: { type: DataTypes.DOUBLE, allowNull: true },
      bep_head_m: { type: DataTypes.DOUBLE, allowNull: true },
      bep_efficiency: { type: DataTypes.DOUBLE, allowNull: true },
      // The engine's PumpCurveFit (shared/hydraulics/pump-curve-fit.ts), as computed at import.
      fit: { type: DataTypes.JSON, allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
    },
    { uniqueKeys: { curve_revisions_pump_number: { fields: ['pump_id', 'number'] } } },
  );
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('curve_revisions');
}
