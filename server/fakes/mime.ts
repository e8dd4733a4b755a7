import { simpleParser, type AddressObject } from 'mailparser';

/**
 * Reads a raw message for the local SMTP stand-in with mailparser (encoded words, multipart
 * bodies, quoted-printable and base64 parts, charsets): the fields the outbox shows, and the
 * raw header values (first occurrence, unfolded) keyed by lower-case name, as the outbox's
 * department filter reads them (e.g. `x-tidefield-department`).
 */
export interface ParsedMessage {
  headers: Map<string, string>;
  subject: string;
  from: string;
  to: string[];
  text: string;
  html: string;
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const groups = value === undefined ? [] : Array.isArray(value) ? value : [value];
  return groups.flatMap((group) => group.value.map((a) => (a.address ?? '').toLowerCase())).filter(Boolean);
}

export async function parseMessage(raw: string | Buffer): Promise<ParsedMessage> {
  const parsed = await simpleParser(raw, { skipImageLinks: true, skipTextToHtml: true, skipTextLinks: true });
  const headers = new Map<string, string>();
  for (const { key, line } of parsed.headerLines) {
    // `line` is the header as sent ("Name: value", possibly folded); keep the value, unfolded.
    if (!headers.has(key)) headers.set(key, line.slice(line.indexOf(':') + 1).replace(/\r?\n[ \t]+/g, ' ').trim());
  }
  return {
    headers,
    subject: parsed.subject ?? '',
    from: (parsed.from?.value ?? []).map((a) => (a.name ? `${a.name} <${a.address}>` : (a.address ?? ''))).join(', '),
    to: addresses(parsed.to),
    // mailparser keeps the line break that ends a single-part body; it belongs to the SMTP data's
    // end (RFC 5321 §4.1.1.4), not to the text the sender wrote.
    text: (parsed.text ?? '').replace(/\r?\n$/, ''),
    html: parsed.html || '',
  };
}
