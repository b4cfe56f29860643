import { expect } from 'chai';
import { Readable } from 'node:stream';
import { CurveTableDecoder } from '../../data-import/curve-table-stream';

/*
 * The decoder on its own, fed in pieces of every awkward size: characters of two, three and four
 * bytes (and UTF-16 surrogate pairs) cut between chunks must come out whole, and the first byte
 * that is not text must be found at its offset and line however the file was cut.
 */

const text = 'riffle-curve-table,1\nmodel_code,display_name\nA-1,Étang ✓ 😀 池\nA-1,\n';

async function decode(bytes: Buffer, chunkSize: number): Promise<{ output: string; decoder: CurveTableDecoder }> {
  const pieces: Buffer[] = [];
  for (let at = 0; at < bytes.length; at += chunkSize) pieces.push(bytes.subarray(at, at + chunkSize));
  const decoder = new CurveTableDecoder();
  const chunks: Buffer[] = [];
  for await (const chunk of Readable.from(pieces).pipe(decoder)) chunks.push(chunk as Buffer);
  return { output: Buffer.concat(chunks).toString('utf8'), decoder };
}

const utf16le = (value: string) => Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(value, 'utf16le')]);
const chunkSizes = [1, 2, 3, 5, 64 * 1024];

describe('curve-table decoding', () => {
  it('passes UTF-8 through unchanged, byte-order mark included, and transcodes UTF-16 LE and BE', async () => {
    const bom = Buffer.from([0xef, 0xbb, 0xbf]);
    for (const size of chunkSizes) {
      expect((await decode(Buffer.from(text), size)).output, `utf-8 in ${size}`).to.equal(text);
      const withBom = await decode(Buffer.concat([bom, Buffer.from(text)]), size);
      expect(withBom.output, `utf-8 with a BOM in ${size}`).to.equal(`\uFEFF${text}`);
      expect((await decode(utf16le(text), size)).output, `utf-16le in ${size}`).to.equal(text);
      const bigEndian = await decode(utf16le(text).swap16(), size);
      expect(bigEndian.output, `utf-16be in ${size}`).to.equal(text);
      expect(bigEndian.decoder.problem).to.equal(null);
    }
  });

  it('stops at a Latin-1 byte, naming its offset and line, however the file is cut', async () => {
    const bytes = Buffer.from(text.replace('✓ 😀 池', 'x'), 'latin1');
    const offset = bytes.indexOf(0xc9);
    for (const size of chunkSizes) {
      const { output, decoder } = await decode(bytes, size);
      expect(decoder.problem, `in ${size}`).to.deep.equal({
        byte: offset,
        line: 3,
        reason: 'byte 0xC9 is not UTF-8 text here',
      });
      expect(output).to.equal(bytes.subarray(0, offset).toString('utf8'));
    }
  });

  it('refuses a UTF-32 byte-order mark, a lone surrogate and a file cut inside a character', async () => {
    const utf32 = Buffer.concat([Buffer.from([0x00, 0x00, 0xfe, 0xff]), Buffer.from('\0\0\0r')]);
    expect((await decode(utf32, 1)).decoder.problem).to.deep.equal({
      byte: 0,
      line: 1,
      reason: 'the file starts with a UTF-32 byte-order mark',
    });
    const lone = utf16le('ab\nc\uDC00d');
    for (const size of chunkSizes) {
      expect((await decode(lone, size)).decoder.problem, `in ${size}`).to.deep.equal({
        byte: 10,
        line: 2,
        reason: 'the UTF-16 code unit 0xDC00 is a surrogate without its pair',
      });
    }
    const cut = Buffer.from('ab\n✓').subarray(0, 5);
    expect((await decode(cut, 2)).decoder.problem).to.deep.equal({
      byte: 3,
      line: 2,
      reason: 'the file ends inside a UTF-8 sequence',
    });
  });
});
