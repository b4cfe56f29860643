import { expect } from 'chai';
import { mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import express from 'express';
import request from 'supertest';
import { defaultClientFolder } from '../../server/app';
import { clientFilesRouter } from '../../server/client-files';
import { precompressClient } from '../../server/launch/client-precompress';

const immutable = 'public, max-age=31536000, immutable';

/** The bytes sent, from Content-Length: supertest hands the body over already decompressed. */
function sentBytes(response: request.Response): number {
  return Number(response.headers['content-length']);
}

describe('the built client as files', function () {
  describe('a small build, precompressed here', () => {
    let folder: string;
    const script = `export const rows = [${Array.from({ length: 400 }, (_, i) => `{ id: ${i}, name: "row ${i}" }`).join(', ')}];\n`;
    const page = `<!doctype html><html lang="en"><head><title>Riffle</title></head><body>${'<p>text</p>'.repeat(200)}</body></html>`;

    before(() => {
      folder = mkdtempSync(join(tmpdir(), 'riffle-client-files-'));
      writeFileSync(join(folder, 'chunk-AB12CD34.js'), script);
      writeFileSync(join(folder, 'index.html'), page);
      writeFileSync(join(folder, 'mark.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
      precompressClient(folder);
    });

    after(() => rmSync(folder, { recursive: true, force: true }));

    const app = () => express().use(clientFilesRouter(folder));

    it('writes brotli and gzip copies beside the larger files only', () => {
      expect(readdirSync(folder).sort()).to.deep.equal([
        'chunk-AB12CD34.js',
        'chunk-AB12CD34.js.br',
        'chunk-AB12CD34.js.gz',
        'index.html',
        'index.html.br',
        'index.html.gz',
        'mark.svg',
      ]);
    });

    it('sends brotli when the browser accepts it, and the same script once decompressed', async () => {
      const response = await request(app()).get('/chunk-AB12CD34.js').set('Accept-Encoding', 'gzip, br');
      expect(response.status).to.equal(200);
      expect(response.headers['content-encoding']).to.equal('br');
      expect(response.headers['content-type']).to.match(/javascript/);
      expect(response.headers['vary']).to.match(/Accept-Encoding/);
      expect(response.headers['cache-control']).to.equal(immutable);
      expect(sentBytes(response)).to.equal(statSync(join(folder, 'chunk-AB12CD34.js.br')).size);
      expect(sentBytes(response)).to.be.lessThan(script.length / 3);
      expect(response.text).to.equal(script);
    });

    it('sends gzip to a browser without brotli, and the plain file to one that accepts neither', async () => {
      const gzipped = await request(app()).get('/chunk-AB12CD34.js').set('Accept-Encoding', 'gzip');
      expect(gzipped.headers['content-encoding']).to.equal('gzip');
      expect(sentBytes(gzipped)).to.equal(statSync(join(folder, 'chunk-AB12CD34.js.gz')).size);
      expect(gzipped.text).to.equal(script);
      const plain = await request(app()).get('/chunk-AB12CD34.js').set('Accept-Encoding', 'identity');
      expect(plain.headers['content-encoding']).to.equal(undefined);
      expect(sentBytes(plain)).to.equal(Buffer.byteLength(script));
      expect(plain.text).to.equal(script);
      expect(plain.headers['cache-control']).to.equal(immutable);
    });

    it('sends the page with no-cache, at its own address and for a client-side route', async () => {
      for (const path of ['/', '/index.html', '/design/system']) {
        const response = await request(app()).get(path).set('Accept-Encoding', 'br');
        expect(response.status, path).to.equal(200);
        expect(response.headers['cache-control'], path).to.equal('no-cache');
        expect(response.headers['content-encoding'], path).to.equal('br');
        expect(response.text, path).to.equal(page);
      }
    });

    it('caches an unhashed file for an hour only', async () => {
      const response = await request(app()).get('/mark.svg');
      expect(response.headers['cache-control']).to.equal('public, max-age=3600');
    });
  });

  describe('the real build', () => {
    const app = () => express().use(clientFilesRouter(defaultClientFolder));

    it('sends a hashed script as brotli, cached for good, and the page with no-cache', async () => {
      const script = readdirSync(defaultClientFolder).find((name) => /^main-[A-Z0-9]{8,}\.js$/.test(name));
      expect(script, 'the built main script').to.be.a('string');
      const response = await request(app()).get(`/${script}`).set('Accept-Encoding', 'br');
      expect(response.headers['content-encoding']).to.equal('br');
      expect(response.headers['cache-control']).to.equal(immutable);
      const page = await request(app()).get('/index.html').set('Accept-Encoding', 'br');
      expect(page.headers['cache-control']).to.equal('no-cache');
      expect(page.headers['content-encoding']).to.equal('br');
    });
  });
});
