import { expect } from 'chai';
import { once } from 'node:events';
import { mkdtempSync, readdirSync, rmSync, watch } from 'node:fs';
import { request as httpRequest, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import type { CurveImportReport } from '../../../shared/api/api-schemas';
import { createApp } from '../../../server/app';
import { claimCurveImport, CurveImportRunningError } from '../../../server/catalog/curve-import-claim';
import { importCurveTable } from '../../../server/catalog/curve-import-transaction';
import { Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createUserWithSession, testPassword } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { catalogRowCounts } from '../../data-import/catalog-fixtures';
import { largeCurveTable } from '../../data-import/large-curve-table';

/*
 * Curve-table uploads through the API: one import per supplier at a time, the upload's temporary
 * file gone whatever the outcome, the accepted text encodings, and the rule for file names.
 */

const table = largeCurveTable(2, 6, 'UPL');
const boundary = 'riffle-upload-test-boundary';

/** A multipart body by hand, so that a test can hold back its end. */
function multipart(fileName: string, file: Buffer, dryRun: boolean): { head: Buffer; tail: Buffer } {
  const head =
    `--${boundary}\r\nContent-Disposition: form-data; name="dryRun"\r\n\r\n${dryRun}\r\n` +
    `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\nContent-Type: text/csv\r\n\r\n`;
  return { head: Buffer.concat([Buffer.from(head), file]), tail: Buffer.from(`\r\n--${boundary}--\r\n`) };
}

function utf16le(text: string): Buffer {
  return Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
}

describe('curve-table uploads', function () {
  this.timeout(60_000);
  let sequelize: Sequelize;
  let drop: () => Promise<void>;
  let server: Server;
  let suppliers: Supplier[];
  let token: string;
  let email: string;
  const systemTmp = tmpdir();
  const uploads = mkdtempSync(join(systemTmp, 'riffle-upload-test-'));
  const previousTmp = process.env.TMPDIR;

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('curve_uploads'));
    suppliers = await Supplier.bulkCreate([
      { code: 'UPLOADONE', name: 'Upload One Supply (invented)' },
      { code: 'UPLOADTWO', name: 'Upload Two Supply (invented)' },
    ]);
    const admin = await createUserWithSession(sequelize, 'admin');
    token = admin.token;
    email = admin.user.email;
    server = createApp({ sequelize, logger: createLogger('silent') }).listen(0, '127.0.0.1');
    await once(server, 'listening');
    // Uploads go to a folder under os.tmpdir(): this suite's own, to see that each one is removed.
    process.env.TMPDIR = uploads;
  });

  after(async () => {
    process.env.TMPDIR = previousTmp;
    if (previousTmp === undefined) delete process.env.TMPDIR;
    rmSync(uploads, { recursive: true, force: true });
    server?.close();
    await drop?.();
  });

  const upload = (supplier: Supplier, file: Buffer | string, options: { dryRun?: boolean; fileName?: string } = {}) =>
    request(server)
      .post(`/api/v1/suppliers/${supplier.id}/curve-imports`)
      .set('Authorization', `Bearer ${token}`)
      .field('dryRun', options.dryRun === false ? 'false' : 'true')
      .attach('file', Buffer.isBuffer(file) ? file : Buffer.from(file), options.fileName ?? 'upload.csv');

  it('answers a second import of a supplier while one runs with 409 naming the running import; the first still completes', async () => {
    const before = await catalogRowCounts(sequelize);
    const { head, tail } = multipart('first.csv', Buffer.from(table), true);
    const half = Math.floor(head.length * 0.75);
    const watcher = watch(uploads);
    const folderMade = once(watcher, 'change');
    const first = httpRequest({
      host: '127.0.0.1',
      port: (server.address() as AddressInfo).port,
      method: 'POST',
      path: `/api/v1/suppliers/${suppliers[0].id}/curve-imports`,
      headers: { authorization: `Bearer ${token}`, 'content-type': `multipart/form-data; boundary=${boundary}` },
    });
    const firstAnswer = once(first, 'response');
    first.write(head.subarray(0, half));
    // The upload's folder is made once the supplier is held: from here the first import runs.
    await folderMade;
    watcher.close();

    for (const dryRun of [true, false]) {
      const second = await upload(suppliers[0], table, { dryRun }).expect(409);
      expect(second.type).to.equal('application/problem+json');
      expect(second.body).to.include({
        type: '/api/v1/problems/curve-import-running',
        title: 'Curve import running',
        status: 409,
      });
      expect(second.body.detail).to.contain('UPLOADONE').and.to.contain(email);
      expect(second.body.runningImport).to.include({ channel: 'api', by: email });
    }
    // Another supplier is not held by it.
    await upload(suppliers[1], table).expect(200);

    first.end(Buffer.concat([head.subarray(half), tail]));
    const [response] = (await firstAnswer) as [IncomingMessage];
    let text = '';
    for await (const chunk of response) text += (chunk as Buffer).toString();
    expect(response.statusCode).to.equal(200);
    const report = JSON.parse(text) as CurveImportReport;
    expect(report).to.include({ fileName: 'first.csv', dryRun: true, rowCount: 12, pumpCount: 2 });
    expect(report.pumps.map((pump) => pump.points!.length)).to.deep.equal([6, 6]);

    expect(readdirSync(uploads)).to.deep.equal([]);
    expect(await catalogRowCounts(sequelize)).to.deep.equal(before);
    // Released: the same supplier may import again.
    await upload(suppliers[0], table).expect(200);
  });

  it('holds a supplier across processes: an upload is refused while the command holds it, and the command while an upload does', async () => {
    // a claim on a connection of its own is what the import command in its own process takes
    const command = { userId: null, label: 'command line (tester)', channel: 'command' as const };
    const held = await claimCurveImport(sequelize, suppliers[0], command);
    try {
      const refused = await upload(suppliers[0], table).expect(409);
      expect(refused.body.runningImport).to.include({ channel: 'command', by: 'command line (tester)' });
      await upload(suppliers[1], table).expect(200);
    } finally {
      await held.release();
    }
    await upload(suppliers[0], table).expect(200);

    const api = { userId: null, label: email, channel: 'api' as const };
    const upload0 = await claimCurveImport(sequelize, suppliers[0], api);
    try {
      const attempt = importCurveTable({
        sequelize,
        supplier: suppliers[0],
        source: Readable.from([table]),
        fileName: 'from-the-command.csv',
        dryRun: false,
        actor: command,
      });
      const error = await attempt.then(
        () => null,
        (caught: unknown) => caught,
      );
      expect(error).to.be.instanceOf(CurveImportRunningError);
      expect((error as CurveImportRunningError).running).to.include({ channel: 'api', by: email });
    } finally {
      await upload0.release();
    }
  });

  it('removes the uploaded file whatever the answer: 201, 422, 413, 400', async () => {
    await upload(suppliers[1], table, { dryRun: false }).expect(201);
    expect(readdirSync(uploads)).to.deep.equal([]);
    await upload(suppliers[1], table.replace('UPL-1,,,', 'UPL-1,,,x'), { dryRun: false }).expect(422);
    expect(readdirSync(uploads)).to.deep.equal([]);
    await upload(suppliers[1], Buffer.alloc(16 * 1024 * 1024 + 10, '#')).expect(413);
    expect(readdirSync(uploads)).to.deep.equal([]);
    await request(server)
      .post(`/api/v1/suppliers/${suppliers[1].id}/curve-imports`)
      .set('Authorization', `Bearer ${token}`)
      .field('dryRun', 'maybe')
      .attach('file', Buffer.from(table), 'x.csv')
      .expect(400);
    expect(readdirSync(uploads)).to.deep.equal([]);
  });

  it('reads UTF-8 with and without a byte-order mark and UTF-16 LE and BE with one, all alike', async () => {
    const named = table.replace('Invented bulk pump 1', 'Étang pump ✓ 1');
    const files = {
      utf8: Buffer.from(named),
      utf8Bom: Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(named)]),
      utf16le: utf16le(named),
      utf16be: utf16le(named).swap16(),
    };
    for (const [encoding, bytes] of Object.entries(files)) {
      const report = (await upload(suppliers[0], bytes).expect(200)).body as CurveImportReport;
      expect(report.errors, encoding).to.deep.equal([]);
      expect(
        report.pumps.map((pump) => pump.displayName),
        encoding,
      ).to.deep.equal(['Invented bulk pump 0', 'Étang pump ✓ 1']);
      expect(report.pumps[1].points, encoding).to.have.length(6);
    }
  });

  it('refuses bytes that are not text in those encodings with 422 naming the row and the byte', async () => {
    const latin1 = Buffer.from(table.replace('Invented bulk pump 1', 'Étang 1'), 'latin1');
    const refused = await upload(suppliers[0], latin1).expect(422);
    const line = table.split('\n').findIndex((text) => text.startsWith('UPL-1,')) + 1;
    expect(refused.body.pointer).to.equal(`/body/file/rows/${line}`);
    expect(refused.body.detail).to.contain('byte 0xC9 is not UTF-8 text');
    expect(refused.body.detail).to.contain(`(byte ${latin1.indexOf(0xc9)})`);
    expect((refused.body.report as CurveImportReport).errors).to.have.length(1);

    const utf32 = Buffer.concat([Buffer.from([0xff, 0xfe, 0x00, 0x00]), Buffer.from('r\0\0\0')]);
    const bom = await upload(suppliers[0], utf32).expect(422);
    expect(bom.body.pointer).to.equal('/body/file/rows/1');
    expect(bom.body.detail).to.contain('UTF-32 byte-order mark');

    const cut = await upload(suppliers[0], Buffer.concat([utf16le(table), Buffer.from([0x41])])).expect(422);
    expect(cut.body.detail).to.contain('ends inside a UTF-16 character');
    expect(readdirSync(uploads)).to.deep.equal([]);
  });

  it('refuses a file name with bidirectional or control characters with 422 naming /body/file, nothing written', async () => {
    const before = await catalogRowCounts(sequelize);
    for (const fileName of ['pumps\u202Evsc.exe', 'pumps\u009b.csv', 'isolate\u2066x\u2069.csv']) {
      const response = await upload(suppliers[0], table, { dryRun: false, fileName });
      expect(response.status, JSON.stringify(response.body)).to.equal(422);
      expect(response.body.pointer, JSON.stringify(fileName)).to.equal('/body/file');
      expect(response.body.detail).to.match(/control characters/);
    }
    expect(await catalogRowCounts(sequelize)).to.deep.equal(before);
    const accented = (await upload(suppliers[0], table, { fileName: 'Übersicht-2026.csv' }).expect(200))
      .body as CurveImportReport;
    expect(accented.fileName).to.equal('Übersicht-2026.csv');
    expect(readdirSync(uploads)).to.deep.equal([]);
  });

  it("keeps a supplier's name under the shared text rule when it is created or renamed", async () => {
    for (const name of ['Evil \u202Eylppus', 'Bell\u0007 Supply', '   ']) {
      const refused = await Supplier.create({ code: 'NAMETEST', name }).then(
        () => 'saved',
        (error: Error) => error.message,
      );
      expect(refused, JSON.stringify(name)).to.match(/a supplier's name must/);
      const renamed = await suppliers[1].update({ name }).then(
        () => 'saved',
        (error: Error) => error.message,
      );
      expect(renamed, JSON.stringify(name)).to.match(/a supplier's name must/);
      await suppliers[1].reload();
    }
    expect(await Supplier.count({ where: { code: 'NAMETEST' } })).to.equal(0);
    expect(suppliers[1].name).to.equal('Upload Two Supply (invented)');
  });

  it('reads JSON bodies in UTF-8 (with a byte-order mark too) and UTF-16, and answers 415 for other charsets', async () => {
    const json = JSON.stringify({ name: 'Café sheet ✓', scopes: ['catalog:read'], password: testPassword });
    /** Raw bytes as the body: supertest would serialise a Buffer as JSON. */
    const post = async (contentType: string, body: Buffer) => {
      const sent = httpRequest({
        host: '127.0.0.1',
        port: (server.address() as AddressInfo).port,
        method: 'POST',
        path: '/api/v1/account/api-tokens',
        headers: { authorization: `Bearer ${token}`, 'content-type': contentType, 'content-length': body.length },
      });
      const answered = once(sent, 'response');
      sent.end(body);
      const [response] = (await answered) as [IncomingMessage];
      let text = '';
      for await (const chunk of response) text += (chunk as Buffer).toString();
      return { status: response.statusCode, type: response.headers['content-type'], body: JSON.parse(text) };
    };
    const accepted: Array<[string, Buffer]> = [
      ['application/json', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(json)])],
      ['application/json; charset=utf-16', utf16le(json)],
      ['application/json; charset=UTF-16', utf16le(json).swap16()],
    ];
    for (const [contentType, body] of accepted) {
      const created = await post(contentType, body);
      expect(created.status, contentType).to.equal(201);
      expect(created.body.apiToken.name, contentType).to.equal('Café sheet ✓');
    }
    for (const charset of ['utf-32', 'iso-8859-1', 'utf-7']) {
      const refused = await post(`application/json; charset=${charset}`, Buffer.from(json));
      expect(refused.status).to.equal(415);
      expect(refused.type).to.contain('application/problem+json');
      expect(refused.body).to.include({ status: 415, title: 'Unsupported charset', pointer: '/headers/content-type' });
      expect(refused.body.detail).to.contain(charset);
    }
  });
});
