import { expect } from 'chai';
import { hashPassword, passwordWeakness, verifyPassword } from '../../../server/accounts/passwords';
import { decodeEncodedWords, parsePlainMessage } from '../../../server/mail/mime-text';

describe('passwords', () => {
  for (const [password, reason] of [
    ['nine-char', /at least 10/],
    ['x'.repeat(201), /at most 200/],
    ['Password123', /most common/],
    ['qwertyuiop', /most common/],
    ['abababababab', /too few characters/],
    ['robin.fenwick-pumps', /e-mail address/],
  ] as const) {
    it(`refuses ${password.length > 30 ? 'a 201-character password' : `"${password}"`}`, () => {
      expect(passwordWeakness(password, 'Robin.Fenwick@example.test')).to.match(reason);
    });
  }

  it('accepts a passphrase, and the demo password', () => {
    expect(passwordWeakness('weir and gravel bed', 'robin@example.test')).to.equal(undefined);
    expect(passwordWeakness('riffle-demo', 'designer@riffle.test')).to.equal(undefined);
  });

  it('hashes with argon2id, a fresh salt each time, and verifies only the right password', async () => {
    const [first, second] = await Promise.all([
      hashPassword('weir and gravel bed'),
      hashPassword('weir and gravel bed'),
    ]);
    expect(first).to.match(/^\$argon2id\$/);
    expect(first).not.to.equal(second);
    expect(await verifyPassword(first, 'weir and gravel bed')).to.equal(true);
    expect(await verifyPassword(first, 'weir and gravel bee')).to.equal(false);
    expect(await verifyPassword(undefined, 'weir and gravel bed')).to.equal(false);
    expect(await verifyPassword('not a hash', 'weir and gravel bed')).to.equal(false);
  });
});

describe('reading received mail (RFC 2045 and 2047)', () => {
  it('joins quoted-printable soft line breaks and decodes =XX bytes as UTF-8', () => {
    const raw =
      'Subject: =?UTF-8?Q?Pond_pump_=E2=80=93_reset?=\r\nContent-Type: text/plain; charset=utf-8\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\nhttp://riffle.example.test/accounts/reset-password?token=3Drfl_abc=\r\ndef\r\nCaf=C3=A9 =3D 1\r\n';
    const message = parsePlainMessage(raw);
    expect(message.text).to.equal('http://riffle.example.test/accounts/reset-password?token=rfl_abcdef\nCafé = 1');
    expect(decodeEncodedWords(message.headers.get('subject')!)).to.equal('Pond pump – reset');
  });

  it('takes the text part of a multipart message, decoding base64', () => {
    const body = Buffer.from('Open this link: http://x.test/?token=rfl_1').toString('base64');
    const raw = `Content-Type: multipart/alternative; boundary="b1"\r\n\r\n--b1\r\nContent-Type: text/html\r\n\r\n<p>html</p>\r\n--b1\r\nContent-Type: text/plain\r\nContent-Transfer-Encoding: base64\r\n\r\n${body}\r\n--b1--\r\n`;
    expect(parsePlainMessage(raw).text).to.equal('Open this link: http://x.test/?token=rfl_1');
  });
});
