import { Ajv2020, type ValidateFunction } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import { openApiDocument } from '../../server/api/openapi-document';

/** An ajv validator for one of the contract's component schemas, as the answers must meet it. */
export function contractSchemaValidator(schema: string): ValidateFunction {
  const ajv = new Ajv2020({ allErrors: true, strict: true, strictRequired: false, allowUnionTypes: true });
  ajv.addVocabulary(['example', 'xml', 'externalDocs', 'discriminator', 'components']);
  addFormats.default(ajv);
  ajv.addSchema({ $id: 'contract.json', components: openApiDocument.components });
  return ajv.compile({ $ref: `contract.json#/components/schemas/${schema}` });
}
