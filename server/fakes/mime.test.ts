import nodemailer, { type SendMailOptions } from 'nodemailer';
import { describe, expect, it } from 'vitest';
import { parseMessage } from './mime.ts';

/** Builds a message exactly as nodemailer would send it (its stream transport writes the raw message). */
async function raw(message: SendMailOptions): Promise<string> {
  const transport = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' });
  const info = await transport.sendMail({ from: 'Tidefield <no-reply@tidefield.localhost>', ...message });
  return (info.message as Buffer).toString('utf8');
}

describe('parseMessage', () => {
  it('reads what nodemailer writes: encoded subject, both parts, quoted-printable with long lines', async () => {
    const long = `Ünïcode ✓ ${'word '.repeat(40)}https://example.org/accept-invitation?token=${'A'.repeat(43)}`;
    const parsed = await parseMessage(await raw({ to: 'Ada <Ada@Example.org>, b@example.org', subject: 'Receipt – 100 credits ✓', text: long, html: `<p>${long}</p>` }));
    expect(parsed.subject).toBe('Receipt – 100 credits ✓');
    expect(parsed.to).toEqual(['ada@example.org', 'b@example.org']);
    expect(parsed.text).toBe(long);
    expect(parsed.html).toBe(`<p>${long}</p>`);
  });

  it('reads base64 parts and plain single-part messages', async () => {
    const parsed = await parseMessage(await raw({ to: 'c@example.org', subject: 'Plain', text: 'just text', textEncoding: 'base64' }));
    expect(parsed).toMatchObject({ subject: 'Plain', text: 'just text', html: '' });
  });

  it('decodes RFC 2047 encoded words and keeps custom headers as sent', async () => {
    // RFC 2047 §8's rule: adjacent encoded words join without the space between them.
    const message = [
      'From: Tidefield <no-reply@tidefield.localhost>',
      'To: d@example.org',
      'Subject: =?UTF-8?B?w5xiZXI=?= =?UTF-8?Q?_alles?=',
      'X-Tidefield-Message: invitation',
      'Content-Type: text/plain; charset=utf-8',
      '',
      'body',
      '',
    ].join('\r\n');
    const parsed = await parseMessage(message);
    expect(parsed.subject).toBe('Über alles');
    expect(parsed.headers.get('x-tidefield-message')).toBe('invitation');
    expect(parsed.from).toBe('Tidefield <no-reply@tidefield.localhost>');
  });
});
