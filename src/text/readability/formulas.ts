/**
 * The published readability formulas, each a pure function of a counts object. A formula
 * whose denominators are zero returns null (undefined for the text), never NaN.
 * Sources: Flesch (1948); Kincaid, Fishburne, Rogers & Chissom (1975); Gunning (1952);
 * McLaughlin (1969); Coleman & Liau (1975); Smith & Senter (1967); Dale & Chall (1948).
 */
export interface ReadabilityCounts {
  sentences: number;
  words: number;
  syllables: number;
  /** Words of 3 or more syllables (SMOG). */
  polysyllables: number;
  /** Gunning's complex words: 3+ syllables, less proper nouns, compounds and -es/-ed/-ing forms. */
  complexWords: number;
  letters: number;
  /** Letters and digits (ARI). */
  characters: number;
  /** Words not on the Dale–Chall familiar list. */
  unfamiliarWords: number;
}

type Formula = (c: ReadabilityCounts) => number | null;

/** Flesch Reading Ease: 206.835 − 1.015·ASL − 84.6·ASW. */
export const fleschReadingEase: Formula = (c) =>
  c.sentences && c.words ? 206.835 - 1.015 * (c.words / c.sentences) - 84.6 * (c.syllables / c.words) : null;

/** Flesch–Kincaid grade: 0.39·ASL + 11.8·ASW − 15.59. */
export const fleschKincaidGrade: Formula = (c) =>
  c.sentences && c.words ? 0.39 * (c.words / c.sentences) + 11.8 * (c.syllables / c.words) - 15.59 : null;

/** Gunning fog: 0.4·(ASL + 100·complex/W). */
export const gunningFog: Formula = (c) => (c.sentences && c.words ? 0.4 * (c.words / c.sentences + 100 * (c.complexWords / c.words)) : null);

/** SMOG: 1.0430·√(polysyllables·30/S) + 3.1291. */
export const smog: Formula = (c) => (c.sentences ? 1.043 * Math.sqrt((c.polysyllables * 30) / c.sentences) + 3.1291 : null);

/** Coleman–Liau: 0.0588·L − 0.296·S′ − 15.8 (L letters and S′ sentences per 100 words). */
export const colemanLiau: Formula = (c) =>
  c.words ? 0.0588 * ((c.letters / c.words) * 100) - 0.296 * ((c.sentences / c.words) * 100) - 15.8 : null;

/** Automated Readability Index: 4.71·(characters/W) + 0.5·ASL − 21.43. */
export const automatedReadabilityIndex: Formula = (c) =>
  c.sentences && c.words ? 4.71 * (c.characters / c.words) + 0.5 * (c.words / c.sentences) - 21.43 : null;

/** Dale–Chall: 0.1579·PDW + 0.0496·ASL, plus 3.6365 when PDW > 5 (PDW: % unfamiliar words). */
export const daleChall: Formula = (c) => {
  if (!c.sentences || !c.words) return null;
  const pdw = (c.unfamiliarWords / c.words) * 100;
  return 0.1579 * pdw + 0.0496 * (c.words / c.sentences) + (pdw > 5 ? 3.6365 : 0);
};

/** The grade-level formulas whose median is the consensus grade. */
export const GRADE_FORMULAS = { fleschKincaidGrade, gunningFog, smog, colemanLiau, automatedReadabilityIndex } as const;

/** The median of the grade formulas that are defined, or null when none is. */
export function consensusGrade(c: ReadabilityCounts): number | null {
  const grades = Object.values(GRADE_FORMULAS)
    .map((f) => f(c))
    .filter((g): g is number => g !== null)
    .sort((a, b) => a - b);
  if (grades.length === 0) return null;
  const mid = grades.length >> 1;
  return grades.length % 2 ? grades[mid] : (grades[mid - 1] + grades[mid]) / 2;
}
