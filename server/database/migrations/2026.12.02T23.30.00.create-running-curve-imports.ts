import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Who holds a supplier's import, for the refusal a second import gets from another process (the
 * command beside the server). The hold itself is a MariaDB named lock, released when its holder's
 * connection ends, so a row left by a crashed import is simply overwritten by the next.
 */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('running_curve_imports', {
    supplier_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'suppliers', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    channel: { type: DataTypes.ENUM('api', 'command', 'demo-seed'), allowNull: false },
    started_by: { type: DataTypes.STRING(320), allowNull: false },
    started_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('running_curve_imports');
}
