/**
 * A small MIME reader for the local SMTP stand-in: enough of RFC 2045–2047 to read the
 * messages nodemailer writes (headers with encoded words, multipart bodies, quoted-printable
 * and base64 parts, UTF-8). It is a development tool, not a general mail parser.
 */

export interface ParsedMessage {
  headers: Map<string, string>;
  subject: string;
  from: string;
  to: string[];
  text: string;
  html: string;
}

interface Part {
  headers: Map<string, string>;
  body: string;
}

/** Splits a header block from its body and unfolds continued header lines. */
function splitPart(raw: string): Part {
  const normalised = raw.replace(/\r\n/g, '\n');
  const end = normalised.indexOf('\n\n');
  const head = end === -1 ? normalised : normalised.slice(0, end);
  const body = end === -1 ? '' : normalised.slice(end + 2);
  const headers = new Map<string, string>();
  for (const line of head.replace(/\n[ \t]+/g, ' ').split('\n')) {
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    const name = line.slice(0, colon).trim().toLowerCase();
    if (!headers.has(name)) headers.set(name, line.slice(colon + 1).trim());
  }
  return { headers, body };
}

function bytesToText(bytes: Uint8Array, charset: string): string {
  try {
    return new TextDecoder(charset || 'utf-8').decode(bytes);
  } catch {
    return new TextDecoder('utf-8').decode(bytes);
  }
}

/** Quoted-printable (RFC 2045 §6.7) to bytes; `underscores` for the Q encoding of headers. */
function quotedPrintableBytes(input: string, underscores = false): Uint8Array {
  const source = (underscores ? input.replace(/_/g, ' ') : input).replace(/=\r?\n/g, '');
  const out: number[] = [];
  for (let i = 0; i < source.length; i++) {
    const c = source[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(source.slice(i + 1, i + 3))) {
      out.push(parseInt(source.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      out.push(...new TextEncoder().encode(c));
    }
  }
  return new Uint8Array(out);
}

/** RFC 2047 encoded words ("=?UTF-8?Q?Caf=C3=A9?="); adjacent words join without the space between. */
export function decodeHeader(value: string): string {
  return value
    .replace(/(\?=)\s+(=\?)/g, '$1$2')
    .replace(/=\?([^?]+)\?([bBqQ])\?([^?]*)\?=/g, (_m, charset: string, encoding: string, text: string) =>
      bytesToText(encoding.toUpperCase() === 'B' ? Buffer.from(text, 'base64') : quotedPrintableBytes(text, true), charset),
    );
}

function parameter(header: string | undefined, name: string): string | undefined {
  const match = header?.match(new RegExp(`${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i'));
  return match ? (match[1] ?? match[2]) : undefined;
}

function decodeBody(part: Part): string {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  const charset = parameter(part.headers.get('content-type'), 'charset') ?? 'utf-8';
  if (encoding === 'base64') return bytesToText(Buffer.from(part.body.replace(/\s+/g, ''), 'base64'), charset);
  if (encoding === 'quoted-printable') return bytesToText(quotedPrintableBytes(part.body), charset);
  return part.body;
}

/** Collects the first text/plain and text/html parts, walking nested multiparts. */
function collect(part: Part, found: { text?: string; html?: string }): void {
  const type = (part.headers.get('content-type') ?? 'text/plain').toLowerCase();
  if (type.startsWith('multipart/')) {
    const boundary = parameter(part.headers.get('content-type'), 'boundary');
    if (!boundary) return;
    const sections = part.body.split(`--${boundary}`);
    // The first section is the preamble; the one after the closing "--boundary--" the epilogue.
    for (const section of sections.slice(1)) {
      if (section.startsWith('--')) break;
      // The line break before a boundary belongs to the boundary (RFC 2046 §5.1.1).
      collect(splitPart(section.replace(/^\r?\n/, '').replace(/\r?\n$/, '')), found);
    }
    return;
  }
  if ((part.headers.get('content-disposition') ?? '').toLowerCase().startsWith('attachment')) return;
  if (type.startsWith('text/html')) found.html ??= decodeBody(part);
  else if (type.startsWith('text/plain')) found.text ??= decodeBody(part);
}

function addresses(value: string | undefined): string[] {
  if (!value) return [];
  return decodeHeader(value)
    .split(',')
    .map((a) => (a.match(/<([^>]+)>/)?.[1] ?? a).trim().toLowerCase())
    .filter(Boolean);
}

export function parseMessage(raw: string): ParsedMessage {
  const top = splitPart(raw);
  // The message's own final line break (before the SMTP end of data) is not part of a single-part body.
  if (!(top.headers.get('content-type') ?? '').toLowerCase().startsWith('multipart/')) top.body = top.body.replace(/\n$/, '');
  const found: { text?: string; html?: string } = {};
  collect(top, found);
  return {
    headers: top.headers,
    subject: decodeHeader(top.headers.get('subject') ?? ''),
    from: decodeHeader(top.headers.get('from') ?? ''),
    to: addresses(top.headers.get('to')),
    text: found.text ?? '',
    html: found.html ?? '',
  };
}
