import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { visibleTextProblem } from '../../../shared/text-rules';

/** A pump maker or distributor whose curve tables Riffle holds. */
export class Supplier extends Model<InferAttributes<Supplier>, InferCreationAttributes<Supplier>> {
  declare id: CreationOptional<number>;
  /** Short code used on the command line and in file names, e.g. `KESTREL`. */
  declare code: string;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initialise(sequelize: Sequelize): void {
    Supplier.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        name: {
          type: DataTypes.STRING(160),
          allowNull: false,
          // No feature sets a supplier's name yet: the rule for names people type holds on every path that saves one.
          validate: {
            visibleText(value: string) {
              const problem = visibleTextProblem(value);
              if (problem) throw new Error(`a supplier's name ${problem}`);
            },
          },
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'suppliers' },
    );
  }
}
