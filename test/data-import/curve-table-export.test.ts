import { expect } from 'chai';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { exportCurveTable } from '../../server/catalog/curve-table-export-query';
import { createApp } from '../../server/app';
import { Supplier } from '../../server/database/models';
import { createLogger } from '../../server/logging';
import { createUserWithSession, tableChecksums } from '../support/accounts';
import { createScratchDatabase } from '../support/test-database';
import { importText, seedDemoCatalog } from './catalog-fixtures';

/** Every feature of the format in one invented file: units other than SI, power, NPSH, sizes, a price, ranges, notes, a retired pump and a formula-like name. */
const richTable = [
  'riffle-curve-table,1',
  'flow-unit,gph',
  'head-unit,ft',
  'power-unit,W',
  'npsh-unit,ft',
  'size-unit,in',
  'currency,EUR',
  'power-basis,electrical',
  'model_code,display_name,kind,speed_rpm,voltage,phases,discharge_size,solids_size,list_price,status,preferred_flow_min,preferred_flow_max,allowable_flow_min,allowable_flow_max,notes,flow,head,power,npsh_required',
  'TR-1,"Tarn ""stream"" pump, 1",submersible,2850,230,1,1.25,0.375,412.5,active,1500,2600,900,3200,Checked on the bench in March,0,21.3,410,',
  'TR-1,,,,,,,,,,,,,,,900,20.1,470,3.1',
  'TR-1,,,,,,,,,,,,,,,1800,17.6,530,3.9',
  'TR-1,,,,,,,,,,,,,,,2700,13.2,575,5.2',
  'TR-1,,,,,,,,,,,,,,,3300,9.4,590,6.6',
  'TR-2,=SUM(A1:A9) spa pump,external-centrifugal,,,,,,,retired,,,,,,0,30,650,',
  'TR-2,,,,,,,,,,,,,,,1200,27.5,760,',
  'TR-2,,,,,,,,,,,,,,,2400,21,850,',
].join('\n');

