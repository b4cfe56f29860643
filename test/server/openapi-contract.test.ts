import { expect } from 'chai';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import type { OpenAPIV3_1 } from 'openapi-types';
import { listOperations, openApiDocument, openApiPath } from '../../server/api/openapi-document';
import { projectRoot } from '../../server/config';

const generatedTypesPath = join(projectRoot, 'shared', 'api', 'openapi-types.ts');

function contractValidator() {
  const ajv = new Ajv2020({ allErrors: true, strict: true, strictRequired: false, allowUnionTypes: true });
  ajv.addVocabulary(['example', 'xml', 'externalDocs', 'discriminator', 'components']);
  addFormats.default(ajv);
  ajv.addSchema({ $id: 'contract.json', components: openApiDocument.components });
  return (schema: unknown) =>
    ajv.compile(
      JSON.parse(JSON.stringify(schema), (key, value) =>
        key === '$ref' && String(value).startsWith('#/') ? `contract.json${value}` : value,
      ),
    );
}

describe('openapi.yaml', () => {
  const operations = listOperations();

  it('is OpenAPI 3.1 with at least one operation', () => {
    expect(openApiDocument.openapi).to.match(/^3\.1\./);
    expect(operations.length).to.be.greaterThan(0);
  });

  it('gives every operation a unique operationId, a summary and declared security', () => {
    const ids = operations.map((operation) => operation.operationId);
    expect(new Set(ids).size).to.equal(ids.length);
    for (const operation of operations) {
      expect(operation.definition.summary, operation.operationId).to.be.a('string').and.not.empty;
      expect(
        operation.definition.security ?? openApiDocument.security,
        `${operation.operationId} declares no security`,
      ).to.be.an('array');
    }
  });

  it('has an example for every JSON request and response, and each example matches its schema', () => {
    const compile = contractValidator();
    for (const operation of operations) {
      const bodies: Array<[string, OpenAPIV3_1.MediaTypeObject | undefined]> = [
        [
          'request',
          (operation.definition.requestBody as OpenAPIV3_1.RequestBodyObject | undefined)?.content?.[
            'application/json'
          ],
        ],
        ...Object.entries(operation.definition.responses ?? {}).map(
          ([status, response]) =>
            [`response ${status}`, (response as OpenAPIV3_1.ResponseObject).content?.['application/json']] as [
              string,
              OpenAPIV3_1.MediaTypeObject | undefined,
            ],
        ),
      ];
      for (const [where, media] of bodies) {
        if (!media?.schema) continue;
        const examples =
          media.example !== undefined
            ? [media.example]
            : Object.values(media.examples ?? {}).map((example) => (example as OpenAPIV3_1.ExampleObject).value);
        expect(examples, `${operation.operationId} ${where} has no example`).to.not.be.empty;
        const validate = compile(media.schema);
        for (const example of examples) {
          expect(validate(example), `${operation.operationId} ${where}: ${JSON.stringify(validate.errors)}`).to.equal(
            true,
          );
        }
      }
    }
  });

  it('matches the generated types in shared/api (npm run generate:api-types)', function () {
    this.timeout(30_000);
    const folder = mkdtempSync(join(tmpdir(), 'riffle-types-'));
    try {
      const output = join(folder, 'types.ts');
      const result = spawnSync(
        process.execPath,
        [join(projectRoot, 'node_modules', 'openapi-typescript', 'bin', 'cli.js'), openApiPath, '-o', output],
        { encoding: 'utf8' },
      );
      expect(result.status, result.stderr).to.equal(0);
      expect(readFileSync(output, 'utf8')).to.equal(readFileSync(generatedTypesPath, 'utf8'));
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });
});
