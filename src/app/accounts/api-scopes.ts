import { apiScopes, type ApiScope } from '../../../shared/vocabularies';

/** What each scope lets a token do, in the words the account page shows; a scope without a label does not compile. */
export const apiScopeLabels: Record<ApiScope, string> = {
  'catalog:read': 'Read the pump catalog and curves',
  'calculations:run': 'Run system-curve, operating-point and selection calculations',
  'projects:write': 'Save and change projects',
  'curves:import': 'Import curve tables (supplier admins)',
};

/** The scopes a token may be given, in the vocabulary's order, each with its label. */
export const apiScopeChoices: ReadonlyArray<{ scope: ApiScope; label: string }> = apiScopes.map((scope) => ({
  scope,
  label: apiScopeLabels[scope],
}));
