import { Router, type RequestHandler } from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import { listOperations, type ApiOperation } from './openapi-document';
import { RequestValidatorFactory } from './request-validation';

/** What the server does for each operationId of the contract. */
export type OperationHandlers = Record<string, RequestHandler>;

export interface OperationRouterOptions {
  document: OpenAPIV3_1.Document;
  handlers: OperationHandlers;
  /** Middleware that enforces the operation's declared security, when it declares any. */
  guardFor?: (operation: ApiOperation) => RequestHandler | undefined;
}

/** `/pumps/{pumpId}` -> `/pumps/:pumpId` */
function toExpressPath(path: string): string {
  return path.replace(/\{([A-Za-z0-9_]+)\}/g, ':$1');
}

/**
 * The one route table: every operation of the contract, guarded and validated from its own
 * declaration. A contract operation without a handler, or a handler without an operation, stops
 * the server at start-up rather than answering 404 later.
 */
export function createOperationRouter({ document, handlers, guardFor }: OperationRouterOptions): Router {
  const router = Router();
  const validators = new RequestValidatorFactory(document);
  const operations = listOperations(document);
  const missing = operations
    .filter((operation) => !handlers[operation.operationId])
    .map((operation) => operation.operationId);
  const unknown = Object.keys(handlers).filter((id) => !operations.some((operation) => operation.operationId === id));
  if (missing.length > 0 || unknown.length > 0) {
    throw new Error(
      `route table and openapi.yaml disagree: no handler for [${missing.join(', ')}]; no operation for [${unknown.join(', ')}]`,
    );
  }
  for (const operation of operations) {
    const chain = [guardFor?.(operation), validators.forOperation(operation), handlers[operation.operationId]].filter(
      (middleware): middleware is RequestHandler => middleware !== undefined,
    );
    router[operation.method](toExpressPath(operation.path), ...chain);
  }
  return router;
}
