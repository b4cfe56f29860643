import type { Sequelize } from 'sequelize';
import { Supplier } from './supplier';
// accounts
import { ApiToken } from './api-token';
import { AuditEvent } from './audit-event';
import { Invitation } from './invitation';
import { PasswordResetLink } from './password-reset-link';
import { Session } from './session';
import { User } from './user';
import { UserPreference } from './user-preference';
// catalog
import { CurveDeclaredRange } from './curve-declared-range';
import { CurveImport } from './curve-import';
import { CurvePoint } from './curve-point';
import { CurveRevision } from './curve-revision';
import { Pump } from './pump';
// projects
import { Project } from './project';
// reports
import { CompanyProfile } from './company-profile';
import { ProjectReport } from './project-report';
import { ProjectRevision } from './project-revision';
// sending to clients
import { ClientLink } from './client-link';
import { ClientLinkView } from './client-link-view';
import { ProposalMail } from './proposal-mail';

/** Initialises every model and declares the associations, in one place. */
export function initialiseModels(sequelize: Sequelize): void {
  Supplier.initialise(sequelize);
  // accounts
  for (const model of [User, UserPreference, Session, ApiToken, Invitation, PasswordResetLink, AuditEvent])
    model.initialise(sequelize);
  // Models are initialised again for each scratch database; associations are declared once.
  if (!User.associations.supplier) {
    User.belongsTo(Supplier, { as: 'supplier', foreignKey: 'supplierId' });
    Session.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    ApiToken.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    PasswordResetLink.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    UserPreference.belongsTo(User, { as: 'user', foreignKey: 'userId' });
    AuditEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorUserId' });
    AuditEvent.belongsTo(User, { as: 'subject', foreignKey: 'subjectUserId' });
  }
  // catalog
  for (const model of [Pump, CurveImport, CurveRevision, CurvePoint, CurveDeclaredRange]) model.initialise(sequelize);
  if (!Pump.associations.supplier) {
    Pump.belongsTo(Supplier, { as: 'supplier', foreignKey: 'supplierId' });
    Supplier.hasMany(Pump, { as: 'pumps', foreignKey: 'supplierId' });
    Pump.hasMany(CurveRevision, { as: 'revisions', foreignKey: 'pumpId' });
    Pump.belongsTo(CurveRevision, { as: 'currentRevision', foreignKey: 'currentRevisionId', constraints: false });
    CurveRevision.belongsTo(CurveImport, { as: 'import', foreignKey: 'importId' });
    CurveRevision.hasMany(CurvePoint, { as: 'points', foreignKey: 'revisionId' });
    CurveRevision.hasMany(CurveDeclaredRange, { as: 'declaredRanges', foreignKey: 'revisionId' });
    CurveImport.belongsTo(Supplier, { as: 'supplier', foreignKey: 'supplierId' });
  }
  // projects
  Project.initialise(sequelize);
  ProjectRevision.initialise(sequelize);
  if (!Project.associations.revisions) {
    Project.hasMany(ProjectRevision, { as: 'revisions', foreignKey: 'projectId' });
    ProjectRevision.belongsTo(User, { as: 'author', foreignKey: 'authorUserId' });
  }
  // reports
  for (const model of [CompanyProfile, ProjectReport]) model.initialise(sequelize);
  if (!ProjectReport.associations.project) {
    ProjectReport.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
    Project.hasMany(ProjectReport, { as: 'reports', foreignKey: 'projectId' });
    CompanyProfile.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  }
  // sending to clients
  for (const model of [ProposalMail, ClientLink, ClientLinkView]) model.initialise(sequelize);
  if (!ProposalMail.associations.project) {
    ProposalMail.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
    ProposalMail.belongsTo(ProjectReport, { as: 'report', foreignKey: 'reportId' });
    ClientLink.belongsTo(Project, { as: 'project', foreignKey: 'projectId' });
    ClientLink.belongsTo(ProjectReport, { as: 'report', foreignKey: 'reportId' });
    ClientLink.hasMany(ClientLinkView, { as: 'views', foreignKey: 'linkId' });
  }
}

export { Supplier };
export { ApiToken, AuditEvent, Invitation, PasswordResetLink, Session, User, UserPreference };
export { CurveDeclaredRange, CurveImport, CurvePoint, CurveRevision, Pump };
export { Project, ProjectRevision };
export { CompanyProfile, ProjectReport };
export { ClientLink, ClientLinkView, ProposalMail };
