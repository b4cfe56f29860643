import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('company_profiles', {
    // one profile per designer: the user is the key
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    name: { type: DataTypes.STRING(200), allowNull: false },
    address: { type: DataTypes.STRING(400), allowNull: false },
    phone: { type: DataTypes.STRING(40), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false },
    licence_number: { type: DataTypes.STRING(60), allowNull: false },
    // the logo as uploaded (at most 1 MiB, checked PNG or JPEG)
    logo: { type: DataTypes.BLOB('medium'), allowNull: true },
    logo_type: { type: DataTypes.STRING(20), allowNull: true },
    logo_width: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
    logo_height: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
    // milliseconds, so that the saved profile answers with the time it keeps
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('company_profiles');
}
