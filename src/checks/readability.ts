import { audienceFromPrompt, type AudienceTarget } from '../text/readability/audience.ts';
import type { Doc } from '../text/analyze.ts';
import { readabilityCounts } from '../text/readability/counts.ts';
import {
  automatedReadabilityIndex, colemanLiau, consensusGrade, daleChall, fleschKincaidGrade, fleschReadingEase, gunningFog, smog,
} from '../text/readability/formulas.ts';
import { defineCheck } from './define-check.ts';

const round = (x: number | null) => (x === null ? null : Math.round(x * 1000) / 1000);

const audiences = new WeakMap<Doc, AudienceTarget | null>();

/** The audience a prompt names, read once per prompt (its responses share it). */
function promptAudience(prompt: Doc): AudienceTarget | null {
  let audience = audiences.get(prompt);
  if (audience === undefined) {
    audience = audienceFromPrompt(prompt.text);
    audiences.set(prompt, audience);
  }
  return audience;
}

/** Readability counts and the published formulas, and whether the text suits its audience. */
export const readability = defineCheck<{ targetGrade: number | null; tolerance: number; minSentenceWords: number }>({
  meta: {
    id: 'readability',
    description: 'Readability counts and formulas (Flesch, Flesch–Kincaid, Gunning fog, SMOG, Coleman–Liau, ARI, Dale–Chall), and fit to the audience the prompt or rubric names.',
    params: {
      targetGrade: { type: 'number', default: null, nullable: true, min: 0, max: 18, description: 'US grade the audience reads at; null reads it from the prompt ("for a 7-year-old"), or sets none.' },
      tolerance: { type: 'number', default: 2, min: 0, max: 10, description: 'Grades above the target still accepted.' },
      minSentenceWords: { type: 'integer', default: 8, min: 1, max: 100, description: 'Sentences shorter than this are not pointed at as too hard.' },
    },
    messages: {
      'above-audience': 'reads at grade {grade}; the audience ({audience}) reads at about grade {target}',
      'hard-sentence': 'this sentence reads at grade {grade}, above the audience\'s {target}',
    },
  },
  evaluate(doc, params, report) {
    const c = readabilityCounts(doc);
    const grade = consensusGrade(c);
    const audience = params.targetGrade !== null ? { grade: params.targetGrade, because: 'rubric' } : doc.context.prompt ? promptAudience(doc.context.prompt) : null;
    const metrics = {
      sentences: c.sentences,
      words: c.words,
      syllables: c.syllables,
      polysyllables: c.polysyllables,
      complex_words: c.complexWords,
      letters: c.letters,
      characters: c.characters,
      unfamiliar_words: c.unfamiliarWords,
      flesch_reading_ease: round(fleschReadingEase(c)),
      flesch_kincaid_grade: round(fleschKincaidGrade(c)),
      gunning_fog: round(gunningFog(c)),
      smog: round(smog(c)),
      coleman_liau: round(colemanLiau(c)),
      automated_readability_index: round(automatedReadabilityIndex(c)),
      dale_chall: round(daleChall(c)),
      consensus_grade: round(grade),
      target_grade: audience?.grade ?? null,
    };
    const undefinedMetrics: Record<string, string> = {};
    if (!c.words) for (const k of Object.keys(metrics)) if (metrics[k as keyof typeof metrics] === null) undefinedMetrics[k] = 'the text has no words';
    if (!audience) undefinedMetrics.target_grade = 'neither the rubric nor the prompt names an audience';
    if (!audience || grade === null || grade <= audience.grade + params.tolerance) return { metrics, value: 1, undefinedMetrics };

    report('above-audience', { start: 0, end: doc.text.length }, { grade: grade.toFixed(1), audience: audience.because, target: audience.grade });
    for (const s of doc.sentences) {
      if (s.words < params.minSentenceWords) continue;
      const g = consensusGrade(readabilityCounts(doc, s.firstToken, s.endToken));
      if (g !== null && g > audience.grade + params.tolerance) report('hard-sentence', s, { grade: g.toFixed(1), target: audience.grade });
    }
    return { metrics, value: 1 - (grade - audience.grade - params.tolerance) / 6, undefinedMetrics };
  },
});
