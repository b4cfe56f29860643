import { createHash } from 'node:crypto';
import { expect } from 'chai';
import { readReceivedMessage } from '../../../server/mail/received-message';

describe('received mail decoding', () => {
  it('joins quoted-printable soft line breaks and decodes =XX bytes as UTF-8', async () => {
    const raw =
      'Subject: =?UTF-8?Q?Pond_pump_=E2=80=93_reset?=\r\nContent-Type: text/plain; charset=utf-8\r\nContent-Transfer-Encoding: quoted-printable\r\n\r\nhttp://riffle.example.test/accounts/reset-password?token=3Drfl_abc=\r\ndef\r\nCaf=C3=A9 =3D 1\r\n';
    const message = await readReceivedMessage(Buffer.from(raw));
    expect(message.text).to.equal('http://riffle.example.test/accounts/reset-password?token=rfl_abcdef\nCafé = 1');
    expect(message.subject).to.equal('Pond pump – reset');
  });

  it('takes the text part of a multipart message, decoding base64', async () => {
    const body = Buffer.from('Open this link: http://x.test/?token=rfl_1').toString('base64');
    const raw = `Content-Type: multipart/alternative; boundary="b1"\r\n\r\n--b1\r\nContent-Type: text/html\r\n\r\n<p>html</p>\r\n--b1\r\nContent-Type: text/plain\r\nContent-Transfer-Encoding: base64\r\n\r\n${body}\r\n--b1--\r\n`;
    expect((await readReceivedMessage(Buffer.from(raw))).text).to.equal('Open this link: http://x.test/?token=rfl_1');
  });

  it('lists an attachment with its name, type, decoded size and the sha-256 of its decoded bytes', async () => {
    const bytes = Buffer.from(Array.from({ length: 300 }, (_, index) => index % 256));
    const raw =
      'Subject: Proposal\r\nContent-Type: multipart/mixed; boundary="m1"\r\n\r\n' +
      '--m1\r\nContent-Type: text/plain\r\n\r\nAttached.\r\n' +
      '--m1\r\nContent-Type: application/pdf\r\nContent-Disposition: attachment; filename="proposal-pond-2026-12-03.pdf"\r\n' +
      `Content-Transfer-Encoding: base64\r\n\r\n${bytes.toString('base64').replace(/.{76}/g, '$&\r\n')}\r\n--m1--\r\n`;
    const message = await readReceivedMessage(Buffer.from(raw));
    expect(message.text).to.equal('Attached.');
    expect(message.attachments).to.deep.equal([
      {
        filename: 'proposal-pond-2026-12-03.pdf',
        contentType: 'application/pdf',
        size: 300,
        sha256: createHash('sha256').update(bytes).digest('hex'),
      },
    ]);
    const plain = await readReceivedMessage(Buffer.from('Subject: x\r\n\r\nno parts\r\n'));
    expect(plain.attachments).to.deep.equal([]);
  });
});
