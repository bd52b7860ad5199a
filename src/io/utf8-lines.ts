import type { Readable } from 'node:stream';

/**
 * Lines of a byte stream, decoded as strict UTF-8 (a bad byte is reported, not replaced). Each
 * line comes without its break; `eol` is the break as written ("\r\n", "\n", or "" at the end).
 */
export async function* utf8Lines(input: Readable): AsyncGenerator<{ line: number; text: string; eol: string } | { line: number; error: string }> {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let pending = '';
  let line = 1;
  let bad = false;
  for await (const chunk of input) {
    let text: string;
    try {
      text = decoder.decode(chunk as Buffer, { stream: true });
    } catch {
      const bytes = chunk as Buffer;
      const invalidAt = firstInvalidByte(bytes);
      let newlines = pending.match(/\n/g)?.length ?? 0;
      for (let i = 0; i < invalidAt; i++) if (bytes[i] === 0x0a) newlines++;
      yield { line: line + newlines, error: 'is not valid UTF-8 — save the file as UTF-8 and import it again' };
      bad = true;
      break;
    }
    pending += text;
    let at: number;
    while ((at = pending.indexOf('\n')) >= 0) {
      const crlf = at > 0 && pending[at - 1] === '\r';
      yield { line, text: pending.slice(0, crlf ? at - 1 : at), eol: crlf ? '\r\n' : '\n' };
      pending = pending.slice(at + 1);
      line++;
    }
  }
  if (!bad && pending.length) yield { line, text: pending.replace(/\r$/, ''), eol: '' };
}


/** Offset of the first byte that starts an invalid UTF-8 sequence (RFC 3629), or the length. */
export function firstInvalidByte(bytes: Uint8Array): number {
  const cont = (i: number, lo = 0x80, hi = 0xbf) => i < bytes.length && bytes[i] >= lo && bytes[i] <= hi;
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    let size = 0;
    if (b < 0x80) size = 1;
    else if (b >= 0xc2 && b <= 0xdf) size = cont(i + 1) ? 2 : 0;
    else if (b === 0xe0) size = cont(i + 1, 0xa0) && cont(i + 2) ? 3 : 0;
    else if ((b >= 0xe1 && b <= 0xec) || b === 0xee || b === 0xef) size = cont(i + 1) && cont(i + 2) ? 3 : 0;
    else if (b === 0xed) size = cont(i + 1, 0x80, 0x9f) && cont(i + 2) ? 3 : 0;
    else if (b === 0xf0) size = cont(i + 1, 0x90) && cont(i + 2) && cont(i + 3) ? 4 : 0;
    else if (b >= 0xf1 && b <= 0xf3) size = cont(i + 1) && cont(i + 2) && cont(i + 3) ? 4 : 0;
    else if (b === 0xf4) size = cont(i + 1, 0x80, 0x8f) && cont(i + 2) && cont(i + 3) ? 4 : 0;
    if (!size) return i;
    i += size;
  }
  return bytes.length;
}
