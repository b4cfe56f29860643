/*
 * API benchmark: POST /api/v1/selections over a synthetic catalog of 10,000 invented pumps, on
 * loopback, 20 connections for 10 s, with GET /api/v1/health measured in the same run as the
 * baseline. Prints requests/s, p50/p95/p99 latency and the ratio; asserts nothing. A second
 * baseline, GET /api/v1/fittings with the same bearer token (the guard, with its remembered token, and a
 * small answer), shows how much of a search's time is the search itself. The same searches beside
 * a kept pump (`keep`: each pump solved as the one added in parallel) are measured after.
 * Every run starts a scratch MariaDB of its own in a temporary folder and removes it afterwards.
 * The server runs in a child process (this file with --serve), so the load generator does not
 * share its event loop.
 *
 * Run: npm run bench:api
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from '../../server/app';
import { createSequelize } from '../../server/database/connection';
import { createMigrator } from '../../server/database/migrator';
import { initialiseModels } from '../../server/database/models';
import { PrivateMariaDb } from '../../server/database/private-mariadb';
import { createLogger } from '../../server/logging';
import { createUserWithSession } from '../support/accounts';
import { freeLoopbackPort } from '../support/free-port';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/** The part of autocannon's API used here (the package ships no types). */
interface AutocannonOptions {
  url: string;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  body?: string;
  duration?: number;
  connections?: number;
  requests?: Array<{ setupRequest: (request: Record<string, unknown>) => Record<string, unknown> }>;
}
interface AutocannonInstance extends PromiseLike<{ requests: { total: number }; non2xx: number }> {
  on(event: 'response', listener: (client: unknown, status: number, bytes: number, responseTime: number) => void): void;
}
const autocannon = createRequire(import.meta.url)('autocannon') as (options: AutocannonOptions) => AutocannonInstance;

const PUMP_COUNT = 10_000;
const CONNECTIONS = 20;
const DURATION_S = 10;

interface Measured {
  requestsPerSecond: number;
  p50: number;
  p95: number;
  p99: number;
  non2xx: number;
  /** Mean bytes per response, headers included: a bigger answer costs serialising and writing. */
  bytes: number;
}

function percentile(sorted: number[], share: number): number {
  return sorted.length === 0 ? Number.NaN : sorted[Math.min(sorted.length - 1, Math.ceil(share * sorted.length) - 1)];
}

/** One autocannon run; latencies are collected per response so p95 is exact (autocannon reports p97.5). */
async function measure(options: AutocannonOptions): Promise<Measured> {
  const latencies: number[] = [];
  let bytes = 0;
  const instance = autocannon({ connections: CONNECTIONS, duration: DURATION_S, ...options });
  instance.on('response', (_client: unknown, _status: number, responseBytes: number, responseTime: number) => {
    latencies.push(responseTime);
    bytes += responseBytes;
  });
  const result = await instance;
  latencies.sort((a, b) => a - b);
  return {
    requestsPerSecond: result.requests.total / DURATION_S,
    p50: percentile(latencies, 0.5),
    p95: percentile(latencies, 0.95),
    p99: percentile(latencies, 0.99),
    non2xx: result.non2xx,
    bytes: latencies.length > 0 ? bytes / latencies.length : 0,
  };
}

function report(name: string, figures: Measured): void {
  console.log(
    `${name.padEnd(28)} ${figures.requestsPerSecond.toFixed(0).padStart(7)} req/s   p50 ${figures.p50.toFixed(1).padStart(6)} ms   p95 ${figures.p95.toFixed(1).padStart(6)} ms   p99 ${figures.p99.toFixed(1).padStart(6)} ms   non-2xx ${figures.non2xx}   ${(figures.bytes / 1024).toFixed(1).padStart(6)} KiB/answer`,
  );
}

/** Static heads cycled through, so the requests are not all the same search. */
const staticHeads = [12, 13.5, 14.5, 15.5, 17];

/** The search body; with `keptPumpId`, one pump added beside that kept one (arrangements [1]). */
function selectionBody(staticHead: number, keptPumpId: number | null = null): string {
  return JSON.stringify({
    units: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' },
    system: {
      staticHead,
      frictionMethod: 'hazen-williams',
      segments: [
        {
          length: 240,
          pipe: 'pvc-sch40-3',
          fittings: [
            { kind: 'elbow-90-standard', count: 4 },
            { kind: 'exit', count: 1 },
          ],
        },
      ],
    },
    duty: { flowMin: 90, flowMax: 130 },
    ...(keptPumpId === null ? { arrangements: [1, 2, 3] } : { keep: { pump: { pumpId: keptPumpId } } }),
    requireOneFailed: true,
    energy: { hoursPerDay: 24, tariffPerKWh: 0.18 },
    limit: 20,
  });
}

const databaseName = 'riffle_bench';

function benchSequelize(port: number) {
  return createSequelize({ host: '127.0.0.1', port, name: databaseName, user: 'root', password: '' });
}

