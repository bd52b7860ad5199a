import { describe, expect, it } from 'vitest';
import { loadRubric, type Rubric } from '../../src/rubric/load.ts';
import { bandOf, scoreItem } from '../../src/rubric/score.ts';
import { triagePriority } from '../../src/rubric/triage.ts';

function rubric(text: string): Rubric {
  const { rubric, problems } = loadRubric(text);
  if (!rubric) throw new Error(JSON.stringify(problems));
  return rubric;
}

const twoCriteria = rubric(`id: t
title: T
overall_bands: { pass: 80, review: 50 }
criteria:
  - id: data
    check: personal-data
    weight: 3
    severity: critical
    bands: { pass: 1, review: 0.5 }
  - id: reps
    check: repetition
    weight: 1
`);

describe('scoring (DESIGN.md §5: overall = 100 · Σ wᵢvᵢ / Σ wᵢ)', () => {
  it('weights the criterion values', () => {
    // an e-mail address: personal-data value 1 − 0.5 = 0.5 (review); repetition 1 → 100·(3·0.5 + 1·1)/4 = 62.5
    const scored = scoreItem(twoCriteria, { prompt: 'Where is my order?', responses: [{ responseId: 'a', text: 'It went to kit@example.org yesterday.' }, { responseId: 'b', text: 'It shipped yesterday.' }] });
    const [a, b] = scored.responses;
    expect(a.criteria.data).toMatchObject({ value: 0.5, band: 'review' });
    expect(a.score).toBe(62.5);
    expect(a.band).toBe('review');
    expect(b.score).toBe(100);
    expect(b.band).toBe('pass');
    expect([a.suggestedRank, b.suggestedRank]).toEqual([2, 1]);
    expect(a.findings[0]).toMatchObject({ criterion: 'data', check: 'personal-data', severity: 'critical', messageId: 'email', evidence: 'kit@example.org' });
    expect(scored.rubric).toEqual({ id: 't', version: twoCriteria.version });
  });

  it('fails a response whose critical criterion fails, whatever its score', () => {
    const lenient = rubric(twoCriteria.source.replace('overall_bands: { pass: 80, review: 50 }', 'overall_bands: { pass: 10, review: 5 }'));
    const scored = scoreItem(lenient, { prompt: 'Which card?', responses: [{ responseId: 'a', text: 'Card 4111 1111 1111 1111.' }, { responseId: 'b', text: 'The card ending in 1111.' }] });
    expect(scored.responses[0].score).toBe(25); // 100·(3·0 + 1·1)/4
    expect(scored.responses[0].failedCritical).toBe(true);
    expect(scored.responses[0].band).toBe('fail');
    expect(scored.responses[0].suggestedRank).toBe(2);
  });

  it('gives equal scores the same suggested rank', () => {
    const scored = scoreItem(twoCriteria, { prompt: 'Hi?', responses: ['Fine.', 'Good.', 'Card 4111 1111 1111 1111.'].map((text, i) => ({ responseId: String(i), text })) });
    expect(scored.responses.map((r) => r.suggestedRank)).toEqual([1, 1, 3]);
  });

  it('puts bands at the rubric\'s edges', () => {
    const edges = { pass: 0.8, review: 0.5 };
    expect([bandOf(0.8, edges), bandOf(0.79, edges), bandOf(0.5, edges), bandOf(0.49, edges)]).toEqual(['pass', 'review', 'review', 'fail']);
  });

  it('gives the same version to the same content and a new one to changed content', () => {
    expect(rubric(twoCriteria.source).version).toBe(twoCriteria.version);
    expect(rubric(`# a comment changes nothing\n${twoCriteria.source}`).version).toBe(twoCriteria.version);
    expect(rubric(twoCriteria.source.replace('weight: 1', 'weight: 2')).version).not.toBe(twoCriteria.version);
  });
});

describe('triage priority: critical findings, then uncertainty, then flag severity', () => {
  const r = (score: number, critical = false) => ({ responseId: String(score), score, band: 'pass' as const, failedCritical: false, suggestedRank: 1, criteria: {}, findings: critical ? [{ criterion: 'data', check: 'personal-data', start: 0, end: 1, severity: 'critical' as const, messageId: 'email', message: '', evidence: '' }] : [] });
  const table: { name: string; responses: ReturnType<typeof r>[]; flag: string | null }[] = [
    { name: 'critical finding, clear scores, no flag', responses: [r(100, true), r(20)], flag: null },
    { name: 'no critical finding, score on a band edge', responses: [r(80), r(20)], flag: null },
    { name: 'no critical finding, two candidates 1 point apart', responses: [r(97), r(96)], flag: null },
    { name: 'clear, flagged high', responses: [r(100), r(20)], flag: 'high' },
    { name: 'clear, flagged low', responses: [r(100), r(20)], flag: 'low' },
    { name: 'clear, no flag', responses: [r(100), r(20)], flag: null },
  ];
  it('orders items as the policy says', () => {
    const priorities = table.map((t) => triagePriority(twoCriteria, t.responses, t.flag));
    const order = table.map((t, i) => ({ name: t.name, value: priorities[i].value })).sort((a, b) => b.value - a.value).map((x) => x.name);
    expect(order).toEqual(table.map((t) => t.name));
    expect(priorities[1].uncertainty).toBe(1);
    expect(priorities[2].uncertainty).toBeCloseTo(1 - 1 / 3, 3);
  });
});
