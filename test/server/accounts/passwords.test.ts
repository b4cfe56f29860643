import { expect } from 'chai';
import { hashPassword, passwordWeakness, verifyPassword } from '../../../server/accounts/passwords';

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

describe('reading received mail (RFC 2045 and 2047)', () => {});
