import { Ajv2020, type ErrorObject, type ValidateFunction } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import type { RequestHandler } from 'express';
import type { OpenAPIV3_1 } from 'openapi-types';
import type { ApiOperation } from './openapi-document';
import { ProblemError, type FieldProblem } from './problem-details';

const contractId = 'riffle-openapi.json';
/** OpenAPI words that may stand inside a schema but are not JSON Schema keywords. */
const openApiSchemaWords = ['example', 'xml', 'externalDocs', 'discriminator', 'components'];

type Location = 'path' | 'query' | 'body';

function declaresInteger(schema: Record<string, unknown>): boolean {
  const type = schema.type;
  return type === 'integer' || (Array.isArray(type) && type.includes('integer'));
}

/**
 * Points a schema's local references (`#/components/...`) at the contract registered with ajv, and
 * bounds every integer to the safe range: beyond 2^53 a number no longer names one row or count,
 * so no handler, query or arithmetic ever sees one.
 */
function retarget<T>(schema: T): T {
  return JSON.parse(JSON.stringify(schema), (key, value: unknown) => {
    if (key === '$ref' && typeof value === 'string' && value.startsWith('#/')) return `${contractId}${value}`;
    if (
      value &&
      typeof value === 'object' &&
      !Array.isArray(value) &&
      declaresInteger(value as Record<string, unknown>)
    )
      return { minimum: Number.MIN_SAFE_INTEGER, maximum: Number.MAX_SAFE_INTEGER, ...value };
    return value;
  }) as T;
}

function toFieldProblems(location: Location, errors: ErrorObject[] | null | undefined): FieldProblem[] {
  return (errors ?? []).map((error) => {
    let pointer = `/${location}${error.instancePath}`;
    if (error.keyword === 'required') pointer += `/${(error.params as { missingProperty: string }).missingProperty}`;
    if (error.keyword === 'additionalProperties')
      pointer += `/${(error.params as { additionalProperty: string }).additionalProperty}`;
    const detail =
      error.keyword === 'additionalProperties'
        ? 'is not a field this operation accepts'
        : error.keyword === 'enum'
          ? `must be one of: ${(error.params as { allowedValues: unknown[] }).allowedValues.join(', ')}`
          : (error.message ?? 'is not valid');
    return { pointer, detail };
  });
}

/**
 * Path and query numbers as the contract types them: finite, and integers safe. Checked on the
 * text before ajv coerces it, since ajv's coercion turns `1e400` into Infinity and lets it pass.
 */
function parameterNumberProblems(
  parameters: OpenAPIV3_1.ParameterObject[],
  values: Record<string, unknown>,
  location: 'path' | 'query',
): FieldProblem[] {
  const problems: FieldProblem[] = [];
  for (const parameter of parameters) {
    const schema = (parameter.schema ?? {}) as Record<string, unknown>;
    const integer = declaresInteger(schema);
    if (!integer && schema.type !== 'number') continue;
    const raw = values[parameter.name];
    for (const text of Array.isArray(raw) ? raw : raw === undefined ? [] : [raw]) {
      const value = typeof text === 'string' && text.trim() !== '' ? Number(text) : Number.NaN;
      if (integer ? !Number.isSafeInteger(value) : !Number.isFinite(value)) {
        problems.push({
          pointer: `/${location}/${parameter.name}`,
          detail: integer ? 'must be a whole number no larger than 9007199254740991' : 'must be a finite number',
        });
        break;
      }
    }
  }
  return problems;
}

/** Builds, once per operation, the validators of its path, query and JSON body against the contract. */
export class RequestValidatorFactory {
  private readonly bodyAjv: Ajv2020;
  private readonly parameterAjv: Ajv2020;

  constructor(document: OpenAPIV3_1.Document) {
    const contract = { $id: contractId, components: retarget(document.components ?? {}) };
    // strictNumbers: Infinity and NaN (what `1e400` in a path or query becomes) are not numbers.
    this.bodyAjv = new Ajv2020({
      allErrors: true,
      strict: true,
      strictRequired: false,
      allowUnionTypes: true,
      strictNumbers: true,
    });
    // Path and query values arrive as text; the contract's types say what they must become.
    this.parameterAjv = new Ajv2020({
      allErrors: true,
      strict: true,
      strictRequired: false,
      allowUnionTypes: true,
      strictNumbers: true,
      coerceTypes: 'array',
    });
    for (const ajv of [this.bodyAjv, this.parameterAjv]) {
      ajv.addVocabulary(openApiSchemaWords);
      addFormats.default(ajv);
      ajv.addSchema(contract);
    }
  }

  /** A middleware validating the request, or undefined when the operation takes nothing to validate. */
  forOperation(operation: ApiOperation): RequestHandler | undefined {
    const parameters = [
      ...(operation.pathItem.parameters ?? []),
      ...(operation.definition.parameters ?? []),
    ] as OpenAPIV3_1.ParameterObject[];
    const pathParameters = parameters.filter((parameter) => parameter.in === 'path');
    const queryParameters = parameters.filter((parameter) => parameter.in === 'query');
    const pathValidator = this.parameterValidator(pathParameters, 'path');
    const queryValidator = this.parameterValidator(queryParameters, 'query');
    const body = operation.definition.requestBody as OpenAPIV3_1.RequestBodyObject | undefined;
    const jsonSchema = body?.content?.['application/json']?.schema;
    const bodyValidator = jsonSchema ? this.bodyAjv.compile(retarget(jsonSchema)) : undefined;
    if (!pathValidator && !queryValidator && !bodyValidator) return undefined;

    return (request, _response, next) => {
      const problems: FieldProblem[] = [];
      const pathNumbers = parameterNumberProblems(pathParameters, request.params, 'path');
      problems.push(...pathNumbers);
      if (pathValidator && pathNumbers.length === 0 && !pathValidator(request.params))
        problems.push(...toFieldProblems('path', pathValidator.errors));
      if (queryValidator) {
        // Express 5 makes request.query a getter; validate (and coerce) a copy, then keep it.
        const query = { ...(request.query as Record<string, unknown>) };
        const queryNumbers = parameterNumberProblems(queryParameters, query, 'query');
        problems.push(...queryNumbers);
        if (queryNumbers.length === 0 && !queryValidator(query))
          problems.push(...toFieldProblems('query', queryValidator.errors));
        else Object.defineProperty(request, 'query', { value: query, writable: true, configurable: true });
      }
      if (bodyValidator) {
        if (body?.required && (request.body === undefined || !request.is('application/json'))) {
          problems.push({ pointer: '/body', detail: 'a JSON body (Content-Type: application/json) is required' });
        } else if (request.body !== undefined && !bodyValidator(request.body)) {
          problems.push(...toFieldProblems('body', bodyValidator.errors));
        }
      }
      if (problems.length > 0) {
        next(
          new ProblemError(
            400,
            'Invalid request',
            `${problems[0].pointer} ${problems[0].detail}`,
            problems,
            'invalid-request',
          ),
        );
        return;
      }
      next();
    };
  }

  /** The validator of one location's parameters (all `in: path` or all `in: query`). */
  private parameterValidator(
    parameters: OpenAPIV3_1.ParameterObject[],
    location: 'path' | 'query',
  ): ValidateFunction | undefined {
    if (parameters.length === 0) return undefined;
    const schema = {
      type: 'object',
      properties: Object.fromEntries(parameters.map((parameter) => [parameter.name, retarget(parameter.schema ?? {})])),
      required: parameters.filter((parameter) => parameter.required).map((parameter) => parameter.name),
      additionalProperties: location === 'path',
    };
    return this.parameterAjv.compile(schema);
  }
}
