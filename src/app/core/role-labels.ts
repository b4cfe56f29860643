import type { Role } from '../../../shared/api/api-schemas';

/** The roles in the words the pages use, in the order a site admin usually picks them. */
export const roleChoices: ReadonlyArray<{ role: Role; label: string }> = [
  { role: 'designer', label: 'Designer' },
  { role: 'integrator', label: 'Integrator' },
  { role: 'supplier-admin', label: 'Supplier admin' },
  { role: 'admin', label: 'Site admin' },
];

export function roleLabel(role: Role | null | undefined): string {
  return roleChoices.find((choice) => choice.role === role)?.label ?? '';
}