describe('curve-table export', function () {
  this.timeout(120_000);
  let sequelize: Sequelize;
  let drop: () => Promise<void>;
  let suppliers: Supplier[];

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('curve_export'));
    suppliers = await seedDemoCatalog(sequelize);
  });

  after(async () => {
    await drop?.();
  });

  it("gives back every demo supplier's curves so that loading them again changes nothing", async () => {
    for (const supplier of suppliers) {
      const exported = await exportCurveTable(supplier);
      expect(exported.pumpCount, supplier.code).to.be.greaterThan(0);
      // the demo gives every pump its full-load current, so the column is written
      expect(exported.text.split('\n').find((line) => line.startsWith('model_code'))).to.contain('full_load_current');
      // the demo's invented drives: speed ranges at Alderbrook, a two-speed pump at Quillwater
      const header = exported.text.split('\n').find((line) => line.startsWith('model_code'))!;
      expect(header.includes('speed_min_rpm'), supplier.code).to.equal(supplier.code === 'ALDERBROOK');
      expect(header.includes('speeds_rpm'), supplier.code).to.equal(supplier.code === 'QUILLWATER');
      const again = await importText(sequelize, supplier, exported.text, { dryRun: true });
      expect(again.errors, supplier.code).to.deep.equal([]);
      expect(again.counts, supplier.code).to.deep.equal({ new: 0, changed: 0, unchanged: exported.pumpCount });
    }
  });

  it('keeps the units, power basis, ranges, notes, sizes, price and status of the file it came from', async () => {
    const supplier = await Supplier.create({ code: 'TARNEXPORT', name: 'Tarn Export Demo Supply' });
    const loaded = await importText(sequelize, supplier, richTable);
    expect(loaded.errors).to.deep.equal([]);
    const { text, units } = await exportCurveTable(supplier);
    expect(units).to.include({
      flow: 'gph',
      head: 'ft',
      power: 'W',
      npsh: 'ft',
      size: 'in',
      powerBasis: 'electrical',
      currency: 'EUR',
    });
    expect(text).to.contain('\nflow-unit,gph\nhead-unit,ft\npower-unit,W\n');
    expect(text).to.contain(
      'TR-1,"Tarn ""stream"" pump, 1",submersible,2850,230,1,1.25,0.375,412.50,active,1500,2600,900,3200,Checked on the bench in March,0,21.3,410,',
    );
    // a spreadsheet would run the name as a formula: the export quotes it with an apostrophe
    expect(text).to.contain("TR-2,'=SUM(A1:A9) spa pump,external-centrifugal");
    expect(text).to.contain(',retired,');

    const before = await tableChecksums(sequelize);
    const again = await importText(sequelize, supplier, text);
    expect(again.errors).to.deep.equal([]);
    expect(again.counts).to.deep.equal({ new: 0, changed: 0, unchanged: 2 });
    expect(again.pumps.find((pump) => pump.modelCode === 'TR-2')?.displayName).to.equal('=SUM(A1:A9) spa pump');
    expect(await tableChecksums(sequelize)).to.deep.equal(before);
  });

  it('writes a supplier with files in two unit systems in the units most pumps used, still unchanged on loading', async () => {
    const supplier = await Supplier.create({ code: 'MIXEDUNITS', name: 'Mixed Units Demo Supply' });
    const metric = richTable
      .replace('flow-unit,gph', 'flow-unit,m3/h')
      .replace('head-unit,ft', 'head-unit,m')
      .replaceAll('TR-', 'MX-')
      .split('\n')
      .filter((line) => !line.startsWith('MX-2'))
      .join('\n')
      .replace(/MX-1,([^\n]*?),0,21\.3,/, 'MX-1,$1,0,6.5,')
      .replace(/,900,20\.1,/, ',0.2,6.1,')
      .replace(/,1800,17\.6,/, ',0.4,5.4,')
      .replace(/,2700,13\.2,/, ',0.6,4.0,')
      .replace(/,3300,9\.4,/, ',0.75,2.9,')
      .replace(',1500,2600,900,3200,', ',0.3,0.6,0.15,0.7,');
    expect((await importText(sequelize, supplier, richTable)).errors).to.deep.equal([]);
    const metricReport = await importText(sequelize, supplier, metric, { fileName: 'metric.csv' });
    expect(metricReport.errors).to.deep.equal([]);
    const { text, units } = await exportCurveTable(supplier);
    expect(units).to.include({ flow: 'gph', head: 'ft' });
    const again = await importText(sequelize, supplier, text, { dryRun: true });
    expect(again.errors).to.deep.equal([]);
    expect(again.counts).to.deep.equal({ new: 0, changed: 0, unchanged: 3 });
  });

  describe('GET /suppliers/{supplierId}/curve-table', () => {
    it("answers a CSV download for the admin and the supplier's own admin, and refuses another supplier's", async () => {
      const app = createApp({ sequelize, logger: createLogger('silent') });
      const [own, other] = suppliers;
      const { token: admin } = await createUserWithSession(sequelize, 'admin');
      const { token: supplierAdmin } = await createUserWithSession(sequelize, 'supplier-admin', { supplierId: own.id });
      const download = await request(app)
        .get(`/api/v1/suppliers/${own.id}/curve-table`)
        .set('Authorization', `Bearer ${supplierAdmin}`)
        .expect(200);
      expect(download.type).to.equal('text/csv');
      expect(download.headers['content-disposition']).to.equal(`attachment; filename="${own.code}-curve-table.csv"`);
      expect(download.text).to.match(/^# Curve table of .+\nriffle-curve-table,1\n/);
      expect(download.text).to.equal((await exportCurveTable(own)).text);
      await request(app)
        .get(`/api/v1/suppliers/${other.id}/curve-table`)
        .set('Authorization', `Bearer ${admin}`)
        .expect(200);
      const refused = await request(app)
        .get(`/api/v1/suppliers/${other.id}/curve-table`)
        .set('Authorization', `Bearer ${supplierAdmin}`)
        .expect(403);
      expect(refused.body.errors[0].pointer).to.equal('/path/supplierId');
      await request(app)
        .get('/api/v1/suppliers/999999/curve-table')
        .set('Authorization', `Bearer ${admin}`)
        .expect(404);
    });
  });
});
