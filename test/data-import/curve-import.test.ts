import { expect } from 'chai';
import { readFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { fileURLToPath } from 'node:url';
import { QueryTypes, type Sequelize } from 'sequelize';
import { fitPumpCurve, flowToSI } from '../../shared/hydraulics';
import { readCurveTable } from '../../data-import/curve-table-reader';
import { formatCurveTable, spreadsheetSafeText } from '../../data-import/curve-table-writer';
import { demoCurveFiles, demoCurveTables } from '../../data-import/demo-data/demo-curve-tables';
import { Supplier } from '../../server/database/models';
import { tableChecksums } from '../support/accounts';
import { createScratchDatabase } from '../support/test-database';
import { catalogRowCounts, importText, seedDemoCatalog } from './catalog-fixtures';

const demoFolder = fileURLToPath(new URL('../../data-import/demo-data/', import.meta.url));

function read(text: string | Buffer) {
  return readCurveTable(Readable.from([Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8')]));
}

const smallTable = [
  'riffle-curve-table,1',
  'flow-unit,m3/h',
  'head-unit,m',
  'efficiency-unit,%',
  'model_code,display_name,kind,preferred_flow_min,preferred_flow_max,flow,head,efficiency',
  'K-10,Kestrel test pump 10,submersible,4,7,0,8.0,0',
  'K-10,,,,,2,7.7,30',
  'K-10,,,,,4,7.0,48',
  'K-10,,,,,6,5.9,55',
  'K-10,,,,,8,4.4,50',
  'K-10,,,,,10,2.5,36',
  'K-20,Kestrel test pump 20,mixed-flow,,,0,5,',
  'K-20,,,,,50,4.2,',
  'K-20,,,,,100,2.6,',
].join('\n');

/** Invented sheets as the trade prints them: open flow at 0 ft, two points only, drooping, largest flow first. */
const tradeSheets = [
  'riffle-curve-table,1',
  'flow-unit,gph',
  'head-unit,ft',
  'model_code,display_name,kind,flow,head',
  'W-1,Open flow,submersible,0,12',
  'W-1,,,2000,9.8',
  'W-1,,,4000,4.4',
  'W-1,,,4800,0',
  'W-2,Two points,submersible,0,6',
  'W-2,,,1200,0',
  'W-3,Drooping,external-centrifugal,0,30',
  'W-3,,,1000,33',
  'W-3,,,2000,31',
  'W-3,,,3000,26',
  'W-3,,,4000,18',
  'W-4,Largest flow first,submersible,3000,2',
  'W-4,,,2000,5.5',
  'W-4,,,1000,7.4',
  'W-4,,,0,8',
].join('\n');

describe('curve-table reader', () => {
  it('reads a semicolon file with a BOM, decimal commas, quoted fields and comments the same as the comma file', async () => {
    const semicolon = `\uFEFF# a comment line\r\n${smallTable
      .split('\n')
      .map((line) => line.replaceAll(',', ';').replace(/(\d)\.(\d)/g, '$1,$2'))
      .join('\r\n')
      .replace('Kestrel test pump 10', '"Kestrel; test ""pump"" 10"')}`;
    const [fromCommas, fromSemicolons] = await Promise.all([read(smallTable), read(semicolon)]);
    expect(fromSemicolons.errors).to.deep.equal([]);
    expect(fromSemicolons.pumps[0].details.displayName).to.equal('Kestrel; test "pump" 10');
    expect(fromSemicolons.pumps.map((pump) => pump.points)).to.deep.equal(
      fromCommas.pumps.map((pump) => pump.points.map((point) => ({ ...point, row: point.row + 1 }))),
    );
  });

  it('reads the example of data-import/README.md without an error or a warning', async () => {
    const readme = readFileSync(fileURLToPath(new URL('../../data-import/README.md', import.meta.url)), 'utf8');
    const example = /```csv\n([\s\S]*?)```/.exec(readme)![1];
    const table = await read(example);
    expect(table.errors).to.deep.equal([]);
    expect(table.pumps.map((pump) => [pump.modelCode, pump.points.length, pump.preferred !== null])).to.deep.equal([
      ['WF-200', 5, true],
    ]);
    const { checkPumpCurve } = await import('../../data-import/pump-curve-check');
    const checked = checkPumpCurve(table.pumps[0], 'electrical');
    expect(checked.errors).to.deep.equal([]);
    expect(checked.fit!.bep).to.not.equal(null);
  });

  it('converts the declared units to SI: 60 gph is 1 US gpm, 3.785411784 L/min (NIST SP 811, 2008, B.8)', async () => {
    const table = await read(
      [
        'riffle-curve-table,1',
        'flow-unit,gph',
        'head-unit,ft',
        'power-unit,hp',
        'model_code,display_name,kind,flow,head,power',
        'G-1,G one,submersible,60,10,1',
        'G-1,,,120,8,1.2',
        'G-1,,,180,5,1.3',
      ].join('\n'),
    );
    expect(table.errors).to.deep.equal([]);
    const [first] = table.pumps[0].points;
    expect(first.flow).to.be.closeTo(3.785411784e-3 / 60, 1e-15);
    expect(first.head).to.be.closeTo(3.048, 1e-12);
    expect(first.power).to.be.closeTo(745.699872, 1e-5);
    expect(table.fileUnits).to.deep.equal({ flow: 'gph', head: 'ft', power: 'hp' });
  });

  /** The small table with one more pump column after preferred_flow_max, `value` on the first pump's first row. */
  const withPumpColumn = (column: string, value: string) =>
    smallTable
      .replace('preferred_flow_max,flow', `preferred_flow_max,${column},flow`)
      .split('\n')
      .map((line, index) =>
        index < 5
          ? line
          : line.replace(/^(K-\d+,[^,]*,[^,]*,[^,]*,[^,]*,)/, (cells) => `${cells}${index === 5 ? value : ''},`),
      )
      .join('\n');

  it('reads a motor efficiency in percent as a fraction, and refuses one of 0 or over 100 naming the column', async () => {
    const withMotor = (value: string) => withPumpColumn('motor_efficiency', value);
    const table = await read(withMotor('82.5'));
    expect(table.errors).to.deep.equal([]);
    expect(table.pumps.map((pump) => pump.details.motorEfficiency)).to.deep.equal([0.825, null]);
    for (const bad of ['0', '150']) {
      const refused = await read(withMotor(bad));
      expect(refused.errors.map((error) => [error.row, error.column, error.code])).to.deep.equal([
        [6, 'motor_efficiency', 'number-out-of-range'],
      ]);
    }
  });

  it('reads a full-load current in amperes, and refuses 0, a negative, a word or over 1000 A naming the column', async () => {
    const withCurrent = (value: string) => withPumpColumn('full_load_current', value);
    const table = await read(withCurrent('4.6'));
    expect(table.errors).to.deep.equal([]);
    expect(table.pumps.map((pump) => pump.details.fullLoadCurrentA)).to.deep.equal([4.6, null]);
    for (const [bad, code] of [
      ['0', 'number-out-of-range'],
      ['-2', 'number-out-of-range'],
      ['1200', 'number-out-of-range'],
      ['many', 'not-a-number'],
    ]) {
      const refused = await read(withCurrent(bad));
      expect(refused.errors.map((error) => [error.row, error.column, error.code])).to.deep.equal([
        [6, 'full_load_current', code],
      ]);
    }
  });

  it('reads a speed range and fixed speeds beside the nominal speed, refusing bad ones at their row and column', async () => {
    // speed_rpm, speed_min_rpm, speed_max_rpm, speeds_rpm on K-10's first row (line 6); K-20 gives none
    const withSpeeds = (nominal: string, min: string, max: string, speeds: string) =>
      smallTable
        .replace('kind,preferred_flow_min', 'kind,speed_rpm,speed_min_rpm,speed_max_rpm,speeds_rpm,preferred_flow_min')
        .split('\n')
        .map((line, index) =>
          index < 5
            ? line
            : line.replace(/^(K-\d+,[^,]*,[^,]*,)/, (cells) =>
                index === 5 ? `${cells}${nominal},${min},${max},"${speeds}",` : `${cells},,,,`,
              ),
        )
        .join('\n');
    const table = await read(withSpeeds('2900', '1450', '3200', '1450;2175'));
    expect(table.errors).to.deep.equal([]);
    const [first, second] = table.pumps.map((pump) => pump.details);
    expect([first.nominalSpeedRpm, first.speedMinRpm, first.speedMaxRpm, first.fixedSpeedsRpm]).to.deep.equal([
      2900,
      1450,
      3200,
      [1450, 2175],
    ]);
    expect([second.speedMinRpm, second.speedMaxRpm, second.fixedSpeedsRpm]).to.deep.equal([null, null, null]);
    for (const [cells, column, code] of [
      [['2900', '1450', '', ''], 'speed_max_rpm', 'speed-range-one-end'],
      [['2900', '2900', '1450', ''], 'speed_max_rpm', 'speed-range-reversed'],
      [['2900', '1000', '2000', ''], 'speed_max_rpm', 'speed-range-misses-nominal'],
      [['2900', '3000', '3400', ''], 'speed_min_rpm', 'speed-range-misses-nominal'],
      [['2900', '1450', '3500', ''], 'speed_max_rpm', 'speed-above-nominal'],
      [['', '1450', '2900', ''], 'speed_min_rpm', 'speed-needs-nominal'],
      [['', '', '', '1450;2900'], 'speeds_rpm', 'speed-needs-nominal'],
      [['2900', '', '', '1450;3000'], 'speeds_rpm', 'speed-above-nominal'],
      [['2900', '', '', '2900;1450'], 'speeds_rpm', 'speeds-not-a-list'],
      [['2900', '', '', '1450;fast'], 'speeds_rpm', 'speeds-not-a-list'],
      [['2900', '0', '2900', ''], 'speed_min_rpm', 'number-out-of-range'],
      [['2900', '1450.5', '2900', ''], 'speed_min_rpm', 'number-out-of-range'],
    ] as const) {
      const refused = await read(withSpeeds(cells[0], cells[1], cells[2], cells[3]));
      expect(
        refused.errors.map((error) => [error.row, error.column, error.code]),
        cells.join(' '),
      ).to.deep.equal([[6, column, code]]);
      expect(refused.pumps[0].details.speedMinRpm, cells.join(' ')).to.equal(null);
      expect(refused.pumps[0].details.fixedSpeedsRpm, cells.join(' ')).to.equal(null);
    }
  });

  it('hashes the bytes it read (sha-256) and counts the point rows', async () => {
    const { createHash } = await import('node:crypto');
    const table = await read(smallTable);
    expect(table.fileChecksum).to.equal(createHash('sha256').update(smallTable).digest('hex'));
    expect(table.pointRowCount).to.equal(9);
  });

  it('keeps text that starts like a formula as text, warns, and writes it back spreadsheet-safe', async () => {
    const text = smallTable.replace('Kestrel test pump 10', '"=HYPERLINK(""x"")"');
    const table = await read(text);
    expect(table.errors).to.deep.equal([]);
    expect(table.pumps[0].details.displayName).to.equal('=HYPERLINK("x")');
    expect(table.pumps[0].warnings[0]).to.include({ row: 6, column: 'display_name' });
    expect(spreadsheetSafeText('=HYPERLINK("x")')).to.equal(`'=HYPERLINK("x")`);
    expect(spreadsheetSafeText('-5 m lift')).to.equal(`'-5 m lift`);
    expect(spreadsheetSafeText('Weir pump')).to.equal('Weir pump');
    const written = formatCurveTable({
      units: { 'flow-unit': 'm3/h', 'head-unit': 'm' },
      columns: ['model_code', 'display_name', 'kind', 'flow', 'head'],
      rows: [
        { model_code: 'F-1', display_name: '@SUM(A1)', kind: 'submersible', flow: 0, head: 3 },
        { model_code: 'F-1', flow: 1, head: 2 },
        { model_code: 'F-1', flow: 2, head: 1 },
      ],
    });
    expect(written).to.contain(`'@SUM(A1)`);
    expect((await read(written)).pumps[0].details.displayName).to.equal('@SUM(A1)');
  });

  it('flags a small head rise and fits with the head held level; refuses a large one after a fall', async () => {
    const small = await read(smallTable.replace('K-10,,,,,2,7.7,30', 'K-10,,,,,2,8.1,30'));
    expect(small.errors).to.deep.equal([]);
    const { checkPumpCurve } = await import('../../data-import/pump-curve-check');
    const checked = checkPumpCurve(small.pumps[0], 'shaft');
    expect(checked.errors).to.deep.equal([]);
    expect(checked.warnings.find((warning) => warning.column === 'head')).to.include({ row: 7 });
    expect(checked.fit).to.not.equal(null);
    const large = checkPumpCurve(
      (await read(smallTable.replace('K-10,,,,,4,7.0,48', 'K-10,,,,,4,8.5,48'))).pumps[0],
      'shaft',
    );
    expect(large.errors[0]).to.include({ row: 8, column: 'head', code: 'head-rise-refused' });
    // a large rise from shut-off to a peak, falling after it, is a drooping curve: used from the peak on
    const drooping = checkPumpCurve(
      (await read(smallTable.replace('K-10,,,,,2,7.7,30', 'K-10,,,,,2,9.0,30'))).pumps[0],
      'shaft',
    );
    expect(drooping.errors).to.deep.equal([]);
    expect(drooping.fit?.flowMin).to.be.closeTo(flowToSI(2, 'm3/h'), 1e-15);
  });
});

describe('demo curve tables', () => {
  it('are the generator output, byte for byte: the generator is deterministic', () => {
    for (const table of demoCurveTables())
      expect(readFileSync(`${demoFolder}${table.fileName}`, 'utf8'), table.fileName).to.equal(table.text);
    expect(demoCurveTables().map((table) => table.text)).to.deep.equal(demoCurveTables().map((table) => table.text));
  });

  it('hold at least 60 pumps of every kind, say they are invented, and mostly give efficiency or power', async () => {
    const pumps = [];
    for (const { fileName } of demoCurveFiles) {
      const text = readFileSync(`${demoFolder}${fileName}`, 'utf8');
      expect(text).to.match(/INVENTED DATA/);
      const table = await read(text);
      expect(table.errors, fileName).to.deep.equal([]);
      pumps.push(...table.pumps);
    }
    expect(pumps.length).to.be.at.least(60);
    expect(new Set(pumps.map((pump) => pump.details.kind))).to.deep.equal(
      new Set(['submersible', 'external-centrifugal', 'mixed-flow']),
    );
    const withEfficiency = pumps.filter(
      (pump) => pump.points[0].power !== undefined || pump.points[0].efficiency !== undefined,
    );
    expect(withEfficiency.length / pumps.length).to.be.greaterThan(0.75);
    expect(pumps.filter((pump) => pump.preferred && pump.allowable).length).to.be.at.least(10);
  });
});

describe('curve import into the database', function () {
  this.timeout(60_000);
  let sequelize: Sequelize;
  let drop: () => Promise<void>;
  let supplier: Supplier;

  before(async () => {
    ({ sequelize, drop } = await createScratchDatabase('curve_import'));
    await seedDemoCatalog(sequelize);
    supplier = await Supplier.create({ code: 'KESTREL', name: 'Kestrel Test Pumps (invented)' });
  });

  after(async () => {
    await drop?.();
  });

  it('loaded the demo catalog: every demo pump with one revision, its points and its fit', async () => {
    const [row] = await sequelize.query<{ pumps: number; revisions: number; current: number; bep: number }>(
      `SELECT (SELECT COUNT(*) FROM pumps) AS pumps, (SELECT COUNT(*) FROM curve_revisions) AS revisions,
              (SELECT COUNT(*) FROM pumps WHERE current_revision_id IS NOT NULL) AS current,
              (SELECT COUNT(*) FROM curve_revisions WHERE bep_flow_m3s IS NOT NULL) AS bep`,
      { type: QueryTypes.SELECT },
    );
    expect(Number(row.pumps)).to.be.at.least(60);
    expect(Number(row.revisions)).to.equal(Number(row.pumps));
    expect(Number(row.current)).to.equal(Number(row.pumps));
    expect(Number(row.bep)).to.be.greaterThan(0.75 * Number(row.pumps));
  });

  it('a dry run reports new pumps with their fit and writes nothing', async () => {
    const before = await tableChecksums(sequelize);
    const report = await importText(sequelize, supplier, smallTable, { dryRun: true });
    expect(report.errors).to.deep.equal([]);
    expect(report.committed).to.equal(false);
    expect(report.counts).to.deep.equal({ new: 2, changed: 0, unchanged: 0 });
    expect(report.pumps[0].fit?.bep).to.not.equal(null);
    expect(report.pumps[1].bep).to.equal(null);
    expect(await tableChecksums(sequelize)).to.deep.equal(before);
  });

  it('accepts the sheets the trade prints: open flow, two points (estimated), drooping, largest flow first', async () => {
    const before = await tableChecksums(sequelize);
    const report = await importText(sequelize, supplier, tradeSheets, { dryRun: true });
    expect(report.errors).to.deep.equal([]);
    const [open, two, drooping, reversed] = report.pumps;
    expect(open.fit?.flowMax).to.be.closeTo(flowToSI(4800, 'gph'), 1e-15);
    expect(open.curveBasis).to.equal('published');
    expect(two.curveBasis).to.equal('estimated-from-two-points');
    expect(two.fit?.curveBasis).to.equal('estimated-from-two-points');
    expect(two.bep).to.equal(null);
    const codes = (pump: typeof open) =>
      pump.warnings.map((warning) => (warning.params.issue as { code: string } | undefined)?.code);
    expect(codes(two)).to.include('curve-estimated-from-two-points');
    expect(codes(drooping)).to.include('drooping-curve');
    expect(drooping.fit?.flowMin).to.be.closeTo(flowToSI(1000, 'gph'), 1e-15);
    expect(codes(reversed)).to.include('points-reversed');
    expect(reversed.fit?.flowMin).to.equal(0);
    expect(await tableChecksums(sequelize)).to.deep.equal(before);
  });

  it('stores a two-point pump with its estimated marker', async () => {
    const twoPoint = tradeSheets
      .split('\n')
      .filter((line) => !/^W-[134],/.test(line))
      .join('\n');
    const wren = await Supplier.create({ code: 'WREN', name: 'Wren Test Pumps (invented)' });
    const report = await importText(sequelize, wren, twoPoint, { fileName: 'two-point.csv' });
    expect(report.committed).to.equal(true);
    const [row] = await sequelize.query<{ fit: unknown }>(
      `SELECT r.fit FROM pumps p JOIN curve_revisions r ON r.id = p.current_revision_id
        WHERE p.supplier_id = ? AND p.model_code = 'W-2'`,
      { replacements: [wren.id], type: QueryTypes.SELECT },
    );
    const stored = (typeof row.fit === 'string' ? JSON.parse(row.fit) : row.fit) as { curveBasis: string };
    expect(stored.curveBasis).to.equal('estimated-from-two-points');
  });

  it('commits every pump with its points, preferred range and the engine fit of those points', async () => {
    const report = await importText(sequelize, supplier, smallTable, { fileName: 'kestrel-1.csv' });
    expect(report.committed).to.equal(true);
    expect(report.importId).to.be.a('number');
    const [pump] = await sequelize.query<{ current_revision_id: number; fit: unknown; number: number }>(
      `SELECT p.current_revision_id, r.fit, r.number FROM pumps p JOIN curve_revisions r ON r.id = p.current_revision_id
        WHERE p.supplier_id = ? AND p.model_code = 'K-10'`,
      { replacements: [supplier.id], type: QueryTypes.SELECT },
    );
    expect(pump.number).to.equal(1);
    const points = await sequelize.query<{ flow_m3s: number; head_m: number; efficiency: number }>(
      'SELECT flow_m3s, head_m, efficiency FROM curve_points WHERE revision_id = ? ORDER BY position',
      { replacements: [pump.current_revision_id], type: QueryTypes.SELECT },
    );
    expect(points.map((point) => point.head_m)).to.deep.equal([8.0, 7.7, 7.0, 5.9, 4.4, 2.5]);
    const refit = fitPumpCurve(
      points.map((point) => ({ flow: point.flow_m3s, head: point.head_m, efficiency: point.efficiency })),
    );
    const stored = (typeof pump.fit === 'string' ? JSON.parse(pump.fit) : pump.fit) as typeof refit;
    expect(stored.headCoefficients).to.deep.equal(refit.headCoefficients);
    expect(stored.bep!.flow).to.equal(refit.bep!.flow);
    const [range] = await sequelize.query<{ flow_min_m3s: number; flow_max_m3s: number }>(
      "SELECT flow_min_m3s, flow_max_m3s FROM curve_declared_ranges WHERE revision_id = ? AND region = 'preferred'",
      { replacements: [pump.current_revision_id], type: QueryTypes.SELECT },
    );
    expect(range.flow_min_m3s).to.be.closeTo(flowToSI(4, 'm3/h'), 1e-15);
  });

  it('re-importing the unchanged file writes nothing, even from other units', async () => {
    const countsBefore = await catalogRowCounts(sequelize);
    const checksumsBefore = await tableChecksums(sequelize);
    const same = await importText(sequelize, supplier, smallTable, { fileName: 'kestrel-1.csv' });
    expect(same.counts).to.deep.equal({ new: 0, changed: 0, unchanged: 2 });
    expect(same.committed).to.equal(false);
    const inLitres = smallTable
      .replace('flow-unit,m3/h', 'flow-unit,L/s')
      .split('\n')
      .map((line) =>
        line.replace(
          /^(K-\d+,[^,]*,[^,]*,)([^,]*),([^,]*),([^,]*),/,
          (_all, lead: string, min: string, max: string, flow: string) => {
            const toLitres = (value: string) => (value === '' ? '' : String(Number(value) / 3.6));
            return `${lead}${toLitres(min)},${toLitres(max)},${toLitres(flow)},`;
          },
        ),
      )
      .join('\n');
    const converted = await importText(sequelize, supplier, inLitres, { fileName: 'kestrel-1-litres.csv' });
    expect(converted.errors).to.deep.equal([]);
    expect(converted.counts).to.deep.equal({ new: 0, changed: 0, unchanged: 2 });
    expect(await catalogRowCounts(sequelize)).to.deep.equal(countsBefore);
    expect(await tableChecksums(sequelize)).to.deep.equal(checksumsBefore);
  });

  it('a changed curve becomes revision 2; revision 1 and its points stay readable', async () => {
    const changed = smallTable.replace('K-10,,,,,10,2.5,36', 'K-10,,,,,10,2.2,34');
    const report = await importText(sequelize, supplier, changed, { fileName: 'kestrel-2.csv' });
    expect(report.counts).to.deep.equal({ new: 0, changed: 1, unchanged: 1 });
    expect(report.pumps.find((pump) => pump.modelCode === 'K-10')).to.include({
      outcome: 'changed',
      revisionNumber: 2,
    });
    const revisions = await sequelize.query<{ number: number; heads: string; current: number }>(
      `SELECT r.number, GROUP_CONCAT(c.head_m ORDER BY c.position) AS heads, p.current_revision_id = r.id AS current
         FROM curve_revisions r JOIN pumps p ON p.id = r.pump_id JOIN curve_points c ON c.revision_id = r.id
        WHERE p.supplier_id = ? AND p.model_code = 'K-10' GROUP BY r.id ORDER BY r.number`,
      { replacements: [supplier.id], type: QueryTypes.SELECT },
    );
    expect(
      revisions.map((revision) => [revision.number, revision.heads.split(',').pop(), Number(revision.current)]),
    ).to.deep.equal([
      [1, '2.5', 0],
      [2, '2.2', 1],
    ]);
  });

  it('a change of details only updates the pump and makes no revision', async () => {
    const renamed = smallTable
      .replace('K-10,,,,,10,2.5,36', 'K-10,,,,,10,2.2,34')
      .replace('Kestrel test pump 20', 'Kestrel test pump 20 renamed');
    const revisionsBefore = (await catalogRowCounts(sequelize)).curve_revisions;
    const report = await importText(sequelize, supplier, renamed, { fileName: 'kestrel-3.csv' });
    expect(report.pumps.find((pump) => pump.modelCode === 'K-20')).to.deep.include({
      outcome: 'changed',
      changes: ['details'],
      revisionNumber: 1,
    });
    expect((await catalogRowCounts(sequelize)).curve_revisions).to.equal(revisionsBefore);
    const pump = await sequelize.query<{ display_name: string }>(
      "SELECT display_name FROM pumps WHERE model_code = 'K-20'",
      { type: QueryTypes.SELECT },
    );
    expect(pump[0].display_name).to.equal('Kestrel test pump 20 renamed');
  });

  it('one bad pump refuses the whole file: the good pumps are not written either', async () => {
    const checksumsBefore = await tableChecksums(sequelize);
    const text = `${smallTable.replace('K-10,,,,,10,2.5,36', 'K-10,,,,,10,2.9,36').replace('Kestrel test pump 20', 'Kestrel test pump 20 renamed')}\nK-30,Kestrel test pump 30,submersible,,,0,4,\nK-30,,,,,1,x,\nK-30,,,,,2,2,`;
    const report = await importText(sequelize, supplier, text);
    expect(report.errors.map((error) => [error.row, error.column])).to.deep.equal([[16, 'head']]);
    expect(report.pumps.map((pump) => pump.outcome)).to.deep.equal(['changed', 'unchanged', 'refused']);
    expect(await tableChecksums(sequelize)).to.deep.equal(checksumsBefore);
  });
});
