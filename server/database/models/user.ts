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
import { credentialChangeHooks } from './credential-changes';

/** Someone who signs in: a site admin, a supplier admin, a designer or an integrator. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  /** Kept in lower case; unique. */
  declare email: string;
  declare name: string;
  declare role: Role;
  /** The supplier a supplier-admin is bound to; null for every other role. */
  declare supplierId: ForeignKey<Supplier['id']> | null;
  /** argon2id PHC string; never leaves the server. */
  declare passwordHash: string;
  declare disabled: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM(...roles), allowNull: false },
        supplierId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        passwordHash: { type: DataTypes.STRING(255), allowNull: false },
        disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users', hooks: credentialChangeHooks },
    );
  }
}
