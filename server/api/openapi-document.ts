import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { OpenAPIV3_1 } from 'openapi-types';
import { parse } from 'yaml';
import { projectRoot } from '../config';

export const openApiPath = join(projectRoot, 'openapi.yaml');

/** The contract's text, served as it is. */
export const openApiText = readFileSync(openApiPath, 'utf8');

/** The contract, parsed once: routes, validation and authorization all read from it. */
export const openApiDocument = parse(openApiText) as OpenAPIV3_1.Document;

export const httpMethods = ['get', 'put', 'post', 'delete', 'patch'] as const;
export type HttpMethod = (typeof httpMethods)[number];

export interface ApiOperation {
  operationId: string;
  method: HttpMethod;
  /** The path as the contract writes it, e.g. `/pumps/{pumpId}`. */
  path: string;
  definition: OpenAPIV3_1.OperationObject;
  pathItem: OpenAPIV3_1.PathItemObject;
}

/** Every operation of the contract, in document order. */
export function listOperations(document: OpenAPIV3_1.Document = openApiDocument): ApiOperation[] {
  const operations: ApiOperation[] = [];
  for (const [path, pathItem] of Object.entries(document.paths ?? {})) {
    if (!pathItem) continue;
    for (const method of httpMethods) {
      const definition = pathItem[method];
      if (!definition) continue;
      if (!definition.operationId)
        throw new Error(`${method.toUpperCase()} ${path} in openapi.yaml has no operationId`);
      operations.push({ operationId: definition.operationId, method, path, definition, pathItem });
    }
  }
  return operations;
}
