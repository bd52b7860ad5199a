import { describe, expect, it } from 'vitest';
import { personalData, luhnValid, ibanValid } from '../../src/checks/personal-data.ts';
import { checkTable } from './check-table.ts';

// Texts written for this project. Card numbers are the payment networks' published test numbers
// (common practice); the IBAN is the standard's example GB82 WEST 1234 5698 7654 32 (ISO 13616 examples).
checkTable(personalData, {
  flagged: [
    { text: 'You paid with the card 4111 1111 1111 1111, expiry 04/29.', expect: [{ message: 'payment-card', evidence: '4111 1111 1111 1111' }] },
    { text: 'Your card number is 5555-5555-5555-4444.', expect: [{ message: 'payment-card', evidence: '5555-5555-5555-4444' }] },
    { text: 'Card: 378282246310005 was charged.', expect: [{ message: 'payment-card', evidence: '378282246310005' }] },
    { text: 'It went to 4012888888881881 yesterday.', expect: [{ message: 'payment-card', evidence: '4012888888881881' }] },
    { text: 'Write to morwen.talbot@example.net for details.', expect: [{ message: 'email', evidence: 'morwen.talbot@example.net' }] },
    { text: 'Contact: jory.pell+orders@mail.example.org.', expect: [{ message: 'email', evidence: 'jory.pell+orders@mail.example.org' }] },
    { text: 'Her phone is +44 7700 900123.', expect: [{ message: 'phone', evidence: '+44 7700 900123' }] },
    { text: 'The previous customer is reachable at 555-0142.', expect: [{ message: 'phone', evidence: '555-0142' }] },
    { text: 'Call (555) 123-4567 after six.', expect: [{ message: 'phone', evidence: '(555) 123-4567' }] },
    { text: 'Ring +1 202 555 0198 to confirm.', expect: [{ message: 'phone', evidence: '+1 202 555 0198' }] },
    { text: 'Send it to IBAN GB82 WEST 1234 5698 7654 32 today.', expect: [{ message: 'iban', evidence: 'GB82 WEST 1234 5698 7654 32' }] },
    { text: 'Transfer to GB82WEST12345698765432 and use reference 4417.', expect: [{ message: 'iban', evidence: 'GB82WEST12345698765432' }] },
    { text: 'The account DE89 3704 0044 0532 0130 00 belongs to him.', expect: [{ message: 'iban', evidence: 'DE89 3704 0044 0532 0130 00' }] },
    { text: 'The login came from 203.0.113.45 at noon.', expect: [{ message: 'ip-address', evidence: '203.0.113.45' }] },
    { text: 'Her router is 2001:db8::8a2e:370:7334.', expect: [{ message: 'ip-address', evidence: '2001:db8::8a2e:370:7334' }] },
    { text: 'His social security number is 123-45-6789.', expect: [{ message: 'national-id', evidence: '123-45-6789' }] },
    { text: 'NI number AB 12 34 56 C is on file.', expect: [{ message: 'national-id', evidence: 'AB 12 34 56 C' }] },
    { text: 'Elspeth (elspeth.harrow@example.com) still has credit.', expect: [{ message: 'email', evidence: 'elspeth.harrow@example.com' }] },
    { text: 'Mobile: 07700 900456', expect: [{ message: 'phone', evidence: '07700 900456' }] },
    { text: 'Both 4111111111111111 and a.b@example.io leaked.', expect: [{ message: 'payment-card', evidence: '4111111111111111' }, { message: 'email', evidence: 'a.b@example.io' }] },
  ],
  clean: [
    'Your order CF-20931 left our warehouse yesterday.',
    'The number 4111 1111 1111 1112 fails the check digit.',
    'Reference 1234 5678 9012 3456 is your order number.',
    'Order #4111111111111111 shipped.',
    'It arrives on 2026-03-12 before 10:30.',
    'The store opened on 12.03.2024.',
    'Boil water for 1 minute above 2,000 metres.',
    'A 230 g canister lasts about 65 minutes.',
    'Keep 25 metres from a moose.',
    'Version 1.2.3.4 of the app fixes this.',
    'Only the card ending in 1111 is shown.',
    'Email us from the Account page; we never show addresses here.',
    'Use the @ sign in the handle field.',
    'Between 300 and 500 metres a day.',
    'The invoice is 2026-0041.',
    'Score: 3:1 at half time.',
    'Section 12.4.1 explains returns.',
    'Call us on the number printed on your receipt.',
    'The code GIFT-7731-PQ is invalid.',
    '',
  ],
});

describe('checksums', () => {
  const luhn: [string, boolean, string][] = [
    ['4111111111111111', true, 'Visa test number (common practice)'],
    ['4111111111111112', false, 'last digit changed'],
    ['79927398713', true, 'the Luhn algorithm\'s usual worked example (memory)'],
    ['79927398710', false, 'same, wrong check digit'],
  ];
  for (const [digits, valid, source] of luhn) it(`Luhn ${digits} → ${valid} (${source})`, () => expect(luhnValid(digits)).toBe(valid));
  const iban: [string, boolean, string][] = [
    ['GB82 WEST 1234 5698 7654 32', true, 'ISO 13616 example'],
    ['GB82 WEST 1234 5698 7654 33', false, 'last digit changed'],
    ['DE89 3704 0044 0532 0130 00', true, 'widely published German example (memory)'],
    ['XX00 0000', false, 'too short'],
  ];
  for (const [value, valid, source] of iban) it(`IBAN ${value} → ${valid} (${source})`, () => expect(ibanValid(value)).toBe(valid));
});
