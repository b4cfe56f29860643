import { expect } from 'chai';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { QueryTypes, type Sequelize } from 'sequelize';
import type {
  CurveImportList,
  CurveImportReport,
  PumpDetail,
  PumpPage,
  SupplierList,
} from '../../../shared/api/api-schemas';
import { flowToSI, headToSI, pumpHeadAt } from '../../../shared/hydraulics';
import { createApp } from '../../../server/app';
import { Pump, type Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createApiToken, createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { catalogRowCounts, seedDemoCatalog } from '../../data-import/catalog-fixtures';

const malformedFolder = fileURLToPath(new URL('../../data-import/malformed/', import.meta.url));

const uploadTable = [
  'riffle-curve-table,1',
  'flow-unit,gpm',
  'head-unit,ft',
  'power-unit,W',
  'power-basis,electrical',
  'model_code,display_name,kind,preferred_flow_min,preferred_flow_max,flow,head,power',
  'UP-1,Upload test pump 1,external-centrifugal,20,35,0,40,300',
  'UP-1,,,,,10,39.2,380',
  'UP-1,,,,,20,36,460',
  'UP-1,,,,,30,30.5,520',
  'UP-1,,,,,40,22,560',
  'UP-1,,,,,50,11,580',
].join('\n');

describe('catalog and curve-import API', function () {
  this.timeout(60_000);
  let sequelize: Sequelize;
  let drop: () => Promise<void>;
  let app: ReturnType<typeof createApp>;
  let suppliers: Supplier[];
  const tokens: Record<string, string> = {};

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('catalog_api'));
    suppliers = await seedDemoCatalog(sequelize);
    app = createApp({ sequelize, logger: createLogger('silent') });
    tokens.designer = (await createUserWithSession(sequelize, 'designer')).token;
    tokens.admin = (await createUserWithSession(sequelize, 'admin')).token;
    tokens.ownSupplier = (
      await createUserWithSession(sequelize, 'supplier-admin', { supplierId: suppliers[0].id })
    ).token;
  });

  after(async () => {
    await drop?.();
  });

  const get = (path: string, token = tokens.designer) =>
    request(app).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`);
  const upload = (
    supplierId: number,
    text: string | Buffer,
    options: { dryRun?: boolean; token?: string; fileName?: string } = {},
  ) =>
    request(app)
      .post(`/api/v1/suppliers/${supplierId}/curve-imports`)
      .set('Authorization', `Bearer ${options.token ?? tokens.ownSupplier}`)
      .field('dryRun', options.dryRun ? 'true' : 'false')
      .attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text), options.fileName ?? 'upload.csv');

  it('lists the demo suppliers with their active pumps', async () => {
    const response = await get('/suppliers').expect(200);
    const body = response.body as SupplierList;
    expect(body.suppliers.map((supplier) => supplier.code)).to.deep.equal(['ALDERBROOK', 'QUILLWATER', 'STONETARN']);
    const [row] = await sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM pumps WHERE status = 'active' AND supplier_id = ?",
      {
        replacements: [suppliers[0].id],
        type: QueryTypes.SELECT,
      },
    );
    expect(body.suppliers[0].pumpCount).to.equal(Number(row.n)).and.to.be.greaterThan(10);
  });

  it('pages, sorts and filters pumps; flow and head filters keep curves that reach into the range', async () => {
    const all = (await get('/pumps?pageSize=100').expect(200)).body as PumpPage;
    expect(all.total).to.be.at.least(60);
    expect(all.units).to.deep.equal({ flow: 'm3/s', head: 'm', power: 'W', efficiency: 'fraction', size: 'mm' });
    const codes = all.items.map((pump) => pump.modelCode);
    expect(codes).to.deep.equal([...codes].sort((a, b) => a.localeCompare(b, 'en', { sensitivity: 'base' }) || 0));

    const page2 = (await get('/pumps?pageSize=10&page=2').expect(200)).body as PumpPage;
    expect(page2.items.map((pump) => pump.id)).to.deep.equal(all.items.slice(10, 20).map((pump) => pump.id));

    const mixed = (await get('/pumps?kind=mixed-flow&sort=flowMax&order=desc&pageSize=100').expect(200))
      .body as PumpPage;
    expect(mixed.items.every((pump) => pump.kind === 'mixed-flow')).to.equal(true);
    const flows = mixed.items.map((pump) => pump.flowMax!);
    expect(flows).to.deep.equal([...flows].sort((a, b) => b - a));

    const band = (
      await get('/pumps?flowMin=100&flowMax=150&flowUnit=gpm&headMin=30&headUnit=ft&pageSize=100').expect(200)
    ).body as PumpPage;
    expect(band.total).to.be.greaterThan(0);
    const [low, high, head] = [flowToSI(100, 'gpm'), flowToSI(150, 'gpm'), headToSI(30, 'ft')];
    for (const pump of band.items) {
      expect(pump.flowMax!).to.be.at.least(low);
      expect(pump.flowMin!).to.be.at.most(high);
      expect(pump.headMax!).to.be.at.least(head);
    }
    const outside = all.items.filter((pump) => pump.flowMax! >= low && pump.flowMin! <= high && pump.headMax! >= head);
    expect(band.total).to.equal(outside.length);
  });

  it('answers 400 naming the query field for a reversed range or an unknown kind', async () => {
    const reversed = await get('/pumps?flowMin=10&flowMax=5').expect(400);
    expect(reversed.body.pointer).to.equal('/query/flowMax');
    const kind = await get('/pumps?kind=turbine').expect(400);
    expect(kind.body.pointer).to.equal('/query/kind');
  });

  it('gives one pump with its current points and stored fit, and 404 for an absent one', async () => {
    const list = (await get('/pumps?search=AB-CEN-10').expect(200)).body as PumpPage;
    const detail = (await get(`/pumps/${list.items[0].id}`).expect(200)).body as PumpDetail;
    expect(detail.revision!.number).to.equal(1);
    // the demo file's electrical columns (AB-CEN-10: 230 V, single phase, 1.5 A)
    expect([detail.pump.voltage, detail.pump.phaseCount, detail.pump.fullLoadCurrent]).to.deep.equal([230, 1, 1.5]);
    expect(list.items[0].fullLoadCurrent).to.equal(1.5);
    // a fixed-speed demo pump carries no speeds beside its nominal one; AB-CEN-20 has an invented drive
    expect([detail.pump.nominalSpeedRpm, detail.pump.speedRange, detail.pump.fixedSpeedsRpm]).to.deep.equal([
      2900,
      null,
      null,
    ]);
    const driven = (await get('/pumps?search=AB-CEN-20').expect(200)).body as PumpPage;
    expect(driven.items[0].speedRange).to.deep.equal({ minRpm: 1450, maxRpm: 3190 });
    const twoSpeed = (await get('/pumps?search=QW-CEN-50').expect(200)).body as PumpPage;
    expect(twoSpeed.items[0].fixedSpeedsRpm).to.deep.equal([1450, 2900]);
    expect(detail.revision!.points.length).to.equal(detail.revision!.pointCount);
    const last = detail.revision!.points.at(-1)!;
    expect(pumpHeadAt(detail.revision!.fit as Parameters<typeof pumpHeadAt>[0], last.flow)).to.be.closeTo(
      last.head,
      0.05 * last.head,
    );
    expect(detail.revisions.map((revision) => revision.current)).to.deep.equal([true]);
    const missing = await get('/pumps/999999').expect(404);
    expect(missing.body.pointer).to.equal('/path/pumpId');
  });

  it('a supplier-admin previews a file (nothing written), commits it (201), and it is in the catalog and the history', async () => {
    const before = await tableChecksums(sequelize, ['sessions', 'audit_events']);
    const preview = await upload(suppliers[0].id, uploadTable, { dryRun: true }).expect(200);
    const report = preview.body as CurveImportReport;
    expect(report).to.include({ dryRun: true, committed: false, pumpCount: 1 });
    expect(report.pumps[0].outcome).to.equal('new');
    expect(report.pumps[0].fit!.powerBasis).to.equal('electrical');
    expect(await tableChecksums(sequelize, ['sessions', 'audit_events'])).to.deep.equal(before);

    const committed = (await upload(suppliers[0].id, uploadTable, { fileName: 'upload-1.csv' }).expect(201))
      .body as CurveImportReport;
    expect(committed.committed).to.equal(true);
    const found = (await get('/pumps?search=UP-1').expect(200)).body as PumpPage;
    expect(found.items.map((pump) => pump.modelCode)).to.deep.equal(['UP-1']);
    expect(found.items[0].bep).to.not.equal(null);

    const again = await upload(suppliers[0].id, uploadTable, { fileName: 'upload-1.csv' }).expect(200);
    expect((again.body as CurveImportReport).counts).to.deep.equal({ new: 0, changed: 0, unchanged: 1 });

    const history = (await get(`/suppliers/${suppliers[0].id}/curve-imports`, tokens.ownSupplier).expect(200))
      .body as CurveImportList;
    expect(history.imports[0]).to.include({ id: committed.importId, fileName: 'upload-1.csv', channel: 'api' });
    expect(history.imports[0].importedBy).to.match(/@accounts\.test$/);
    expect(history.imports[0].report.pumps[0]).to.not.have.property('points');
  });

  it('a changed upload makes revision 2 and revision 1 stays readable through ?revision=1', async () => {
    const changed = uploadTable.replace('UP-1,,,,,50,11,580', 'UP-1,,,,,50,9.5,585');
    await upload(suppliers[0].id, changed, { fileName: 'upload-2.csv' }).expect(201);
    const id = ((await get('/pumps?search=UP-1').expect(200)).body as PumpPage).items[0].id;
    const current = (await get(`/pumps/${id}`).expect(200)).body as PumpDetail;
    expect(current.revision!.number).to.equal(2);
    expect(current.revisions.map((revision) => [revision.number, revision.current])).to.deep.equal([
      [2, true],
      [1, false],
    ]);
    const first = (await get(`/pumps/${id}?revision=1`).expect(200)).body as PumpDetail;
    expect(first.revision!.sourceFileName).to.equal('upload-1.csv');
    expect(first.revision!.points.at(-1)!.head).to.be.closeTo(headToSI(11, 'ft'), 1e-12);
    const absent = await get(`/pumps/${id}?revision=9`).expect(404);
    expect(absent.body.pointer).to.equal('/query/revision');
  });

  it('refuses a malformed file with 422 problem details naming row and column, nothing written', async () => {
    const before = await catalogRowCounts(sequelize);
    const checksums = await tableChecksums(sequelize, ['sessions', 'audit_events']);
    const response = await upload(suppliers[0].id, readFileSync(`${malformedFolder}11-text-in-head.csv`)).expect(422);
    expect(response.type).to.equal('application/problem+json');
    expect(response.body.pointer).to.equal('/body/file/rows/7/head');
    expect(response.body.detail).to.contain('row 7, column head');
    expect((response.body.report as CurveImportReport).errors[0]).to.include({ row: 7, column: 'head' });
    expect(await catalogRowCounts(sequelize)).to.deep.equal(before);
    expect(await tableChecksums(sequelize, ['sessions', 'audit_events'])).to.deep.equal(checksums);
  });

  it('a supplier-admin of another supplier gets 403 and nothing is written; an admin may load for any supplier', async () => {
    const checksums = await tableChecksums(sequelize, ['sessions', 'audit_events']);
    const forbidden = await upload(suppliers[1].id, uploadTable).expect(403);
    expect(forbidden.body.pointer).to.equal('/path/supplierId');
    await get(`/suppliers/${suppliers[1].id}/curve-imports`, tokens.ownSupplier).expect(403);
    expect(await tableChecksums(sequelize, ['sessions', 'audit_events'])).to.deep.equal(checksums);
    const byAdmin = await upload(suppliers[1].id, uploadTable.replaceAll('UP-1', 'UP-ADMIN'), {
      token: tokens.admin,
    }).expect(201);
    expect((byAdmin.body as CurveImportReport).supplier.code).to.equal('QUILLWATER');
  });

  it('an API token with curves:import may upload; without a file or with a bad dryRun it is a 400 naming the field', async () => {
    const { user } = await createUserWithSession(sequelize, 'supplier-admin', { supplierId: suppliers[2].id });
    const token = await createApiToken(sequelize, user.id, ['curves:import']);
    await upload(suppliers[2].id, uploadTable, { token, dryRun: true }).expect(200);
    const noFile = await request(app)
      .post(`/api/v1/suppliers/${suppliers[2].id}/curve-imports`)
      .set('Authorization', `Bearer ${token}`)
      .field('dryRun', 'true')
      .expect(400);
    expect(noFile.body.pointer).to.equal('/body/file');
    const badFlag = await request(app)
      .post(`/api/v1/suppliers/${suppliers[2].id}/curve-imports`)
      .set('Authorization', `Bearer ${token}`)
      .field('dryRun', 'maybe')
      .attach('file', Buffer.from(uploadTable), 'x.csv')
      .expect(400);
    expect(badFlag.body.pointer).to.equal('/body/dryRun');
  });

  it('counts only pumps with a curve; a pump without one is listed with empty curve fields and no revision', async () => {
    const pumpCountOf = async (supplierId: number) =>
      ((await get('/suppliers').expect(200)).body as SupplierList).suppliers.find(
        (supplier) => supplier.id === supplierId,
      )!.pumpCount;
    const before = await pumpCountOf(suppliers[2].id);
    const pump = await Pump.create({
      supplierId: suppliers[2].id,
      modelCode: 'NO-CURVE-1',
      displayName: 'Pump without a curve',
      kind: 'submersible',
      nominalSpeedRpm: null,
      voltageV: null,
      phaseCount: null,
      dischargeSizeMm: null,
      solidsHandlingMm: null,
      listPrice: '99.90',
      priceCurrency: 'EUR',
      currentRevisionId: null,
    });
    try {
      expect(await pumpCountOf(suppliers[2].id)).to.equal(before);
      const listed = (await get('/pumps?search=NO-CURVE').expect(200)).body as PumpPage;
      expect(listed.items.map((item) => [item.id, item.currentRevisionNumber, item.flowMax, item.bep])).to.deep.equal([
        [pump.id, null, null, null],
      ]);
      expect(listed.items[0].listPrice).to.deep.equal({ amount: 99.9, currency: 'EUR' });
      const detail = (await get(`/pumps/${pump.id}`).expect(200)).body as PumpDetail;
      expect(detail).to.deep.include({ revision: null, revisions: [] });
      expect((await get(`/pumps/${pump.id}?revision=1`).expect(404)).body.pointer).to.equal('/query/revision');
    } finally {
      await pump.destroy();
    }
  });

  it('answers 413 naming /body/file for a file over 16 MiB', async () => {
    const big = Buffer.alloc(16 * 1024 * 1024 + 10, '#');
    const response = await upload(suppliers[0].id, big).expect(413);
    expect(response.body.pointer).to.equal('/body/file');
  });
});
