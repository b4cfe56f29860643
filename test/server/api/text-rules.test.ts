import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import { listOperations } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { visibleTextPattern, visibleTextProblem } from '../../../shared/text-rules';
import { createUserWithSession } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';

const refusedNames = ['Pond \u202Egnp.exe', 'Isolate \u2066x\u2069', 'Bell\u0007', '<b>', '   '];

describe('the shared text rule for names', () => {
  it('keeps ordinary names, accents and scripts included', () => {
    for (const name of ['Koi pond 2', 'Étang du moulin', '池の滝', 'O\u2019Neill']) {
      expect(visibleTextProblem(name), name).to.equal(undefined);
      expect(visibleTextPattern.test(name), name).to.equal(true);
    }
  });

  it('refuses bidirectional controls, other control characters, angle brackets and blank names', () => {
    for (const name of refusedNames) {
      expect(visibleTextProblem(name), JSON.stringify(name)).to.be.a('string');
      expect(visibleTextPattern.test(name), JSON.stringify(name)).to.equal(false);
    }
  });

  describe('in project names', function () {
    this.timeout(60_000);
    let drop: () => Promise<void>;
    let sequelize: Awaited<ReturnType<typeof createScratchDatabase>>['sequelize'];

    before(async () => {
      ({ sequelize, drop } = await createScratchDatabase('text_rules'));
    });

    after(async () => {
      await drop?.();
    });

    it('answers 422 at /body/name for a name with a right-to-left override', async () => {
      const app = createApp({ sequelize, logger: createLogger('silent') });
      const { token } = await createUserWithSession(sequelize, 'designer');
      const create = listOperations().find((operation) => operation.operationId === 'createProject')!;
      const body = create.definition.requestBody as OpenAPIV3_1.RequestBodyObject;
      const example = body.content!['application/json'].example as Record<string, unknown>;
      const response = await request(app)
        .post('/api/v1/projects')
        .set('Authorization', `Bearer ${token}`)
        .send({ ...example, name: 'Pond \u202Egnp.exe' });
      expect(response.status, JSON.stringify(response.body)).to.equal(422);
      expect(response.body.pointer).to.equal('/body/name');
      const kept = await request(app)
        .post('/api/v1/projects')
        .set('Authorization', `Bearer ${token}`)
        .send({ ...example, name: 'Pond 1' });
      expect(kept.status, JSON.stringify(kept.body)).to.equal(201);
    });
  });
});
