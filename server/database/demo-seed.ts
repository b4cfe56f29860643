import type { Sequelize } from 'sequelize';
import { seedDemoAccountsWhenNone } from '../accounts/demo-accounts';
import { Supplier } from './models';
// catalog
import { seedDemoCurvesWhenNone } from '../../data-import/demo-data/demo-curve-seed';

/** Invented suppliers for the demo; no real maker or distributor is meant. */
export const demoSuppliers = [
  { code: 'ALDERBROOK', name: 'Alderbrook Demo Pumps' },
  { code: 'QUILLWATER', name: 'Quillwater Demo Supply' },
  { code: 'STONETARN', name: 'Stonetarn Demo Hydraulics' },
] as const;

/** Fills an empty database with the demo data; a database that holds anything is left alone. */
export async function seedDemoDataWhenEmpty(sequelize: Sequelize): Promise<boolean> {
  if ((await Supplier.count()) > 0) {
    // Demo accounts: a database seeded before accounts existed gets them too.
    await sequelize.transaction((transaction) => seedDemoAccountsWhenNone(transaction));
    // catalog: a database seeded before the catalog existed gets the demo pumps too.
    await seedDemoCurvesWhenNone(sequelize);
    return false;
  }
  await sequelize.transaction(async (transaction) => {
    await Supplier.bulkCreate([...demoSuppliers], { transaction });
    await seedDemoAccountsWhenNone(transaction);
  });
  // catalog: the demo curve tables, through the same import path as the command and the API.
  await seedDemoCurvesWhenNone(sequelize);
  return true;
}
