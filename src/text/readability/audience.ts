/**
 * The reading grade a prompt asks for, read from phrases such as "for a 7-year-old",
 * "explain to my grandmother" or "for experts". Grade = age − 5 for a stated age (a US grade
 * starts at about six; common practice), 2 for young children, 6 for a general lay reader.
 * Never below grade 2: the grade formulas barely reach lower (SMOG's floor is 3.13), so a lower
 * target could never be met. Returns null when the prompt names no audience.
 */
const AGE_WORDS: Record<string, number> = { three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12, thirteen: 13, fourteen: 14 };

export interface AudienceTarget {
  grade: number;
  /** The words in the prompt that set it. */
  because: string;
}

export function audienceFromPrompt(prompt: string): AudienceTarget | null {
  const age = prompt.match(/\b(\d{1,2}|three|four|five|six|seven|eight|nine|ten|eleven|twelve|thirteen|fourteen)[- ]years?[- ]old\b/i);
  if (age) {
    const years = AGE_WORDS[age[1].toLowerCase()] ?? Number(age[1]);
    return { grade: Math.max(2, Math.min(12, years - 5)), because: age[0] };
  }
  const child = prompt.match(/\b(toddler|preschooler|young child|little one|kids?|child|children)\b/i);
  if (child && /\b(explain|tell|describe|for|to)\b/i.test(prompt)) return { grade: 2, because: child[0] };
  const lay = prompt.match(/\b(grand(?:mother|father|ma|pa|parents?)|beginners?|layperson|non-experts?|simple terms|plain (?:english|language))\b/i);
  if (lay) return { grade: 6, because: lay[0] };
  return null;
}
