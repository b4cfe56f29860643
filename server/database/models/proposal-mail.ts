import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { Project } from './project';
import type { ProjectReport } from './project-report';

/** A proposal e-mailed to a client, written once the SMTP server has accepted it. */
export class ProposalMail extends Model<InferAttributes<ProposalMail>, InferCreationAttributes<ProposalMail>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare reportId: ForeignKey<ProjectReport['id']>;
  declare toAddress: string;
  declare subject: string;
  declare sentByUserId: number | null;
  /** The Message-ID header the message went with. */
  declare messageId: string;
  declare sentAt: Date;

  static initialise(sequelize: Sequelize): void {
    ProposalMail.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        sentByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        messageId: { type: DataTypes.STRING(300), allowNull: false },
        sentAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'proposal_mails', timestamps: false },
    );
  }
}
