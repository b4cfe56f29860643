import type { ApiScope } from '../../../shared/api/api-schemas';

/** What each scope lets a token do, in the words the account page shows. */
export const apiScopeChoices: ReadonlyArray<{ scope: ApiScope; label: string }> = [
  { scope: 'catalog:read', label: 'Read the pump catalog and curves' },
  { scope: 'calculations:run', label: 'Run system-curve, operating-point and selection calculations' },
  { scope: 'projects:write', label: 'Save and change projects' },
  { scope: 'curves:import', label: 'Import curve tables (supplier admins)' },
];
