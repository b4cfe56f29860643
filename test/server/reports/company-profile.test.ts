import { deflateSync } from 'node:zlib';
import { expect } from 'chai';
import request from 'supertest';
import type { CompanyProfile, Project, ReportSummary } from '../../../shared/api/api-schemas';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { crc32 } from '../../../server/reports/logo-image';
import { createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { binaryBody, readPdf } from './pdf-text';

/*
 * The company profile and its logo. A logo is judged by its bytes: a whole PNG (ISO/IEC 15948) or
 * JPEG (ITU-T T.81) of at most 4000 x 4000 pixels and 1 MiB; anything else is refused, naming
 * /body/file, and nothing is written.
 */

/** A 1 x 1 PNG as a common encoder writes it (libpng), CRCs and all. */
const encodedPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);

function chunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** A grey PNG of the given size, its one row of image data compressed (the header may claim more). */
function png(width: number, height: number): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 0, 0, 0, 0], 8);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(Buffer.alloc((Math.min(width, 64) + 1) * Math.min(height, 64), 0x80))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** A baseline JPEG's marker structure (ITU-T T.81 annex B): SOI, a frame header, a scan, EOI. */
function jpeg(width: number, height: number, end = true): Buffer {
  const segment = (marker: number, data: number[]) => Buffer.from([0xff, marker, 0, data.length + 2, ...data]);
  return Buffer.concat([
    Buffer.from([0xff, 0xd8]),
    segment(0xe0, [0x4a, 0x46, 0x49, 0x46, 0, 1, 1, 0, 0, 1, 0, 1, 0, 0]),
    segment(0xc0, [8, height >> 8, height & 0xff, width >> 8, width & 0xff, 1, 1, 0x11, 0]),
    segment(0xda, [1, 1, 0, 0, 0x3f, 0]),
    Buffer.from([0x12, 0x34, 0x56]),
    ...(end ? [Buffer.from([0xff, 0xd9])] : []),
  ]);
}

