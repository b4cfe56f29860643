import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** How one user likes the pages laid out, whichever browser they sign in from. */
export class UserPreference extends Model<InferAttributes<UserPreference>, InferCreationAttributes<UserPreference>> {
  declare userId: number;
  /** The candidates table's shown columns by id; null until the user first chooses. */
  declare candidateColumns: string[] | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    UserPreference.init(
      {
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        candidateColumns: {
          type: DataTypes.JSON,
          allowNull: true,
          // MariaDB keeps JSON as text: read it back as the list it was
          get(this: UserPreference): string[] | null {
            const stored = this.getDataValue('candidateColumns') as unknown;
            return (typeof stored === 'string' ? JSON.parse(stored) : stored) as string[] | null;
          },
        },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'user_preferences' },
    );
  }
}
