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

/** A read-only link to one stored proposal for a client without an account: the SHA-256 of its token, until it expires or is revoked. */
export class ClientLink extends Model<InferAttributes<ClientLink>, InferCreationAttributes<ClientLink>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare reportId: ForeignKey<ProjectReport['id']>;
  declare tokenHash: string;
  declare createdByUserId: number | null;
  declare expiresAt: Date;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    ClientLink.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        createdByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'client_links', updatedAt: false },
    );
  }
}