describe('reports: the company profile and its logo', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;

  before(async () => {
    scratch = await createScratchDatabase('profiles');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  const upload = (bytes: Buffer, filename: string, contentType: string) =>
    request(app)
      .put('/api/v1/account/profile/logo')
      .set('Authorization', `Bearer ${token}`)
      .attach('file', bytes, { filename, contentType });

  const profile = {
    name: 'Brookside Water Gardens',
    address: '12 Mill Lane\nFairview',
    phone: '+1 555 0100',
    email: 'office@brookside.example',
    licenceNumber: 'WG-20417',
  };

  it('checks CRCs as the PNG specification computes them', () => {
    // the CRC of an IEND chunk is AE 42 60 82 in every PNG (ISO/IEC 15948, Annex D)
    expect(crc32(Buffer.from('IEND', 'latin1'))).to.equal(0xae426082);
  });

  it('starts empty, saves the profile and gives it back', async () => {
    const empty = (
      await request(app).get('/api/v1/account/profile').set('Authorization', `Bearer ${token}`).expect(200)
    ).body as CompanyProfile;
    expect(empty).to.deep.include({ name: '', logo: null, updatedAt: null });
    const saved = (
      await request(app)
        .put('/api/v1/account/profile')
        .set('Authorization', `Bearer ${token}`)
        .send(profile)
        .expect(200)
    ).body as CompanyProfile;
    expect(saved).to.deep.include({ ...profile, logo: null });
    const again = (
      await request(app).get('/api/v1/account/profile').set('Authorization', `Bearer ${token}`).expect(200)
    ).body as CompanyProfile;
    expect(again).to.deep.equal(saved);
  });

  it('refuses unreadable profile text naming the field, writing nothing', async () => {
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const bidi = await request(app)
      .put('/api/v1/account/profile')
      .set('Authorization', `Bearer ${token}`)
      .send({ ...profile, name: 'Brookside \u202Eevil' })
      .expect(422);
    expect(bidi.body.pointer).to.equal('/body/name');
    const markup = await request(app)
      .put('/api/v1/account/profile')
      .set('Authorization', `Bearer ${token}`)
      .send({ ...profile, address: '<script>' })
      .expect(400);
    expect(markup.body.pointer).to.equal('/body/address');
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it('takes a PNG and a JPEG by their content, and gives the logo back as uploaded', async () => {
    const fromPng = (await upload(encodedPng, 'logo.png', 'image/png').expect(200)).body as CompanyProfile;
    expect(fromPng.logo).to.deep.equal({ type: 'image/png', width: 1, height: 1, byteLength: encodedPng.length });
    const picture = jpeg(320, 120);
    // the declared type and name do not count: the bytes do
    const fromJpeg = (await upload(picture, 'logo.bin', 'application/octet-stream').expect(200)).body as CompanyProfile;
    expect(fromJpeg.logo).to.deep.equal({ type: 'image/jpeg', width: 320, height: 120, byteLength: picture.length });
    const stored = await request(app)
      .get('/api/v1/account/profile/logo')
      .set('Authorization', `Bearer ${token}`)
      .buffer(true)
      .parse(binaryBody as never)
      .expect(200);
    expect(stored.headers['content-type']).to.match(/^image\/jpeg/);
    expect((stored.body as Buffer).equals(picture)).to.equal(true);
    await upload(png(400, 150), 'logo.png', 'image/png').expect(200);
  });

  it('refuses a renamed program, an SVG, a 2 MiB file, trailing junk and a claimed 100000 x 100000 PNG', async () => {
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const program = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(400)]);
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"/>');
    const large = Buffer.concat([png(1, 1), Buffer.alloc(2 * 1024 * 1024)]);
    const junk = Buffer.concat([png(10, 10), Buffer.from('trailing junk')]);
    const badCrc = png(10, 10);
    badCrc[29] ^= 0xff; // the IHDR chunk's CRC
    const cases: Array<[string, Buffer, string, number]> = [
      ['renamed program', program, 'logo.png', 415],
      ['SVG', svg, 'logo.svg', 415],
      ['2 MiB file', large, 'logo.png', 413],
      ['PNG with trailing junk', junk, 'logo.png', 422],
      ['PNG claiming 100000 x 100000', png(100_000, 100_000), 'logo.png', 422],
      ['PNG with a wrong CRC', badCrc, 'logo.png', 422],
      ['JPEG without EOI', jpeg(10, 10, false), 'logo.jpg', 422],
      ['JPEG claiming 5000 x 10', jpeg(5000, 10), 'logo.jpg', 422],
    ];
    for (const [what, bytes, name, status] of cases) {
      const answer = await upload(bytes, name, 'image/png');
      expect(answer.status, what).to.equal(status);
      expect(answer.headers['content-type'], what).to.match(/^application\/problem\+json/);
      expect(answer.body.pointer, what).to.equal('/body/file');
    }
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it('heads the proposal with the profile and its logo', async () => {
    await upload(encodedPng, 'logo.png', 'image/png').expect(200);
    const design = {
      unitSystem: 'si',
      system: {
        staticMode: 'levels',
        staticHead: 0,
        intakeLevel: 10,
        dischargeLevel: 12.5,
        outletPressureHead: 0,
        waterTemperatureC: 15,
        frictionMethod: 'hazen-williams',
        segments: [{ series: 'pvc-sch40', size: 'pvc-sch40-2', length: 30, fittings: [], extraK: 0 }],
      },
      band: { flowMin: 100, flowMax: 150 },
      search: {
        arrangements: [1],
        requireOneFailed: false,
        onlyPreferredRegion: false,
        maxInputPowerPerPump: null,
        hoursPerDay: 12,
        tariffPerKWh: null,
        limit: 5,
      },
    };
    const project = (
      await request(app)
        .post('/api/v1/projects')
        .set('Authorization', `Bearer ${token}`)
        .send({ name: 'Courtyard rill', design })
        .expect(201)
    ).body as Project;
    const made = (
      await request(app)
        .post(`/api/v1/projects/${project.id}/reports`)
        .set('Authorization', `Bearer ${token}`)
        .send({ paper: 'a4' })
        .expect(201)
    ).body as ReportSummary;
    const pdf = await request(app)
      .get(made.downloadPath)
      .set('Authorization', `Bearer ${token}`)
      .buffer(true)
      .parse(binaryBody as never)
      .expect(200);
    const bytes = pdf.body as Buffer;
    expect(bytes.includes(Buffer.from('/Subtype /Image'))).to.equal(true);
    const text = (await readPdf(bytes)).pages.join(' ');
    for (const line of ['Brookside Water Gardens', '12 Mill Lane', 'Fairview', 'office@brookside.example', 'WG-20417'])
      expect(text).to.include(line);
    // an empty catalog: the proposal says so rather than failing
    expect(text).to.include('No catalog pump meets this system');
    expect(text).to.include('2.50 m'); // static head from the levels, 12.5 - 10
  });
});
