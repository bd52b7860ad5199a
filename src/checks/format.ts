import { isWord } from '../text/analyze.ts';
import { defineCheck, type Span } from './define-check.ts';

/** Function words an answer does not end on. */
const DANGLING = new Set(['and', 'or', 'but', 'the', 'a', 'an', 'to', 'of', 'with', 'then', 'for', 'in', 'on', 'at', 'if', 'because', 'so', 'that', 'which', 'your', 'my', 'is', 'are']);
const TERMINAL = /[.!?…:;)"'»”’\]}`*_~]$|\p{Extended_Pictographic}$/u;
const OPENERS: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
const CLOSERS: Record<string, string> = { ')': '(', ']': '[', '}': '{' };

/**
 * Structure: a truncated ending (no closing punctuation and a dangling word, or a trailing
 * comma), unbalanced code fences, brackets outside code and double quotes, and a length outside
 * the rubric's range. List items and code blocks may end without punctuation.
 */
export const format = defineCheck<{ minChars: number; maxChars: number }>({
  meta: {
    id: 'format',
    description: 'Truncated endings, unbalanced code fences, brackets and quotes, and length outside the allowed range.',
    params: {
      minChars: { type: 'integer', default: 1, min: 0, max: 1_000_000, description: 'Shortest acceptable response, in characters.' },
      maxChars: { type: 'integer', default: 8000, min: 1, max: 10_000_000, description: 'Longest acceptable response, in characters.' },
    },
    messages: {
      truncated: 'ends mid-sentence: "{ending}" — the response may have been cut off',
      'unclosed-fence': 'a code block opened here is never closed',
      'unclosed-bracket': '"{bracket}" is never closed',
      'unmatched-closer': '"{bracket}" closes nothing',
      'unbalanced-quotes': 'an odd number of double quotes: one is never closed',
      'too-long': '{chars} characters, over the limit of {max}',
      'too-short': '{chars} characters, under the minimum of {min}',
    },
  },
  evaluate(doc, params, report) {
    const text = doc.text;
    const trimmedEnd = text.trimEnd().length;
    let problems = 0;
    const words = doc.wordTokens;
    const lastLine = text.slice(0, trimmedEnd).split(/\r?\n/).at(-1) ?? '';
    const inList = /^\s*([-*•]|\d+[.)])\s/.test(lastLine);
    const last = words.at(-1);
    if (last && words.length >= 3 && !TERMINAL.test(text.slice(0, trimmedEnd))) {
      const trailingComma = /,\s*$/.test(text.slice(0, trimmedEnd));
      const listItem = inList && !DANGLING.has(last.lower);
      if (!listItem && (trailingComma || DANGLING.has(last.lower))) {
        report('truncated', { start: last.start, end: trimmedEnd }, { ending: text.slice(Math.max(0, last.start - 20), trimmedEnd).replace(/\s+/g, ' ') });
        problems++;
      }
    }
    // code fences and the code they hold
    const code: Span[] = [];
    let open: Span | null = null;
    for (const m of text.matchAll(/^[ \t]*(```|~~~)/gm)) {
      const span = { start: m.index! + m[0].length - 3, end: m.index! + m[0].length };
      if (open) {
        code.push({ start: open.start, end: span.end });
        open = null;
      } else open = span;
    }
    if (open) {
      report('unclosed-fence', open);
      code.push({ start: open.start, end: text.length });
      problems++;
    }
    const inCode = (i: number) => code.some((c) => i >= c.start && i < c.end);
    const stack: { ch: string; at: number }[] = [];
    for (const m of text.matchAll(/[()[\]{}]/g)) {
      const i = m.index!;
      const ch = m[0];
      if (inCode(i)) continue;
      if (ch in OPENERS) stack.push({ ch, at: i });
      else if (stack.at(-1)?.ch === CLOSERS[ch]) stack.pop();
      else if (!/[\d:;=8xX^]$/.test(text.slice(Math.max(0, i - 1), i)) && !/(^|\n)\s*\w{1,2}$/.test(text.slice(Math.max(0, i - 4), i))) {
        report('unmatched-closer', { start: i, end: i + 1 }, { bracket: ch });
        problems++;
      }
    }
    for (const s of stack) {
      report('unclosed-bracket', { start: s.at, end: s.at + 1 }, { bracket: s.ch });
      problems++;
    }
    const quotes = [...text.matchAll(/"/g)].map((m) => m.index!).filter((i) => !inCode(i));
    if (quotes.length % 2 === 1) {
      report('unbalanced-quotes', { start: quotes.at(-1)!, end: quotes.at(-1)! + 1 });
      problems++;
    }
    const chars = text.length;
    if (chars > params.maxChars) {
      report('too-long', { start: params.maxChars, end: chars }, { chars, max: params.maxChars });
      problems++;
    } else if (trimmedEnd < params.minChars) {
      report('too-short', { start: 0, end: chars }, { chars: trimmedEnd, min: params.minChars });
      problems++;
    }
    return { metrics: { characters: chars, code_blocks: code.length, problems }, value: 1 - problems / 3 };
  },
});
