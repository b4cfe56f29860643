import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { ApiTokenRevokedReason } from '../../../shared/api/api-schemas';
import type { ApiScope } from '../../../shared/vocabularies';
import type { User } from './user';
import { credentialChangeHooks } from './credential-changes';

/**
 * A personal API token: its name, shown prefix, scopes and the SHA-256 of the token itself; once
 * revoked, when and why, so that its owner knows which tokens a password reset took away.
 */
export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare name: string;
  declare tokenPrefix: string;
  declare tokenHash: string;
  declare scopes: ApiScope[];
  declare expiresAt: Date | null;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedReason: CreationOptional<ApiTokenRevokedReason | null>;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare user?: NonAttribute<User>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    ApiToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        tokenPrefix: { type: DataTypes.STRING(16), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        scopes: {
          type: DataTypes.STRING(255),
          allowNull: false,
          get(this: ApiToken): ApiScope[] {
            const stored = this.getDataValue('scopes') as unknown as string;
            return stored ? (stored.split(' ') as ApiScope[]) : [];
          },
          set(this: ApiToken, value: ApiScope[]) {
            this.setDataValue('scopes', value.join(' ') as unknown as ApiScope[]);
          },
        },
        expiresAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        revokedReason: { type: DataTypes.STRING(20), allowNull: true },
        lastUsedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'api_tokens', hooks: credentialChangeHooks },
    );
  }
}
