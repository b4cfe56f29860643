import { roles, type Role } from '../../../shared/vocabularies';

/** The roles in the words the pages use; a role added to the vocabulary without a label here does not compile. */
export const roleLabels: Record<Role, string> = {
  admin: 'Site admin',
  'supplier-admin': 'Supplier admin',
  designer: 'Designer',
  integrator: 'Integrator',
};

/** The roles a site admin picks from, in the vocabulary's order, each with its label. */
export const roleChoices: ReadonlyArray<{ role: Role; label: string }> = roles.map((role) => ({
  role,
  label: roleLabels[role],
}));

export function roleLabel(role: Role | null | undefined): string {
  return role ? roleLabels[role] : '';
}
