/**
 * Reads the parts of a plain-text message that the outbox shows: Subject
 * (RFC 2047 encoded words decoded) and the body (quoted-printable or base64
 * decoded). Multipart messages keep their first text/plain part.
 */
export function readMessage(raw: string): { subject: string; text: string } {
  const split = raw.search(/\r?\n\r?\n/);
  const head = split < 0 ? raw : raw.slice(0, split);
  let body = split < 0 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const headers = parseHeaders(head);
  const type = headers['content-type'] ?? 'text/plain';
  const boundary = /boundary="?([^";]+)"?/i.exec(type)?.[1];
  let encoding = headers['content-transfer-encoding'] ?? '7bit';
  if (/^multipart\//i.test(type) && boundary) {
    const parts = body.split(`--${boundary}`).slice(1);
    const textPart = parts.map((p) => readMessagePart(p)).find((p) => /^text\/plain/i.test(p.type));
    body = textPart?.body ?? '';
    encoding = textPart?.encoding ?? '7bit';
  }
  return { subject: decodeWords(headers.subject ?? ''), text: decodeBody(body, encoding).replace(/\r\n/g, '\n').trimEnd() };
}

function readMessagePart(part: string): { type: string; encoding: string; body: string } {
  const split = part.search(/\r?\n\r?\n/);
  const headers = parseHeaders(split < 0 ? part : part.slice(0, split));
  return {
    type: headers['content-type'] ?? 'text/plain',
    encoding: headers['content-transfer-encoding'] ?? '7bit',
    body: split < 0 ? '' : part.slice(split).replace(/^\r?\n\r?\n/, ''),
  };
}

function parseHeaders(head: string): Record<string, string> {
  const out: Record<string, string> = {};
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  for (const line of unfolded.split(/\r?\n/)) {
    const i = line.indexOf(':');
    if (i > 0) out[line.slice(0, i).trim().toLowerCase()] ??= line.slice(i + 1).trim();
  }
  return out;
}

function decodeBody(body: string, encoding: string): string {
  const e = encoding.toLowerCase();
  if (e === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (e === 'quoted-printable') return decodeQuotedPrintable(body);
  return body;
}

export function decodeQuotedPrintable(s: string): string {
  const joined = s.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i += 1) {
    const c = joined[i];
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(joined.slice(i + 1, i + 3))) {
      bytes.push(parseInt(joined.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(c, 'utf8'));
    }
  }
  return Buffer.from(bytes).toString('utf8');
}

function decodeWords(s: string): string {
  return s
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_m, _charset, enc: string, data: string) =>
      enc.toUpperCase() === 'B'
        ? Buffer.from(data, 'base64').toString('utf8')
        : decodeQuotedPrintable(data.replace(/_/g, ' ')),
    );
}
