import { expect } from 'chai';
import { ConfigError, loadConfig } from '../../server/config';

describe('configuration from the environment', () => {
  it('has working defaults: loopback, port 8080, database port 3307, demo mode outside production', () => {
    const config = loadConfig({});
    expect(config).to.deep.include({ mode: 'development', demo: true, httpHost: '127.0.0.1', httpPort: 8080 });
    expect(config.database.port).to.equal(3307);
  });

  it('takes PORT and RIFFLE_DB_PORT', () => {
    const config = loadConfig({ PORT: '9090', RIFFLE_DB_PORT: '3400' });
    expect([config.httpPort, config.database.port]).to.deep.equal([9090, 3400]);
  });

  for (const [name, value] of [
    ['PORT', 'eighty'],
    ['PORT', '70000'],
    ['RIFFLE_DB_PORT', '-1'],
    ['NODE_ENV', 'staging'],
    ['RIFFLE_LOG_LEVEL', 'loud'],
  ]) {
    it(`refuses ${name}=${value} with a message naming the variable`, () => {
      expect(() => loadConfig({ [name]: value })).to.throw(ConfigError, name);
    });
  }

  it('never runs demo mode in production', () => {
    expect(loadConfig({ NODE_ENV: 'production' }).demo).to.equal(false);
    expect(() => loadConfig({ NODE_ENV: 'production', RIFFLE_DEMO: 'yes' })).to.throw(ConfigError, 'production');
  });

  it('trusts no proxy unless RIFFLE_TRUSTED_PROXIES lists some', () => {
    expect(loadConfig({}).trustedProxies).to.deep.equal([]);
    expect(
      loadConfig({ RIFFLE_TRUSTED_PROXIES: '127.0.0.1, 10.0.0.0/8,fd00::/8,loopback' }).trustedProxies,
    ).to.deep.equal(['127.0.0.1', '10.0.0.0/8', 'fd00::/8', 'loopback']);
  });

  for (const value of ['proxy.example', '10.0.0.0/33', '300.1.1.1', '10.0.0.1/8/1']) {
    it(`refuses RIFFLE_TRUSTED_PROXIES=${value}`, () => {
      expect(() => loadConfig({ RIFFLE_TRUSTED_PROXIES: value })).to.throw(ConfigError, 'RIFFLE_TRUSTED_PROXIES');
    });
  }
});
