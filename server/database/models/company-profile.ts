import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A designer's company as it heads their proposals: contact lines and a checked logo. */
export class CompanyProfile extends Model<InferAttributes<CompanyProfile>, InferCreationAttributes<CompanyProfile>> {
  declare userId: number;
  declare name: string;
  declare address: string;
  declare phone: string;
  declare email: string;
  declare licenceNumber: string;
  declare logo: Buffer | null;
  declare logoType: 'image/png' | 'image/jpeg' | null;
  declare logoWidth: number | null;
  declare logoHeight: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    CompanyProfile.init(
      {
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        address: { type: DataTypes.STRING(400), allowNull: false },
        phone: { type: DataTypes.STRING(40), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        licenceNumber: { type: DataTypes.STRING(60), allowNull: false },
        logo: { type: DataTypes.BLOB('medium'), allowNull: true },
        logoType: { type: DataTypes.STRING(20), allowNull: true },
        logoWidth: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        logoHeight: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'company_profiles' },
    );
  }
}
