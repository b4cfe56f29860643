import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { createConnection as createTcpConnection } from 'node:net';
import { join } from 'node:path';
import mariadb from 'mariadb';

/** A private MariaDB server that Riffle runs itself on loopback, with its own data directory. */
export interface PrivateMariaDbOptions {
  /** Folder holding data/, the socket, the pid file and the error log. Absolute. */
  folder: string;
  port: number;
}

export class MariaDbStartError extends Error {
  override readonly name = 'MariaDbStartError';
}

const host = '127.0.0.1';
const readyTimeoutMs = 60_000;
const stopTimeoutMs = 60_000;

function sleep(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

/** A process counts as running when /proc has it and it is not a zombie (a SIGKILLed server can linger as one). */
function isRunning(pid: number): boolean {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const state = stat.slice(stat.lastIndexOf(')') + 2, stat.lastIndexOf(')') + 3);
    return state !== 'Z' && state !== 'X';
  } catch {
    return false;
  }
}

function commandLineOf(pid: number): string {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').replaceAll('\0', ' ');
  } catch {
    return '';
  }
}

function isPortTaken(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = createTcpConnection({ host, port });
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

/** True when a real `SELECT 1` over TCP answers: `mariadb-admin ping` succeeds even when access is denied. */
async function answersQueries(port: number): Promise<boolean> {
  let connection: mariadb.Connection | undefined;
  try {
    connection = await mariadb.createConnection({ host, port, user: 'root', password: '', connectTimeout: 1000 });
    await connection.query('SELECT 1');
    return true;
  } catch {
    return false;
  } finally {
    await connection?.end().catch(() => undefined);
  }
}

export class PrivateMariaDb {
  private constructor(
    readonly port: number,
    readonly pid: number,
    /** False when an instance left running by an earlier start (say, after a crash) was taken over. */
    readonly startedNow: boolean,
    private readonly child: ChildProcess | undefined,
    private readonly logFile: string,
  ) {}

  /**
   * Starts the server, or reuses the one this folder's pid file names when it is still running.
   * Refuses when the port belongs to another program, and shows the tail of the log when the
   * server does not come up.
   */
  static async startOrReuse(options: PrivateMariaDbOptions): Promise<PrivateMariaDb> {
    const dataDir = join(options.folder, 'data');
    const pidFile = join(options.folder, 'mariadb.pid');
    const logFile = join(options.folder, 'mariadb.err');
    const socket = join(options.folder, 'mariadb.sock');
    mkdirSync(options.folder, { recursive: true });

    const running = PrivateMariaDb.runningInstance(pidFile, dataDir);
    if (running !== undefined) {
      if (await answersQueries(options.port)) {
        return new PrivateMariaDb(options.port, running, false, undefined, logFile);
      }
      throw new MariaDbStartError(
        `Riffle's MariaDB for ${dataDir} is already running as process ${running} but does not answer on port ${options.port}: ` +
          `stop it with "kill ${running}" or set RIFFLE_DB_PORT to the port it uses`,
      );
    }
    rmSync(pidFile, { force: true });
    rmSync(socket, { force: true });

    if (await isPortTaken(options.port)) {
      throw new MariaDbStartError(
        `port ${options.port} on ${host} is in use by another program: set RIFFLE_DB_PORT to a free port`,
      );
    }

    if (!existsSync(join(dataDir, 'mysql'))) PrivateMariaDb.initialise(dataDir, logFile);

    const child = spawn(
      'mariadbd',
      [
        '--no-defaults',
        `--datadir=${dataDir}`,
        '--user=root',
        `--bind-address=${host}`,
        `--port=${options.port}`,
        `--socket=${socket}`,
        `--pid-file=${pidFile}`,
        `--log-error=${logFile}`,
        '--skip-name-resolve',
        '--character-set-server=utf8mb4',
        '--collation-server=utf8mb4_unicode_ci',
        '--innodb-buffer-pool-size=128M',
      ],
      { detached: true, stdio: 'ignore' },
    );
    const spawnFailure = new Promise<Error>((resolve) => child.once('error', resolve));
    let exited = false;
    child.once('exit', () => {
      exited = true;
    });

    const deadline = Date.now() + readyTimeoutMs;
    while (Date.now() < deadline) {
      const failure = await Promise.race([spawnFailure, sleep(250).then(() => undefined)]);
      if (failure) throw new MariaDbStartError(`mariadbd could not be started: ${failure.message}`);
      if (exited) break;
      if (await answersQueries(options.port)) {
        return new PrivateMariaDb(options.port, child.pid!, true, child, logFile);
      }
    }
    if (!exited) child.kill('SIGKILL');
    throw new MariaDbStartError(
      `MariaDB did not start on port ${options.port}. The end of its log:\n${logTail(logFile)}`,
    );
  }

  private static runningInstance(pidFile: string, dataDir: string): number | undefined {
    if (!existsSync(pidFile)) return undefined;
    const pid = Number(readFileSync(pidFile, 'utf8').trim());
    if (!Number.isInteger(pid) || pid <= 0 || !isRunning(pid)) return undefined;
    return commandLineOf(pid).includes(`--datadir=${dataDir}`) ? pid : undefined;
  }

  private static initialise(dataDir: string, logFile: string): void {
    mkdirSync(dataDir, { recursive: true });
    const result = spawnSync(
      'mariadb-install-db',
      [
        '--no-defaults',
        `--datadir=${dataDir}`,
        '--user=root',
        '--auth-root-authentication-method=normal',
        '--skip-test-db',
      ],
      { encoding: 'utf8' },
    );
    if (result.error || result.status !== 0) {
      rmSync(dataDir, { recursive: true, force: true });
      const output = `${result.stdout ?? ''}${result.stderr ?? ''}`.trim().split('\n').slice(-15).join('\n');
      throw new MariaDbStartError(
        `mariadb-install-db could not initialise ${dataDir}: ${result.error?.message ?? output}\n${logTail(logFile)}`,
      );
    }
  }

  /** Creates the database when it does not exist yet. */
  async ensureDatabase(name: string): Promise<void> {
    if (!/^[A-Za-z0-9_]+$/.test(name))
      throw new MariaDbStartError(`database name "${name}" may hold only letters, digits and _`);
    const connection = await mariadb.createConnection({ host, port: this.port, user: 'root', password: '' });
    try {
      await connection.query(
        `CREATE DATABASE IF NOT EXISTS \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      );
    } finally {
      await connection.end();
    }
  }

  /** Shuts the server down cleanly (SIGTERM) and waits until it has gone. */
  async stop(): Promise<void> {
    if (!isRunning(this.pid)) return;
    const exited = this.child
      ? new Promise<void>((resolve) => {
          if (this.child!.exitCode !== null || this.child!.signalCode !== null) resolve();
          else this.child!.once('exit', () => resolve());
        })
      : undefined;
    process.kill(this.pid, 'SIGTERM');
    const deadline = Date.now() + stopTimeoutMs;
    while (Date.now() < deadline) {
      if (exited ? await Promise.race([exited.then(() => true), sleep(100).then(() => false)]) : !isRunning(this.pid))
        return;
      if (!exited) await sleep(100);
    }
    process.kill(this.pid, 'SIGKILL');
    throw new MariaDbStartError(
      `MariaDB (process ${this.pid}) did not stop within a minute and was killed. The end of its log:\n${logTail(this.logFile)}`,
    );
  }
}

function logTail(logFile: string, lines = 15): string {
  if (!existsSync(logFile)) return '(no log was written)';
  return readFileSync(logFile, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
}
