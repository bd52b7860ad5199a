import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadRubric } from '../../src/rubric/load.ts';

const shipped = ['general', 'cairnfield-support', 'young-readers'].map((id) => readFileSync(new URL(`../../rubrics/${id}.yaml`, import.meta.url), 'utf8'));

/** A shipped rubric with lines deleted, doubled, swapped or cut, and junk typed in. */
const mangled = fc
  .tuple(
    fc.constantFrom(...shipped),
    fc.array(
      fc.record({
        kind: fc.constantFrom('delete', 'double', 'cut', 'insert', 'swap'),
        at: fc.nat(),
        junk: fc.oneof(fc.string({ maxLength: 30 }), fc.constantFrom('weight: -1', 'check: nope', '  - id: x', 'bands: { pass: 2 }', '\t', ': :', '[', '{', 'id: A B', 'weight: NaN', '&a *a', '!!binary x')),
      }),
      { minLength: 1, maxLength: 6 },
    ),
  )
  .map(([source, edits]) => {
    const lines = source.split('\n');
    for (const e of edits) {
      const i = e.at % lines.length;
      if (e.kind === 'delete') lines.splice(i, 1);
      else if (e.kind === 'double') lines.splice(i, 0, lines[i]);
      else if (e.kind === 'cut') lines[i] = lines[i].slice(0, Math.floor(lines[i].length / 2));
      else if (e.kind === 'insert') lines.splice(i, 0, e.junk);
      else [lines[i], lines[(i + 1) % lines.length]] = [lines[(i + 1) % lines.length], lines[i]];
    }
    return lines.join('\n');
  });

describe('the rubric loader under generated input (fast-check)', () => {
  it('never throws: a damaged rubric gives a rubric or problems, each at a real line and column', () => {
    fc.assert(
      fc.property(fc.oneof(mangled, fc.string({ maxLength: 300 })), (text) => {
        const { rubric, problems } = loadRubric(text);
        const lines = text.split('\n');
        expect(Boolean(rubric) !== problems.length > 0).toBe(true);
        for (const p of problems) {
          expect(p.line).toBeGreaterThanOrEqual(1);
          expect(p.line).toBeLessThanOrEqual(lines.length + 1);
          expect(p.column).toBeGreaterThanOrEqual(1);
          expect(p.message.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 400 },
    );
  });

  it('gives the same version for the same content and a new one when a weight changes', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 50 }), fc.integer({ min: 1, max: 50 }), (a, b) => {
        const text = (w: number) => shipped[0].replace(/weight: \d+(\.\d+)?/, `weight: ${w}`);
        const [ra, rb] = [loadRubric(text(a)).rubric!, loadRubric(text(b)).rubric!];
        expect(ra.criteria[0].weight).toBe(a);
        expect(ra.version === rb.version).toBe(a === b);
        expect(loadRubric(`${text(a)}\n# a comment changes nothing\n`).rubric!.version).toBe(ra.version);
      }),
      { numRuns: 100 },
    );
  });
});
