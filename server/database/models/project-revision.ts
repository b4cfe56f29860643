import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { DesignDraft } from '../../../shared/api/api-schemas';
import type { Project } from './project';
import type { User } from './user';

/** The pump chosen for a design, with the curve revision it was chosen on. */
export interface StoredChoice {
  pumpId: number;
  installed: number;
  running: number;
  speedRpm: number | null;
  curveRevisionId: number;
}

/** MariaDB keeps JSON as text: read it back as the object it was. */
function parsedJson<T>(stored: unknown): T {
  return (typeof stored === 'string' ? JSON.parse(stored) : stored) as T;
}

/** One site visit of a project: the measurements as they were then, who took them and why. */
export class ProjectRevision extends Model<InferAttributes<ProjectRevision>, InferCreationAttributes<ProjectRevision>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare number: number;
  /** YYYY-MM-DD */
  declare visitedOn: string;
  declare authorUserId: ForeignKey<User['id']> | null;
  declare notes: string | null;
  declare design: DesignDraft;
  declare choice: StoredChoice | null;
  declare createdAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    ProjectRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        projectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        visitedOn: { type: DataTypes.DATEONLY, allowNull: false },
        authorUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        design: {
          type: DataTypes.JSON,
          allowNull: false,
          get(this: ProjectRevision): DesignDraft {
            return parsedJson<DesignDraft>(this.getDataValue('design'));
          },
        },
        choice: {
          type: DataTypes.JSON,
          allowNull: true,
          get(this: ProjectRevision): StoredChoice | null {
            return parsedJson<StoredChoice | null>(this.getDataValue('choice'));
          },
        },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'project_revisions', updatedAt: false },
    );
  }
}
