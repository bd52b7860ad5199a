import { isIPv6 } from 'node:net';
import { defineCheck, type Report } from './define-check.ts';

/** Luhn checksum (ISO/IEC 7812): true when the digits pass. */
export function luhnValid(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = digits.charCodeAt(digits.length - 1 - i) - 48;
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return digits.length > 0 && sum % 10 === 0;
}

/** IBAN check (ISO 13616): first four characters moved to the end, letters → 10–35, mod 97 = 1. */
export function ibanValid(iban: string): boolean {
  const compact = iban.replace(/\s+/g, '').toUpperCase();
  if (!/^[A-Z]{2}\d{2}[A-Z0-9]{11,30}$/.test(compact)) return false;
  const moved = compact.slice(4) + compact.slice(0, 4);
  let remainder = 0;
  for (const ch of moved) {
    const code = ch.charCodeAt(0);
    const value = code >= 65 ? String(code - 55) : ch;
    for (const digit of value) remainder = (remainder * 10 + Number(digit)) % 97;
  }
  return remainder === 1;
}

/** Shows the first and last characters and hides the rest, for display. */
export function mask(text: string, keepEnd = 4): string {
  const visible = text.slice(-keepEnd);
  return `${'•'.repeat(Math.max(0, text.length - keepEnd))}${visible}`;
}

