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
import type { User } from './user';

export const auditActions = [
  'sign-in',
  'sign-in-failed',
  'sign-out',
  'api-token-created',
  'api-token-revoked',
  'api-token-create-failed',
  'role-changed',
  'supplier-changed',
  'user-disabled',
  'user-enabled',
  'invitation-sent',
  'invitation-accepted',
  'password-reset-requested',
  'password-reset',
  'password-changed',
  'password-change-failed',
] as const;
export type AuditAction = (typeof auditActions)[number];

/** One line of the audit log: who did what to whom, from where. Never holds a password or token. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare action: AuditAction;
  declare actorUserId: ForeignKey<User['id']> | null;
  declare subjectUserId: ForeignKey<User['id']> | null;
  declare email: string | null;
  declare ip: string | null;
  declare detail: string | null;
  declare actor?: NonAttribute<User> | null;
  declare subject?: NonAttribute<User> | null;
  declare createdAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        action: { type: DataTypes.STRING(40), allowNull: false },
        actorUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        subjectUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        email: { type: DataTypes.STRING(254), allowNull: true },
        ip: { type: DataTypes.STRING(45), allowNull: true },
        detail: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'audit_events', updatedAt: false },
    );
  }
}
