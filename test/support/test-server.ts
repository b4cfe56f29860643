import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Sequelize } from 'sequelize';
import { createApp, defaultClientFolder } from '../../server/app';
import { createLogger } from '../../server/logging';

/** The real app, with the built client, listening on a free loopback port. */
export async function startTestServer(
  sequelize: Sequelize,
): Promise<{ url: string; server: Server; close: () => Promise<void> }> {
  const server = createServer(
    createApp({ sequelize, logger: createLogger('silent'), clientFolder: defaultClientFolder }),
  );
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    server,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
