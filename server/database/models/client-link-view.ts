import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { ClientLink } from './client-link';

/** One opening of a client link: its page or its PDF. */
export class ClientLinkView extends Model<InferAttributes<ClientLinkView>, InferCreationAttributes<ClientLinkView>> {
  declare id: CreationOptional<number>;
  declare linkId: ForeignKey<ClientLink['id']>;
  declare what: 'page' | 'pdf';
  declare viewedAt: Date;

  static initialise(sequelize: Sequelize): void {
    ClientLinkView.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        what: { type: DataTypes.ENUM('page', 'pdf'), allowNull: false },
        viewedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'client_link_views', timestamps: false },
    );
  }
}
