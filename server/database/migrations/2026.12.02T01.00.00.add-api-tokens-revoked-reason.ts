import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** Why a token was revoked, so that its owner knows which tokens to make again after a password reset. */
export async function up({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.addColumn('api_tokens', 'revoked_reason', {
    type: DataTypes.STRING(20),
    allowNull: true,
  });
  // before this column, only their owners could revoke tokens
  await context.sequelize.query(
    "UPDATE api_tokens SET revoked_reason = 'owner' WHERE revoked_at IS NOT NULL AND revoked_reason IS NULL",
  );
}

export async function down({ context }: { context: MigrationContext }): Promise<void> {
  await context.queryInterface.removeColumn('api_tokens', 'revoked_reason');
}
