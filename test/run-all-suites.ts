// `npm test`: a throwaway MariaDB on a free loopback port, then every suite (mocha for shared/,
// server/, data-import/ and the browser; vitest for the Angular specs), then one summary line.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { projectRoot } from '../server/config';
import { createSequelize } from '../server/database/connection';
import { seedMissingDemoData } from '../server/demo/demo-seed';
import { createMigrator } from '../server/database/migrator';
import { initialiseModels } from '../server/database/models';
import { PrivateMariaDb } from '../server/database/private-mariadb';
import { ensureClientBuilt } from '../server/launch/client-build';
import { startFakeSmtpServer, type FakeSmtpServer } from '../server/mail/fake-smtp-server';
import { freeLoopbackPort } from './support/free-port';

interface SuiteResult {
  name: string;
  passed: number;
  failed: number;
}

function say(line: string): void {
  console.log(`\n[riffle test] ${line}`);
}

function runChild(command: string, args: string[], env: NodeJS.ProcessEnv): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: projectRoot, stdio: ['ignore', 'inherit', 'inherit'], env });
    child.once('error', () => resolve(127));
    child.once('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

function readJson<T>(file: string): T | undefined {
  return existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as T) : undefined;
}

/** `npm test -- FILE...` runs only those mocha files (with the database), for work on one feature. */
const chosenMochaFiles = process.argv.slice(2);

async function runMocha(env: NodeJS.ProcessEnv, workFolder: string): Promise<SuiteResult> {
  const countsFile = join(workFolder, 'mocha-counts.json');
  const chosen =
    chosenMochaFiles.length > 0 ? ['--no-config', '--node-option', 'import=tsx', '--timeout', '20000'] : [];
  const exitCode = await runChild(
    process.execPath,
    [
      join(projectRoot, 'node_modules', 'mocha', 'bin', 'mocha.js'),
      ...chosen,
      '--reporter',
      join(projectRoot, 'test', 'support', 'counting-reporter.cjs'),
      ...chosenMochaFiles,
    ],
    { ...env, RIFFLE_TEST_COUNTS_FILE: countsFile },
  );
  const counts = readJson<{ passed: number; failed: number }>(countsFile);
  if (!counts) return { name: 'mocha', passed: 0, failed: 1 };
  return {
    name: 'mocha (shared, server, data-import, browser)',
    passed: counts.passed,
    failed: counts.failed || (exitCode === 0 ? 0 : 1),
  };
}

async function runAngularSpecs(env: NodeJS.ProcessEnv, workFolder: string): Promise<SuiteResult> {
  const reportFile = join(workFolder, 'angular-unit.json');
  const exitCode = await runChild(
    process.execPath,
    [
      join(projectRoot, 'node_modules', '@angular', 'cli', 'bin', 'ng.js'),
      'test',
      '--reporters=json',
      `--output-file=${reportFile}`,
      '--reporters=default',
    ],
    { ...env, NG_CLI_ANALYTICS: 'false' },
  );
  const report = readJson<{ numPassedTests: number; numFailedTests: number }>(reportFile);
  if (!report) return { name: 'angular', passed: 0, failed: 1 };
  return {
    name: 'angular (vitest)',
    passed: report.numPassedTests,
    failed: report.numFailedTests || (exitCode === 0 ? 0 : 1),
  };
}

async function runTypeCheck(env: NodeJS.ProcessEnv): Promise<SuiteResult> {
  const exitCode = await runChild(
    process.execPath,
    [join(projectRoot, 'node_modules', 'typescript', 'bin', 'tsc'), '--noEmit', '-p', 'tsconfig.json'],
    env,
  );
  return { name: 'type check (tsc)', passed: exitCode === 0 ? 1 : 0, failed: exitCode === 0 ? 0 : 1 };
}

