import type { Sequelize } from 'sequelize';
import { Supplier } from './supplier';
// accounts
import { ApiToken } from './api-token';
import { AuditEvent } from './audit-event';
import { Invitation } from './invitation';
import { PasswordResetLink } from './password-reset-link';
import { Session } from './session';
import { User } from './user';

/** Initialises every model and declares the associations, in one place. */
export function initialiseModels(sequelize: Sequelize): void {
  Supplier.initialise(sequelize);
  // accounts
  for (const model of [User, Session, ApiToken, Invitation, PasswordResetLink, AuditEvent]) model.initialise(sequelize);
  // Models are initialised again for each scratch database; associations are declared once.
  if (!User.associations.supplier) {
    User.belongsTo(Supplier, { as: 'supplier', foreignKey: 'supplierId' });
    Session.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    ApiToken.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    PasswordResetLink.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    AuditEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorUserId' });
    AuditEvent.belongsTo(User, { as: 'subject', foreignKey: 'subjectUserId' });
  }
}

export { Supplier };
export { ApiToken, AuditEvent, Invitation, PasswordResetLink, Session, User };
