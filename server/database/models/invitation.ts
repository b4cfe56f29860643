import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { roles, type Role } from '../../../shared/vocabularies';
import type { Supplier } from './supplier';
import type { User } from './user';

/** An admin's invitation to an e-mail address, for a role; accepted once through its e-mailed link. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare role: Role;
  declare supplierId: ForeignKey<Supplier['id']> | null;
  declare invitedByUserId: ForeignKey<User['id']> | null;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    Invitation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.ENUM(...roles), allowNull: false },
        supplierId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        invitedByUserId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations' },
    );
  }
}