async function runLint(env: NodeJS.ProcessEnv): Promise<SuiteResult[]> {
  const binary = (name: string, ...path: string[]) => join(projectRoot, 'node_modules', name, ...path);
  const eslintExit = await runChild(process.execPath, [binary('eslint', 'bin', 'eslint.js'), '.'], env);
  const prettierExit = await runChild(
    process.execPath,
    [binary('prettier', 'bin', 'prettier.cjs'), '--check', '.'],
    env,
  );
  return [
    { name: 'lint (eslint)', passed: eslintExit === 0 ? 1 : 0, failed: eslintExit === 0 ? 0 : 1 },
    { name: 'format (prettier)', passed: prettierExit === 0 ? 1 : 0, failed: prettierExit === 0 ? 0 : 1 },
  ];
}

async function main(): Promise<number> {
  const workFolder = mkdtempSync(join(tmpdir(), 'riffle-test-'));
  const databasePort = await freeLoopbackPort();
  const databaseName = 'riffle_test';
  let database: PrivateMariaDb | undefined;
  let smtp: FakeSmtpServer | undefined;
  const results: SuiteResult[] = [];
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      say(`${signal} received; stopping the test MariaDB`);
      void Promise.all([database?.stop(), smtp?.stop()]).finally(() => {
        rmSync(workFolder, { recursive: true, force: true });
        process.exit(130);
      });
    });
  }
  try {
    say(`starting a throwaway MariaDB on 127.0.0.1:${databasePort}`);
    database = await PrivateMariaDb.startOrReuse({ folder: join(workFolder, 'mariadb'), port: databasePort });
    await database.ensureDatabase(databaseName);
    const databaseConfig = { host: '127.0.0.1', port: databasePort, name: databaseName, user: 'root', password: '' };
    const sequelize = createSequelize(databaseConfig);
    initialiseModels(sequelize);
    await createMigrator(sequelize).up();
    await seedMissingDemoData(sequelize);
    await sequelize.close();

    await ensureClientBuilt(say);

    // Mail from the suites goes to a fake SMTP server on loopback; they read what it kept in the mailbox folder.
    const mailboxFolder = join(workFolder, 'mailbox');
    smtp = await startFakeSmtpServer({ port: 0, mailboxFolder });
    say(`fake SMTP server on 127.0.0.1:${smtp.port}`);

    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: 'test',
      RIFFLE_DB_HOST: '127.0.0.1',
      RIFFLE_DB_PORT: String(databasePort),
      RIFFLE_DB_NAME: databaseName,
      RIFFLE_TEST_MARIADB_FOLDER: join(workFolder, 'mariadb'),
      RIFFLE_TEST_WORK_FOLDER: workFolder,
      RIFFLE_SMTP_HOST: '',
      RIFFLE_SMTP_PORT: String(smtp.port),
      RIFFLE_MAILBOX_FOLDER: mailboxFolder,
    };
    if (chosenMochaFiles.length > 0) {
      say(`mocha: ${chosenMochaFiles.join(' ')}`);
      results.push(await runMocha(env, workFolder));
    } else {
      say('type check');
      results.push(await runTypeCheck(env));
      say('lint and format');
      results.push(...(await runLint(env)));
      say('mocha suites');
      results.push(await runMocha(env, workFolder));
      say('Angular unit tests');
      results.push(await runAngularSpecs(env, workFolder));
    }
  } catch (error) {
    console.error(error);
    results.push({ name: 'set-up', passed: 0, failed: 1 });
  } finally {
    await smtp?.stop();
    await database?.stop().catch((error: Error) => console.error(`could not stop the test MariaDB: ${error.message}`));
    rmSync(workFolder, { recursive: true, force: true });
  }
  say('results');
  for (const result of results) console.log(`  ${result.name}: ${result.passed} passed, ${result.failed} failed`);
  const passed = results.reduce((sum, result) => sum + result.passed, 0);
  const failed = results.reduce((sum, result) => sum + result.failed, 0);
  console.log(`${passed} passed, ${failed} failed`);
  return failed === 0 && passed > 0 ? 0 : 1;
}

process.exitCode = await main();
