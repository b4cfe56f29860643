import type { Sequelize } from 'sequelize';
import { Supplier } from './models';

/** Invented suppliers for the demo; no real maker or distributor is meant. */
export const demoSuppliers = [
  { code: 'ALDERBROOK', name: 'Alderbrook Demo Pumps' },
  { code: 'QUILLWATER', name: 'Quillwater Demo Supply' },
  { code: 'STONETARN', name: 'Stonetarn Demo Hydraulics' },
] as const;

/** Fills an empty database with the demo data; a database that holds anything is left alone. */
export async function seedDemoDataWhenEmpty(sequelize: Sequelize): Promise<boolean> {
  if ((await Supplier.count()) > 0) return false;
  await sequelize.transaction(async (transaction) => {
    await Supplier.bulkCreate([...demoSuppliers], { transaction });
  });
  return true;
}
