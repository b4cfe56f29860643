import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** Each proposal the SMTP server accepted for a client: to whom, which report, by whom and when. */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.createTable('proposal_mails', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    project_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'projects', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    report_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'project_reports', key: 'id' },
      onDelete: 'CASCADE',
      onUpdate: 'CASCADE',
    },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    sent_by_user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    message_id: { type: DataTypes.STRING(300), allowNull: false },
    sent_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await context.queryInterface.addIndex('proposal_mails', ['project_id', 'sent_at']);
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.dropTable('proposal_mails');
}
