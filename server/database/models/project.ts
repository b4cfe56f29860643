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
import type { User } from './user';

/** A designer's saved design, to open again when the site changes. */
export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare ownerUserId: ForeignKey<User['id']>;
  declare name: string;
  declare design: DesignDraft;
  /** Who the proposal goes to and where the feature is built; null until the designer records them. */
  declare clientName: CreationOptional<string | null>;
  declare clientEmail: CreationOptional<string | null>;
  declare clientPhone: CreationOptional<string | null>;
  declare siteAddress: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    Project.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        ownerUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        design: {
          type: DataTypes.JSON,
          allowNull: false,
          // MariaDB keeps JSON as text: read it back as the object it was
          get(this: Project): DesignDraft {
            const stored = this.getDataValue('design') as unknown;
            return (typeof stored === 'string' ? JSON.parse(stored) : stored) as DesignDraft;
          },
        },
        clientName: { type: DataTypes.STRING(200), allowNull: true },
        clientEmail: { type: DataTypes.STRING(254), allowNull: true },
        clientPhone: { type: DataTypes.STRING(40), allowNull: true },
        siteAddress: { type: DataTypes.STRING(400), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'projects' },
    );
  }
}
