import { expect } from 'chai';
import { mkdtempSync, rmSync } from 'node:fs';
import { connect, createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { MariaDbStartError, PrivateMariaDb } from '../../server/database/private-mariadb';
import { freeLoopbackPort } from '../support/free-port';

/**
 * Resolves once nothing listens on `port` any more (a SIGKILLed server's threads let go of it a
 * moment after the process is signalled): waits on the socket, not on a clock.
 */
async function portReleased(port: number): Promise<void> {
  for (;;) {
    const refused = await new Promise<boolean>((resolve) => {
      const socket = connect(port, '127.0.0.1');
      socket.once('connect', () => {
        socket.destroy();
        resolve(false);
      });
      socket.once('error', () => resolve(true));
    });
    if (refused) return;
    await new Promise((resolve) => setImmediate(resolve));
  }
}

describe('private MariaDB instance', function () {
  this.timeout(120_000);
  const folder = mkdtempSync(join(tmpdir(), 'riffle-private-db-'));
  after(() => rmSync(folder, { recursive: true, force: true }));

  it('starts, is reused while running, recovers after kill -9 and stops cleanly', async () => {
    const port = await freeLoopbackPort();
    const first = await PrivateMariaDb.startOrReuse({ folder, port });
    expect(first.startedNow).to.equal(true);

    const again = await PrivateMariaDb.startOrReuse({ folder, port });
    expect(again.startedNow).to.equal(false);
    expect(again.pid).to.equal(first.pid);

    process.kill(first.pid, 'SIGKILL');
    await portReleased(port);
    const recovered = await PrivateMariaDb.startOrReuse({ folder, port });
    expect(recovered.startedNow).to.equal(true);
    expect(recovered.pid).to.not.equal(first.pid);

    await recovered.stop();
    expect(() => process.kill(recovered.pid, 0)).to.throw();
  });

  it('refuses a port that belongs to another program, naming the variable to change', async () => {
    const squatter = createServer();
    await new Promise<void>((resolve) => squatter.listen(0, '127.0.0.1', resolve));
    const { port } = squatter.address() as { port: number };
    try {
      const attempt = PrivateMariaDb.startOrReuse({ folder: join(folder, 'other'), port });
      await attempt.then(
        () => expect.fail('a taken port was accepted'),
        (error: Error) => {
          expect(error).to.be.instanceOf(MariaDbStartError);
          expect(error.message).to.contain(`port ${port}`).and.contain('RIFFLE_DB_PORT');
        },
      );
    } finally {
      squatter.close();
    }
  });
});
