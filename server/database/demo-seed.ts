import type { Sequelize } from 'sequelize';
import { seedDemoAccountsWhenNone } from '../accounts/demo-accounts';
import { Supplier } from './models';

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
    return false;
  }
  await sequelize.transaction(async (transaction) => {
    await Supplier.bulkCreate([...demoSuppliers], { transaction });
    await seedDemoAccountsWhenNone(transaction);
  });
  return true;
}
