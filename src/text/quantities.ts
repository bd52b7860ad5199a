import type { Doc, Token } from './analyze.ts';
import { UNITS, type Unit } from './units.ts';
import { MONTHS, NUMBER_WORDS, RANGE_WORDS } from './word-lists.ts';

export type QuantityKind = 'number' | 'quantity' | 'percent' | 'money' | 'date' | 'time';

/** A number stated in the text, with its unit when it has one, and `[start, end)` offsets. */
export interface Quantity {
  start: number;
  end: number;
  text: string;
  kind: QuantityKind;
  /** The value as written (the low end of a range). */
  value: number;
  /** The high end of a range; equal to `value` otherwise. */
  high: number;
  unit: string | null;
  family: Unit['family'] | null;
  /** `value` and `high` in the family's base unit (seconds, metres, grams …). */
  base: number;
  baseHigh: number;
  sentence: number;
}

const GLUED = /^(\d+(?:[.,]\d+)?)([a-z%°]+)$/i;

/** A month name, with or without an abbreviation's full stop. */
/** Number words and their values, as a Map: an object's `in` would also find "constructor". */
const NUMBER_WORD_VALUES = new Map(Object.entries(NUMBER_WORDS));

function startsWithDigit(text: string): boolean {
  const c = text.charCodeAt(0);
  return c >= 48 && c <= 57;
}

function isMonth(t: Token | undefined): boolean {
  if (!t || t.kind !== 'word') return false;
  return MONTHS.has(t.lower) || (t.lower.endsWith('.') && MONTHS.has(t.lower.slice(0, -1)));
}

function numericValue(t: Token): number | null {
  if (t.kind === 'number') {
    const n = Number(t.text.includes(',') ? t.text.replace(/,(?=\d{3}\b)/g, '') : t.text);
    if (Number.isFinite(n)) return n;
    return null;
  }
  if (t.kind === 'word') return NUMBER_WORD_VALUES.get(t.lower) ?? null;
  return null;
}

function nextWord(tokens: Token[], i: number): Token | undefined {
  const t = tokens[i];
  return t && t.kind !== 'space' ? t : undefined;
}

/**
 * Finds numbers, quantities with units (ranges like "3 to 5 days" included), percentages,
 * money, dates and clock times. Numbers inside dates and times are not reported on their own.
 */
export function findQuantities(doc: Doc): Quantity[] {
  const { tokens } = doc;
  const out: Quantity[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    if (t.kind === 'number' && /^\d{1,2}:\d{2}$/.test(t.text)) {
      out.push(make(doc, i, i, 'time', hoursOf(t.text), null));
      continue;
    }
    if (isMonth(t)) {
      const date = dateAround(tokens, i);
      if (date) {
        out.push(make(doc, date[0], date[1], 'date', 0, null));
        i = date[1];
      }
      continue;
    }
    if (t.kind === 'number' && isMonth(tokens[i + 1])) continue; // the day of a date
    if (t.kind !== 'number' && !(t.kind === 'word' && (NUMBER_WORD_VALUES.has(t.lower) || startsWithDigit(t.lower)))) continue;
    let value = numericValue(t);
    let unitToken: Token | undefined;
    let unitName: string | null = null;
    if (value === null && t.kind === 'word') {
      const glued = t.text.match(GLUED);
      if (glued && UNITS.has(glued[2].toLowerCase())) {
        value = Number(glued[1].replace(',', '.'));
        unitName = glued[2].toLowerCase();
      }
    }
    if (value === null) continue;
    if (t.kind === 'word' && !unitName && !UNITS.has(nextWord(tokens, i + 1)?.lower ?? '')) continue; // bare "one" is no quantity
    let end = i;
    let high = value;
    // range: 3 to 5 days, 300-500 m
    const joiner = tokens[i + 1];
    const second = tokens[i + 2];
    if (!unitName && joiner && RANGE_WORDS.has(joiner.lower) && second && numericValue(second) !== null && second.sentence === t.sentence) {
      const secondValue = numericValue(second)!;
      if (secondValue >= value && UNITS.has(tokens[i + 3]?.lower ?? '')) {
        high = secondValue;
        end = i + 2;
      }
    }
    if (!unitName) {
      unitToken = tokens[end + 1];
      if (unitToken && UNITS.has(unitToken.lower) && unitToken.sentence === t.sentence) {
        unitName = unitToken.lower;
        end += 1;
      }
    }
    const before = tokens[i - 1];
    if (!unitName && before && (before.text === '$' || before.text === '€' || before.text === '£')) unitName = before.text;
    const unit = unitName ? UNITS.get(unitName)! : null;
    const kind: QuantityKind = !unit ? 'number' : unit.family === 'percent' ? 'percent' : unit.family === 'money' ? 'money' : 'quantity';
    const startIndex = unitName && before && unitName === before.text ? i - 1 : i;
    out.push(make(doc, startIndex, end, kind, value, unit, high, unitName));
    i = end;
  }
  return out;
}

function make(doc: Doc, first: number, last: number, kind: QuantityKind, value: number, unit: Unit | null, high = value, unitName: string | null = null): Quantity {
  const start = doc.tokens[first].start;
  const end = doc.tokens[last].end;
  const factor = unit?.factor ?? 1;
  return {
    start,
    end,
    text: doc.text.slice(start, end),
    kind,
    value,
    high,
    unit: unit ? unit.base : unitName,
    family: unit?.family ?? null,
    base: value * factor,
    baseHigh: high * factor,
    sentence: doc.tokens[first].sentence,
  };
}

function hoursOf(text: string): number {
  const [h, m] = text.split(':').map(Number);
  return h + m / 60;
}

/** "12 March 2024", "March 12", "March 2024": the token range of the date around a month name. */
function dateAround(tokens: Token[], i: number): [number, number] | null {
  const isDay = (t?: Token) => t?.kind === 'number' && /^\d{1,2}(st|nd|rd|th)?$/.test(t.text) && Number.parseInt(t.text, 10) <= 31;
  const isYear = (t?: Token) => t?.kind === 'number' && /^\d{4}$/.test(t.text);
  let first = i;
  let last = i;
  if (isDay(tokens[i - 1])) first = i - 1;
  if (isDay(tokens[i + 1])) last = i + 1;
  if (isYear(tokens[last + 1])) last += 1;
  else if (tokens[last + 1]?.text === ',' && isYear(tokens[last + 2])) last += 2;
  return first === i && last === i ? null : [first, last];
}
