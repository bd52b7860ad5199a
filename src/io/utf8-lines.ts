import type { Readable } from 'node:stream';

/** Lines of a byte stream, decoded as strict UTF-8 (a bad byte is reported, not replaced). */
export async function* utf8Lines(input: Readable): AsyncGenerator<{ line: number; text: string } | { line: number; error: string }> {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let pending = '';
  let line = 1;
  let bad = false;
  for await (const chunk of input) {
    let text: string;
    try {
      text = decoder.decode(chunk as Buffer, { stream: true });
    } catch {
      yield { line: line + (pending.match(/\n/g)?.length ?? 0), error: 'is not valid UTF-8 — save the file as UTF-8 and import it again' };
      bad = true;
      break;
    }
    pending += text;
    let at: number;
    while ((at = pending.indexOf('\n')) >= 0) {
      yield { line, text: pending.slice(0, at).replace(/\r$/, '') };
      pending = pending.slice(at + 1);
      line++;
    }
  }
  if (!bad && pending.length) yield { line, text: pending.replace(/\r$/, '') };
}

