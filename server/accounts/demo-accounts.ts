import type { Transaction } from 'sequelize';
import { Supplier, User } from '../database/models';
import type { Role } from '../../shared/vocabularies';
import { hashPassword } from './passwords';

/** The shared password of the invented demo accounts; demo mode only, never in production. */
export const demoPassword = 'riffle-demo';

/** Invented people for the demo. The supplier admin is bound to the first demo supplier. */
export const demoAccounts: ReadonlyArray<{ email: string; name: string; role: Role; supplierCode?: string }> = [
  { email: 'admin@riffle.test', name: 'Demo Site Admin', role: 'admin' },
  { email: 'designer@riffle.test', name: 'Demo Designer', role: 'designer' },
  { email: 'supplier@riffle.test', name: 'Demo Supplier Admin', role: 'supplier-admin', supplierCode: 'ALDERBROOK' },
  { email: 'integrator@riffle.test', name: 'Demo Integrator', role: 'integrator' },
];

/** Adds the demo accounts when the database has no accounts at all; answers whether it did. */
export async function seedDemoAccountsWhenNone(transaction?: Transaction): Promise<boolean> {
  if (process.env.NODE_ENV === 'production') throw new Error('demo accounts are never created in production');
  if ((await User.count({ transaction })) > 0) return false;
  const passwordHash = await hashPassword(demoPassword);
  for (const account of demoAccounts) {
    const supplier = account.supplierCode
      ? await Supplier.findOne({ where: { code: account.supplierCode }, transaction })
      : null;
    if (account.supplierCode && !supplier) throw new Error(`demo supplier ${account.supplierCode} is missing`);
    await User.create(
      { email: account.email, name: account.name, role: account.role, supplierId: supplier?.id ?? null, passwordHash },
      { transaction },
    );
  }
  return true;
}
