// The layer rules of eslint.config.mjs: a back-import in each layer is an error, the allowed direction is not.
import { expect } from 'chai';
import { ESLint } from 'eslint';
import { join } from 'node:path';
import { projectRoot } from '../../server/config';

const eslint = new ESLint({ cwd: projectRoot });

async function restrictedImports(file: string, source: string): Promise<string[]> {
  const [result] = await eslint.lintText(source, { filePath: join(projectRoot, file) });
  return result.messages.filter((message) => message.ruleId === 'no-restricted-imports').map((m) => m.message);
}

describe('layer lint rules', function () {
  this.timeout(60_000);

  const backImports: [string, string, string][] = [
    ['data-import/probe.ts', "import { loadConfig } from '../server/config';", 'data-import/ is pure'],
    ['data-import/probe.ts', "import { Sequelize } from 'sequelize';", 'no database'],
    ['shared/hydraulics/probe.ts', "import { createApp } from '../../server/app';", 'bottom layer'],
    ['shared/hydraulics/probe.ts', "import { readFileSync } from 'node:fs';", 'browser'],
    [
      'server/database/models/probe.ts',
      "import { roles } from '../../accounts/authenticated-user';",
      'knows no feature',
    ],
    [
      'server/database/probe.ts',
      "import { readCurveTable } from '../../data-import/curve-table-reader';",
      'knows no feature',
    ],
    ['src/app/design/probe.ts', "import { createApp } from '../../../server/app';", 'through the API'],
  ];
  for (const [file, source, reason] of backImports) {
    it(`refuses ${source} in ${file}`, async () => {
      const messages = await restrictedImports(file, `${source}\nexport const probe = 1;\n`);
      expect(messages, messages.join('; ')).to.have.length(1);
      expect(messages[0]).to.contain(reason);
    });
  }

  const allowed: [string, string][] = [
    ['server/catalog/probe.ts', "import { readCurveTable } from '../../data-import/curve-table-reader';"],
    ['data-import/probe.ts', "import { fitPumpCurve } from '../shared/hydraulics';"],
    ['src/app/design/probe.ts', "import { fitPumpCurve } from '../../../shared/hydraulics';"],
  ];
  for (const [file, source] of allowed) {
    it(`allows ${source} in ${file}`, async () => {
      expect(await restrictedImports(file, `${source}\nexport const probe = 1;\n`)).to.deep.equal([]);
    });
  }
});
