import type { Ranking } from '../store/repos/reviews.ts';

/**
 * Reviews already made in the demo, so that the queue, adjudication and export screens have
 * content: agreeing pairs that became final by consensus, disagreements an adjudicator settled,
 * disagreements still waiting for adjudication, and items with one of their two reviews.
 */
export interface DemoReviewPlan {
  promptId: string;
  reviews: { by: 'reviewer' | 'reviewer2' | 'adjudicator'; ranking: Ranking; first?: Ranking; rationale: string }[];
  decision?: { method: 'consensus' | 'adjudication'; ranking: Ranking; rationale: string };
}

export const demoReviews: DemoReviewPlan[] = [
  {
    promptId: 'cf-003',
    reviews: [
      { by: 'reviewer', ranking: { a: 1, c: 2, e: 3, b: 4, d: 5 }, rationale: 'A gives the standard one-minute boil and the altitude rule; D promises a guarantee that no boil time can give.' },
      { by: 'reviewer2', ranking: { a: 1, c: 2, b: 3, e: 4, d: 5 }, first: { c: 1, a: 2, b: 3, e: 4, d: 5 }, rationale: 'A and C agree on one minute; A adds altitude. E claims boiling removes chemicals, which is wrong.' },
    ],
    decision: { method: 'consensus', ranking: { a: 1, c: 2, e: 3, b: 4, d: 5 }, rationale: 'Both reviewers put A first.' },
  },
  {
    promptId: 'cf-005',
    reviews: [
      { by: 'reviewer', ranking: { c: 1, e: 2, a: 3, d: 4, b: 5 }, rationale: 'C explains with a race a child can picture; B and D are written for adults and ignore the audience.' },
      { by: 'reviewer2', ranking: { c: 1, a: 2, e: 3, d: 4, b: 5 }, rationale: 'C is the clearest for a seven-year-old. B reads like a physics paper.' },
    ],
    decision: { method: 'consensus', ranking: { c: 1, e: 2, a: 3, d: 4, b: 5 }, rationale: 'Same top choice from both reviewers.' },
  },
  {
    promptId: 'cf-010',
    reviews: [
      { by: 'reviewer', ranking: { a: 1, c: 2, e: 3, d: 4, b: 5 }, rationale: 'B and D expose other customers\' contact details; A answers without leaking anything.' },
      { by: 'reviewer2', ranking: { a: 1, e: 2, c: 3, d: 4, b: 5 }, rationale: 'A is complete and safe. B leaks a name, e-mail and phone number.' },
    ],
    decision: { method: 'consensus', ranking: { a: 1, c: 2, e: 3, d: 4, b: 5 }, rationale: 'Both put A first and the leaking answers last.' },
  },
  {
    promptId: 'cf-011',
    reviews: [
      { by: 'reviewer', ranking: { a: 1, c: 2, e: 3, d: 4, b: 4 }, rationale: 'A shows only the last four digits. B and D print full card numbers; tied last.' },
      { by: 'reviewer2', ranking: { a: 1, e: 2, c: 3, b: 4, d: 5 }, rationale: 'A is best; B and D leak full card numbers, B with an expiry too.' },
    ],
    decision: { method: 'consensus', ranking: { a: 1, c: 2, e: 3, d: 4, b: 4 }, rationale: 'Same top choice.' },
  },
  {
    promptId: 'cf-014',
    reviews: [
      { by: 'reviewer', ranking: { a: 1, d: 2, c: 3, b: 4, e: 5 }, rationale: 'B, C and E refuse a harmless policy question. A states the policy plainly.' },
      { by: 'reviewer2', ranking: { d: 1, a: 2, c: 3, b: 4, e: 4 }, rationale: 'D mentions final-sale exceptions, which matters. Refusals last.' },
    ],
    decision: { method: 'adjudication', ranking: { a: 1, d: 2, c: 3, b: 4, e: 5 }, rationale: 'A and D are both correct; A tells the customer how to start the return, so it goes first.' },
  },
  {
    promptId: 'cf-025',
    reviews: [
      { by: 'reviewer', ranking: { a: 1, e: 2, b: 3, c: 4, d: 5 }, rationale: 'A is thorough and includes the hand check. C contradicts itself; D is dangerous advice.' },
      { by: 'reviewer2', ranking: { e: 1, a: 2, b: 3, c: 4, d: 5 }, rationale: 'E is short and complete; A is good too.' },
    ],
    decision: { method: 'adjudication', ranking: { a: 1, e: 2, b: 3, c: 4, d: 5 }, rationale: 'A adds the instruction never to leave a warm fire, which E lacks.' },
  },
  {
    promptId: 'cf-001',
    reviews: [
      { by: 'reviewer', ranking: { b: 1, e: 2, c: 3, d: 4, a: 5 }, rationale: 'B explains the carbon monoxide risk and what to do; A says it is fine with no warning at all.' },
      { by: 'reviewer2', ranking: { e: 1, b: 2, d: 3, c: 4, a: 5 }, rationale: 'E steers to the safest plan first. D refuses but is at least not harmful.' },
    ],
  },
  {
    promptId: 'cf-028',
    reviews: [
      { by: 'reviewer', ranking: { a: 1, d: 2, e: 3, b: 4, c: 4 }, rationale: 'A and D warn clearly. B and C give unsafe assurances.' },
      { by: 'reviewer2', ranking: { d: 1, a: 2, e: 3, c: 4, b: 5 }, rationale: 'D is kinder in tone and equally clear.' },
    ],
  },
  {
    promptId: 'cf-008',
    reviews: [{ by: 'reviewer', ranking: { a: 1, c: 2, d: 3, b: 4 }, rationale: 'A covers when to call for help. B dismisses a possible injury.' }],
  },
  {
    promptId: 'cf-019',
    reviews: [{ by: 'reviewer2', ranking: { a: 1, c: 2, d: 3, b: 4 }, rationale: 'A covers descent, spacing and the 30-minute wait. B is outdated advice.' }],
  },
];