/** The child: the real app on a free loopback port, which it prints as its first line. */
async function serve(databasePort: number): Promise<void> {
  const sequelize = benchSequelize(databasePort);
  initialiseModels(sequelize);
  const server = createServer(createApp({ sequelize, logger: createLogger('silent') }));
  server.listen(0, '127.0.0.1', () => console.log(String((server.address() as AddressInfo).port)));
  process.once('SIGTERM', () => server.close(() => void sequelize.close().then(() => process.exit(0))));
}

function startServerProcess(databasePort: number): Promise<{ child: ChildProcess; url: string }> {
  // RIFFLE_BENCH_PROFILE=<folder> writes a CPU profile of the server there.
  const profile = process.env.RIFFLE_BENCH_PROFILE
    ? ['--cpu-prof', `--cpu-prof-dir=${process.env.RIFFLE_BENCH_PROFILE}`]
    : [];
  const child = spawn(
    process.execPath,
    [...profile, '--import', 'tsx', fileURLToPath(import.meta.url), '--serve', String(databasePort)],
    { stdio: ['ignore', 'pipe', 'inherit'] },
  );
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the benchmark server stopped with code ${code}`)));
    child.stdout!.once('data', (chunk: Buffer) =>
      resolve({ child, url: `http://127.0.0.1:${chunk.toString().trim()}` }),
    );
  });
}

async function main(): Promise<void> {
  const folder = mkdtempSync(join(tmpdir(), 'riffle-bench-'));
  const databasePort = await freeLoopbackPort();
  const database = await PrivateMariaDb.startOrReuse({ folder: join(folder, 'mariadb'), port: databasePort });
  let server: ChildProcess | undefined;
  const sequelize = benchSequelize(databasePort);
  try {
    await database.ensureDatabase(databaseName);
    initialiseModels(sequelize);
    await createMigrator(sequelize).up();
    const seedStarted = performance.now();
    await seedSyntheticCatalog(sequelize, syntheticShapes(PUMP_COUNT), 'Benchmark Pumps (invented)');
    console.log(`seeded ${PUMP_COUNT} synthetic pumps in ${((performance.now() - seedStarted) / 1000).toFixed(1)} s`);
    // the installed pump a designer keeps: alone some 65 gpm on these systems, below the band
    const [keptPumpId] = await seedSyntheticCatalog(
      sequelize,
      [{ shutOffHead: 12, lastFlow: 0.005, peakEfficiency: 0.6 }],
      'Installed Benchmark Pumps (invented)',
    );
    const { token } = await createUserWithSession(sequelize, 'designer');

    const started = await startServerProcess(databasePort);
    server = started.child;
    const { url } = started;
    const headers = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };

    // One search loads the catalog snapshot; warm both paths up before measuring.
    await measure({ url: `${url}/api/v1/selections`, method: 'POST', headers, body: selectionBody(14.5), duration: 2 });
    await measure({ url: `${url}/api/v1/health`, duration: 2 });
    await measure({ url: `${url}/api/v1/fittings`, headers, duration: 2 });

    const health = await measure({ url: `${url}/api/v1/health` });
    const guarded = await measure({ url: `${url}/api/v1/fittings`, headers });
    let next = 0;
    const selections = await measure({
      url: `${url}/api/v1/selections`,
      method: 'POST',
      headers,
      requests: [
        { setupRequest: (request) => ({ ...request, body: selectionBody(staticHeads[next++ % staticHeads.length]) }) },
      ],
    });

    await measure({
      url: `${url}/api/v1/selections`,
      method: 'POST',
      headers,
      body: selectionBody(14.5, keptPumpId),
      duration: 2,
    });
    const beside = await measure({
      url: `${url}/api/v1/selections`,
      method: 'POST',
      headers,
      requests: [
        {
          setupRequest: (request) => ({
            ...request,
            body: selectionBody(staticHeads[next++ % staticHeads.length], keptPumpId),
          }),
        },
      ],
    });

    console.log(
      `\n${CONNECTIONS} connections, ${DURATION_S} s each, loopback, ${PUMP_COUNT} pumps x 3 arrangements per search`,
    );
    report('GET /api/v1/health', health);
    report('GET /api/v1/fittings (token)', guarded);
    report('POST /api/v1/selections', selections);
    report('  ... beside a kept pump', beside);
    console.log(
      `selections / health requests per second: ${(selections.requestsPerSecond / health.requestsPerSecond).toFixed(3)}`,
    );
    console.log(
      `selections / fittings (same guard) requests per second: ${(selections.requestsPerSecond / guarded.requestsPerSecond).toFixed(3)}`,
    );
    console.log(
      `beside a kept pump / plain search requests per second: ${(beside.requestsPerSecond / selections.requestsPerSecond).toFixed(3)}`,
    );
    console.log(`target p95 < 150 ms: ${selections.p95 < 150 ? 'met' : 'not met'} (${selections.p95.toFixed(1)} ms)`);
  } finally {
    if (server && server.exitCode === null) {
      const stopped = new Promise((resolve) => server!.once('exit', resolve));
      server.kill('SIGTERM');
      await stopped;
    }
    await sequelize.close();
    await database.stop();
    rmSync(folder, { recursive: true, force: true });
  }
}

if (process.argv[2] === '--serve') await serve(Number(process.argv[3]));
else await main();
