/**
 * RFC 4180 CSV records from lines: fields separated by commas, quoted with double quotes (a
 * quoted field may hold commas, quotes written twice, and line breaks). Each record carries the
 * line it starts on.
 */
export async function* parseCsvRecords(
  lines: AsyncIterable<{ line: number; text: string; eol?: string } | { line: number; error: string }>,
): AsyncGenerator<{ line: number; fields: string[] } | { line: number; error: string; fatal: boolean }> {
  let fields: string[] = [];
  let field = '';
  let quoted = false;
  let start = 0;
  let inRecord = false;
  let lastEol = '\n';
  for await (const entry of lines) {
    if ('error' in entry) {
      yield { line: entry.line, error: entry.error, fatal: true };
      return;
    }
    const text = entry.text;
    const eol = entry.eol ?? '\n';
    if (!inRecord) {
      start = entry.line;
      fields = [];
      field = '';
      inRecord = true;
    } else field += lastEol; // a quoted field keeps its line break as written
    for (let i = 0; i < text.length; i++) {
      const c = text[i];
      if (quoted) {
        if (c === '"') {
          if (text[i + 1] === '"') {
            field += '"';
            i++;
          } else quoted = false;
        } else field += c;
      } else if (c === '"' && field === '') quoted = true;
      else if (c === ',') {
        fields.push(field);
        field = '';
      } else field += c;
    }
    lastEol = eol;
    if (quoted) continue; // the quoted field goes on to the next line
    fields.push(field);
    inRecord = false;
    yield { line: start, fields };
  }
  if (inRecord && quoted) yield { line: start, error: 'has a quoted field that is never closed — check the quotes on this row', fatal: false };
}
