// The product's closed word lists, as runtime arrays for models, validators and pages. Each is
// checked against the contract's own union type, so a change to openapi.yaml that is not made here
// (or the reverse) stops the type check.
import type { components } from './api/openapi-types';

type Schemas = components['schemas'];

/**
 * A word list checked against the contract's union both ways: each word is one of the contract's
 * (the element type) and none of the contract's is missing (the intersection becomes `never`).
 */
function wordList<Contract extends string>() {
  return <const List extends readonly Contract[]>(
    list: List & ([Exclude<Contract, List[number]>] extends [never] ? unknown : never),
  ): List => list;
}

/** Who a signed-in user is; `x-riffle-access.roles` of an operation names them. */
export const roles = wordList<Schemas['Role']>()(['admin', 'supplier-admin', 'designer', 'integrator']);
export type Role = (typeof roles)[number];

/** What a personal API token may be used for; an operation's `x-riffle-access.scopes` names them. */
export const apiScopes = wordList<Schemas['ApiScope']>()([
  'catalog:read',
  'calculations:run',
  'projects:write',
  'curves:import',
]);
export type ApiScope = (typeof apiScopes)[number];

/** How a pump is built and installed. */
export const pumpKinds = wordList<Schemas['PumpKind']>()(['submersible', 'external-centrifugal', 'mixed-flow']);
export type PumpKind = (typeof pumpKinds)[number];

/** Whether a pump is offered; retired pumps keep their curves for saved projects and the export. */
export const pumpStatuses = wordList<Schemas['PumpSummary']['status']>()(['active', 'retired']);
export type PumpStatus = (typeof pumpStatuses)[number];

/** The candidates table's columns a user may hide, in table order; a user's preferences name them. */
export const candidateColumns = wordList<Schemas['CandidateColumn']>()([
  'arrangement',
  'flow',
  'head',
  'bep',
  'region',
  'power',
  'energy',
  'cost',
  'price',
  'firstCost',
  'lifeCycleCost',
  'oneFailed',
  'misses',
  'warnings',
  'reasons',
]);
export type CandidateColumn = (typeof candidateColumns)[number];
