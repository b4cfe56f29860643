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

/** What the proposal said, as the client's read-only page shows it; in the design's units. */
export interface ProposalFacts {
  projectName: string;
  companyName: string;
  clientName: string;
  siteAddress: string;
  band: { flowMin: number; flowMax: number; flowUnit: string; headMin: number; headMax: number; headUnit: string };
  /** The first-ranked pump and its duty point, or null when no catalog pump met the system. */
  chosen: {
    pump: string;
    arrangement: { installed: number; running: number };
    flow: number;
    head: number;
    efficiency: number | null;
    annualKWh: number | null;
  } | null;
}

/** A proposal PDF made from a project's saved design, kept as made with its sha-256. */
export class ProjectReport extends Model<InferAttributes<ProjectReport>, InferCreationAttributes<ProjectReport>> {
  declare id: CreationOptional<number>;
  declare projectId: ForeignKey<Project['id']>;
  declare madeByUserId: number | null;
  declare paper: 'a4' | 'letter';
  declare pdf: Buffer;
  declare byteLength: number;
  /** sha-256 of the PDF's bytes, hex. */
  declare sha256: string;
  /** The highest curve revision id in the catalog when it was made. */
  declare catalogRevision: number;
  /** Null for proposals made before their facts were kept. */
  declare facts: CreationOptional<ProposalFacts | null>;
  declare createdAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    ProjectReport.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        madeByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        paper: { type: DataTypes.ENUM('a4', 'letter'), allowNull: false },
        pdf: { type: DataTypes.BLOB('medium'), allowNull: false },
        byteLength: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        catalogRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        facts: {
          type: DataTypes.JSON,
          allowNull: true,
          // MariaDB keeps JSON as text: read it back as the object it was
          get(this: ProjectReport): ProposalFacts | null {
            const stored = this.getDataValue('facts') as unknown;
            return (typeof stored === 'string' ? JSON.parse(stored) : stored) as ProposalFacts | null;
          },
        },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'project_reports', updatedAt: false },
    );
  }
}
