// `npm start`: the private MariaDB, the migrations, the demo data, the client build and the server,
// and a clean stop of all of it on Ctrl-C.
import { createServer, type Server } from 'node:http';
import { join } from 'node:path';
import type { Sequelize } from 'sequelize';
import { createApp, defaultClientFolder } from '../app';
import { ConfigError, loadConfig } from '../config';
import { createSequelize } from '../database/connection';
import { seedMissingDemoData } from '../demo/demo-seed';
import { createMigrator } from '../database/migrator';
import { initialiseModels } from '../database/models';
import { MariaDbStartError, PrivateMariaDb } from '../database/private-mariadb';
import { cappedLogFile, createLogger, logFileMaxBytes } from '../logging';
import { demoAccounts, demoPassword } from '../accounts/demo-accounts';
import { startFakeSmtpServer } from '../mail/fake-smtp-server';
import { createSmtpMailer } from '../mail/mailer';
import { ensureClientBuilt } from './client-build';

function say(line: string): void {
  console.log(`riffle: ${line}`);
}

function listen(server: Server, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
}

/** Fails early, before touching the database, when the web port is taken (say, by a second `npm start`). */
async function ensurePortFree(port: number, host: string): Promise<void> {
  const probe = createServer();
  try {
    await listen(probe, port, host);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EADDRINUSE') {
      throw new ConfigError(`port ${port} on ${host} is in use: stop the program using it or set PORT to a free port`);
    }
    throw error;
  }
  await new Promise((resolve) => probe.close(resolve));
}

async function main(): Promise<void> {
  let config: ReturnType<typeof loadConfig>;
  try {
    config = loadConfig();
    await ensurePortFree(config.httpPort, config.httpHost);
  } catch (error) {
    say((error as Error).message);
    process.exit(1);
  }
  const logPath = join(config.varDir, 'log', 'riffle.log');
  const logger = createLogger(config.logLevel, undefined, cappedLogFile(logPath));
  say(`log: ${logPath} (JSON lines; at ${logFileMaxBytes / 1024 / 1024} MiB it moves to riffle.log.1, 2 files kept)`);
  const stops: Array<{ what: string; stop: () => Promise<void> }> = [];
  let stopping = false;

  const stopAll = async (exitCode: number): Promise<never> => {
    if (!stopping) {
      stopping = true;
      for (const { what, stop } of stops.reverse()) {
        try {
          await stop();
          say(`stopped ${what}`);
        } catch (error) {
          say(`could not stop ${what}: ${(error as Error).message}`);
          exitCode = exitCode || 1;
        }
      }
    }
    process.exit(exitCode);
  };
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.on(signal, () => {
      say(`${signal} received; stopping`);
      void stopAll(0);
    });
  }

  try {
    const database = await PrivateMariaDb.startOrReuse({
      folder: join(config.varDir, 'mariadb'),
      port: config.database.port,
    });
    stops.push({ what: 'MariaDB', stop: () => database.stop() });
    say(
      database.startedNow
        ? `MariaDB started on 127.0.0.1:${database.port}`
        : `MariaDB already running on 127.0.0.1:${database.port}; using it`,
    );
    await database.ensureDatabase(config.database.name);

    const sequelize: Sequelize = createSequelize(config.database);
    stops.push({ what: 'database connections', stop: () => sequelize.close() });
    initialiseModels(sequelize);
    const applied = await createMigrator(sequelize).up();
    if (applied.length > 0) say(`applied ${applied.length} migration(s)`);
    if (config.demo && (await seedMissingDemoData(sequelize)))
      say('loaded the demo data (invented suppliers and pumps)');

    // Mail: the loopback fake SMTP server unless a relay is configured.
    let mailPort = config.mail.port;
    if (config.mail.fake) {
      const smtp = await startFakeSmtpServer({ port: config.mail.port, mailboxFolder: config.mail.mailboxFolder });
      stops.push({ what: 'demo mail server', stop: () => smtp.stop() });
      mailPort = smtp.port;
      say(
        `demo mail server on 127.0.0.1:${smtp.port} (no mail leaves this machine${config.demo ? '; admins read it on the Demo mailbox page' : ''})`,
      );
    }
    if (config.demo) {
      say(`demo accounts, all with the password ${demoPassword}:`);
      for (const account of demoAccounts)
        say(
          `  ${account.email.padEnd(24)} ${account.role}${account.supplierCode ? ` of ${account.supplierCode}` : ''}`,
        );
    }

    await ensureClientBuilt(say);

    const server = createServer(
      createApp({
        sequelize,
        logger,
        clientFolder: defaultClientFolder,
        accounts: { mailer: createSmtpMailer(config.mail, mailPort) },
      }),
    );
    await listen(server, config.httpPort, config.httpHost);
    stops.push({ what: 'web server', stop: () => new Promise((resolve) => server.close(() => resolve())) });
    say(`Riffle is running at http://${config.httpHost}:${config.httpPort}/ (Ctrl-C stops it)`);
  } catch (error) {
    if (error instanceof ConfigError || error instanceof MariaDbStartError) say(error.message);
    else say(`could not start: ${(error as Error).stack ?? error}`);
    await stopAll(1);
  }
}

void main();
