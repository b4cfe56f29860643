import { expect } from 'chai';
import { ConfigError, loadConfig } from '../../../server/config';

describe('mail configuration', () => {
  it('sends to the loopback fake SMTP server, without TLS, when no relay is named', () => {
    const { mail, publicUrl } = loadConfig({ PORT: '9090' });
    expect(mail).to.deep.include({ fake: true, host: '127.0.0.1', port: 0, tls: 'none', user: '' });
    expect(publicUrl).to.equal('http://127.0.0.1:9090');
  });

  it('sends to a real relay unchanged, with STARTTLS by default and its credentials', () => {
    const { mail } = loadConfig({
      RIFFLE_SMTP_HOST: 'smtp.example.test',
      RIFFLE_SMTP_USER: 'riffle',
      RIFFLE_SMTP_PASSWORD: 's3cret',
      RIFFLE_MAIL_FROM: 'Riffle <pumps@example.test>',
    });
    expect(mail).to.deep.include({
      fake: false,
      host: 'smtp.example.test',
      port: 587,
      tls: 'starttls',
      user: 'riffle',
      password: 's3cret',
      from: 'Riffle <pumps@example.test>',
    });
    expect(
      loadConfig({ RIFFLE_SMTP_HOST: 'smtp.example.test', RIFFLE_SMTP_PORT: '465', RIFFLE_SMTP_TLS: 'implicit' }).mail,
    ).to.deep.include({ port: 465, tls: 'implicit' });
  });

  it('refuses an unknown TLS mode or port, naming the variable', () => {
    expect(() => loadConfig({ RIFFLE_SMTP_HOST: 'smtp.example.test', RIFFLE_SMTP_TLS: 'sometimes' })).to.throw(
      ConfigError,
      'RIFFLE_SMTP_TLS',
    );
    expect(() => loadConfig({ RIFFLE_SMTP_PORT: 'twenty-five' })).to.throw(ConfigError, 'RIFFLE_SMTP_PORT');
  });

  it('takes the public address for e-mailed links without a trailing slash', () => {
    expect(loadConfig({ RIFFLE_PUBLIC_URL: 'https://riffle.example.test/' }).publicUrl).to.equal(
      'https://riffle.example.test',
    );
  });
});