const PHONE_WORDS = /\b(phone|call|ring|tel|mobile|cell|whatsapp|reachable|reach|contact|number|fax)\b(?:\s+(?:me|us|him|her|them))?(?:\s+(?:at|on|is))?\W{0,5}$/i;
const ID_PREFIX = /([A-Za-z]{1,4}[-#]|order\s*|ref(?:erence)?\s*|invoice\s*|no\.\s*|#)$/i;
const DATE_SHAPE = /^(\d{4}[-./]\d{1,2}[-./]\d{1,2}|\d{1,2}[-./]\d{1,2}[-./]\d{2,4})$/;

function scanEmails(text: string, report: Report, found: Record<string, number>) {
  let at = text.indexOf('@');
  while (at !== -1) {
    let s = at;
    while (s > 0 && /[A-Za-z0-9._%+-]/.test(text[s - 1])) s--;
    let e = at + 1;
    while (e < text.length && /[A-Za-z0-9.-]/.test(text[e])) e++;
    while (e > at + 1 && text[e - 1] === '.') e--;
    const domain = text.slice(at + 1, e);
    if (s < at && /^[A-Za-z0-9-]+(\.[A-Za-z0-9-]+)*\.[A-Za-z]{2,}$/.test(domain)) {
      report('email', { start: s, end: e }, { masked: `${text[s]}•••@${domain}` });
      found.email++;
    }
    at = text.indexOf('@', Math.max(e, at + 1));
  }
}

/** Digit runs with separators: candidate cards, phone numbers and national ids. */
function scanDigitRuns(text: string, report: Report, found: Record<string, number>) {
  const run = /\+?\(?\d[\d\s().-]*\d/g;
  for (const m of text.matchAll(run)) {
    let raw = m[0];
    // a run never continues across a line break or into a following word
    const cut = raw.search(/[\r\n]/);
    if (cut > 0) raw = raw.slice(0, cut).replace(/[\s().-]+$/, '');
    const start = m.index!;
    const end = start + raw.length;
    if (/[\p{L}\p{N}]/u.test(text[start - 1] ?? '') || /[\p{L}]/u.test(text[end] ?? '')) continue;
    const digits = raw.replace(/\D/g, '');
    const before = text.slice(Math.max(0, start - 30), start);
    if (DATE_SHAPE.test(raw) || /^\d{1,2}:\d{2}/.test(raw)) continue;
    if (/^\d{3}-\d{2}-\d{4}$/.test(raw) && !/^(000|666|9)/.test(raw) && !/-00-|-0000$/.test(raw)) {
      report('national-id', { start, end }, { kind: 'US social security number', masked: mask(raw) });
      found.national_id++;
      continue;
    }
    const cardShape = /^\d{4}([ -]?\d{3,4}){2,4}$|^\d{13,19}$/.test(raw);
    if (digits.length >= 13 && digits.length <= 19 && cardShape && !ID_PREFIX.test(before)) {
      if (luhnValid(digits)) {
        report('payment-card', { start, end }, { masked: mask(digits) });
        found.payment_card++;
      }
      continue;
    }
    const plus = raw.startsWith('+');
    const phoneShape = /^\+?[\d\s().-]+$/.test(raw) && /[\s().-]/.test(raw);
    if (digits.length >= 7 && digits.length <= 15 && (plus || (phoneShape && PHONE_WORDS.test(before)) || /^\(\d{2,5}\)/.test(raw)) && !ID_PREFIX.test(before)) {
      report('phone', { start, end }, { masked: mask(raw) });
      found.phone++;
    }
  }
}

function scanIbans(text: string, report: Report, found: Record<string, number>) {
  for (const m of text.matchAll(/\b[A-Z]{2}\d{2}(?: ?[A-Z0-9]{4}){2,7}(?: ?[A-Z0-9]{1,4})?\b/g)) {
    if (ibanValid(m[0])) {
      report('iban', { start: m.index!, end: m.index! + m[0].length }, { masked: mask(m[0].replace(/\s/g, '')) });
      found.iban++;
    }
  }
}

function scanNetwork(text: string, report: Report, found: Record<string, number>) {
  // cheap tests first: most texts hold no dotted digits and no two colons, and these patterns are slow to try everywhere
  if (/\d\.\d/.test(text)) for (const m of text.matchAll(/(?<![\d.])(\d{1,3})\.(\d{1,3})\.(\d{1,3})\.(\d{1,3})(?![\d.]*\d)/g)) {
    const before = text.slice(Math.max(0, m.index! - 10), m.index!);
    if (m.slice(1).every((o) => Number(o) <= 255) && !/(version|v|ver\.?)\s*$/i.test(before)) {
      report('ip-address', { start: m.index!, end: m.index! + m[0].length }, { masked: mask(m[0], 3) });
      found.ip_address++;
    }
  }
  const firstColon = text.indexOf(':');
  if (firstColon >= 0 && text.indexOf(':', firstColon + 1) >= 0) for (const m of text.matchAll(/(?<![\w:])[0-9A-Fa-f]{0,4}(?::[0-9A-Fa-f]{0,4}){2,7}(?![\w:])/g)) {
    if (m[0].replace(/:/g, '').length >= 3 && isIPv6(m[0])) {
      report('ip-address', { start: m.index!, end: m.index! + m[0].length }, { masked: mask(m[0], 4) });
      found.ip_address++;
    }
  }
  for (const m of text.matchAll(/\b[A-CEGHJ-PR-TW-Z]{2} ?\d{2} ?\d{2} ?\d{2} ?[A-D]\b/g)) {
    report('national-id', { start: m.index!, end: m.index! + m[0].length }, { kind: 'UK National Insurance number', masked: mask(m[0], 2) });
    found.national_id++;
  }
}

/**
 * Personal data: e-mail addresses, phone numbers (E.164: at most 15 digits; a national number
 * needs a + sign, an area code in brackets, or a word such as "phone" or "call" before it),
 * payment cards (13–19 digits passing Luhn, ISO/IEC 7812), IBANs (ISO 13616 mod 97), IP
 * addresses and national id shapes (US SSN, UK NI number). Dates, clock times and order or
 * reference numbers are not flagged. Findings carry a masked form for display.
 */
export const personalData = defineCheck<Record<string, never>>({
  meta: {
    id: 'personal-data',
    description: 'E-mail addresses, phone numbers, payment cards (Luhn), IBANs (mod 97), IP addresses and national id numbers.',
    params: {},
    messages: {
      email: 'e-mail address {masked}',
      phone: 'phone number {masked}',
      'payment-card': 'payment card number {masked} (passes the Luhn check)',
      iban: 'bank account (IBAN) {masked}',
      'ip-address': 'IP address {masked}',
      'national-id': '{kind} {masked}',
    },
  },
  evaluate(doc, _params, report) {
    const found = { email: 0, phone: 0, payment_card: 0, iban: 0, ip_address: 0, national_id: 0 };
    scanEmails(doc.text, report, found);
    scanIbans(doc.text, report, found);
    scanDigitRuns(doc.text, report, found);
    scanNetwork(doc.text, report, found);
    const severe = found.payment_card + found.iban + found.national_id;
    const other = found.email + found.phone + found.ip_address;
    return { metrics: found, value: severe ? 0 : Math.max(0, 1 - 0.5 * other) };
  },
});
