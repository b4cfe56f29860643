import type { Sequelize } from 'sequelize';
import { seedDemoCurvesWhenNone } from './demo-curve-seed';
import { seedDemoAccountsWhenNone } from '../accounts/demo-accounts';
import { Supplier } from '../database/models';

/** Invented suppliers for the demo; no real maker or distributor is meant. */
export const demoSuppliers = [
  { code: 'ALDERBROOK', name: 'Alderbrook Demo Pumps' },
  { code: 'QUILLWATER', name: 'Quillwater Demo Supply' },
  { code: 'STONETARN', name: 'Stonetarn Demo Hydraulics' },
] as const;

async function seedDemoSuppliersWhenNone(): Promise<boolean> {
  if ((await Supplier.count()) > 0) return false;
  await Supplier.bulkCreate([...demoSuppliers]);
  return true;
}

/**
 * Fills in the demo data, each part only where none of its kind exists yet, so a database made
 * before a part existed gets it too and nothing a user entered is touched. Suppliers first: the
 * demo accounts and curve tables name them. The curves go through the same import path as the
 * command and the API. Returns whether anything was added.
 */
export async function seedMissingDemoData(sequelize: Sequelize): Promise<boolean> {
  const suppliersAdded = await seedDemoSuppliersWhenNone();
  const accountsAdded = await sequelize.transaction((transaction) => seedDemoAccountsWhenNone(transaction));
  const pumpsAdded = (await seedDemoCurvesWhenNone(sequelize)) > 0;
  return suppliersAdded || accountsAdded || pumpsAdded;
}
