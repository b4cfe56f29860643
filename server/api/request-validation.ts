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

/** Points a schema's local references (`#/components/...`) at the contract registered with ajv. */
function retarget<T>(schema: T): T {
  return JSON.parse(JSON.stringify(schema), (key, value) =>
    key === '$ref' && typeof value === 'string' && value.startsWith('#/') ? `${contractId}${value}` : value,
  ) as T;
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

/** Builds, once per operation, the validators of its path, query and JSON body against the contract. */
export class RequestValidatorFactory {
  private readonly bodyAjv: Ajv2020;
  private readonly parameterAjv: Ajv2020;

  constructor(document: OpenAPIV3_1.Document) {
    const contract = { $id: contractId, components: document.components ?? {} };
    this.bodyAjv = new Ajv2020({ allErrors: true, strict: true, strictRequired: false, allowUnionTypes: true });
    // Path and query values arrive as text; the contract's types say what they must become.
    this.parameterAjv = new Ajv2020({
      allErrors: true,
      strict: true,
      strictRequired: false,
      allowUnionTypes: true,
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
    const pathValidator = this.parameterValidator(parameters, 'path');
    const queryValidator = this.parameterValidator(parameters, 'query');
    const body = operation.definition.requestBody as OpenAPIV3_1.RequestBodyObject | undefined;
    const jsonSchema = body?.content?.['application/json']?.schema;
    const bodyValidator = jsonSchema ? this.bodyAjv.compile(retarget(jsonSchema)) : undefined;
    if (!pathValidator && !queryValidator && !bodyValidator) return undefined;

    return (request, _response, next) => {
      const problems: FieldProblem[] = [];
      if (pathValidator && !pathValidator(request.params))
        problems.push(...toFieldProblems('path', pathValidator.errors));
      if (queryValidator) {
        // Express 5 makes request.query a getter; validate (and coerce) a copy, then keep it.
        const query = { ...(request.query as Record<string, unknown>) };
        if (!queryValidator(query)) problems.push(...toFieldProblems('query', queryValidator.errors));
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

  private parameterValidator(
    parameters: OpenAPIV3_1.ParameterObject[],
    location: 'path' | 'query',
  ): ValidateFunction | undefined {
    const own = parameters.filter((parameter) => parameter.in === location);
    if (own.length === 0) return undefined;
    const schema = {
      type: 'object',
      properties: Object.fromEntries(own.map((parameter) => [parameter.name, retarget(parameter.schema ?? {})])),
      required: own.filter((parameter) => parameter.required).map((parameter) => parameter.name),
      additionalProperties: location === 'path',
    };
    return this.parameterAjv.compile(schema);
  }
}
