// The product's closed word lists, as runtime arrays for models, validators and pages. Each is
// checked against the contract's own union type, so a change to openapi.yaml that is not made here
// (or the reverse) stops the type check.
import type { components } from './api/openapi-types';

type Schemas = components['schemas'];

/** Both ways assignable: the list names exactly the contract's values. */
type SameWords<List extends readonly string[], Contract extends string> = [List[number]] extends [Contract]
  ? [Contract] extends [List[number]]
    ? List
    : never
  : never;

function wordList<const List extends readonly string[], Contract extends string>(
  list: List & SameWords<List, Contract>,
): List {
  return list;
}

/** Who a signed-in user is; `x-riffle-access.roles` of an operation names them. */
export const roles = wordList<['admin', 'supplier-admin', 'designer', 'integrator'], Schemas['Role']>([
  'admin',
  'supplier-admin',
  'designer',
  'integrator',
]);
export type Role = (typeof roles)[number];

/** What a personal API token may be used for; an operation's `x-riffle-access.scopes` names them. */
export const apiScopes = wordList<
  ['catalog:read', 'calculations:run', 'projects:write', 'curves:import'],
  Schemas['ApiScope']
>(['catalog:read', 'calculations:run', 'projects:write', 'curves:import']);
export type ApiScope = (typeof apiScopes)[number];

/** How a pump is built and installed. */
export const pumpKinds = wordList<['submersible', 'external-centrifugal', 'mixed-flow'], Schemas['PumpKind']>([
  'submersible',
  'external-centrifugal',
  'mixed-flow',
]);
export type PumpKind = (typeof pumpKinds)[number];

/** Whether a pump is offered; retired pumps keep their curves for saved projects and the export. */
export const pumpStatuses = wordList<['active', 'retired'], Schemas['PumpSummary']['status']>(['active', 'retired']);
export type PumpStatus = (typeof pumpStatuses)[number];
