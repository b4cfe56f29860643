// Names for the contract's schemas, so both sides import `Health` rather than the generated path.
// The generated file comes from openapi.yaml: `npm run generate:api-types`.
import type { components } from './openapi-types';

type Schemas = components['schemas'];

export type Health = Schemas['Health'];
export type ProblemDetails = Schemas['ProblemDetails'];
