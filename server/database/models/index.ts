import type { Sequelize } from 'sequelize';
import { Supplier } from './supplier';

/** Initialises every model and declares the associations, in one place. */
export function initialiseModels(sequelize: Sequelize): void {
  Supplier.initialise(sequelize);
}

export { Supplier };
