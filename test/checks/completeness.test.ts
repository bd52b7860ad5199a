import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CHECKS } from '../../src/checks/registry.ts';
import { placeholdersOf } from '../../src/checks/define-check.ts';

const root = new URL('../../', import.meta.url);
const readme = readFileSync(new URL('README.md', root), 'utf8');
const testFileFor: Record<string, string> = { readability: 'readability-check' };

describe('every check is complete', () => {
  it('the registry is sorted by id, with no duplicates', () => {
    const ids = CHECKS.map((c) => c.meta.id);
    expect(ids).toEqual([...ids].sort());
    expect(new Set(ids).size).toBe(ids.length);
  });
  for (const check of CHECKS) {
    const { id } = check.meta;
    describe(id, () => {
      it('has a test table', () => {
        const file = new URL(`test/checks/${testFileFor[id] ?? id}.test.ts`, root);
        expect(existsSync(file), `test/checks/${testFileFor[id] ?? id}.test.ts`).toBe(true);
        expect(readFileSync(file, 'utf8')).toContain('checkTable(');
      });
      it('has a README section with one flagged and one clean example', () => {
        const section = readme.split(/^#### /m).find((s) => s.startsWith(`\`${id}\``));
        expect(section, `README section "#### \`${id}\`"`).toBeDefined();
        expect(section).toMatch(/Flagged:/);
        expect(section).toMatch(/Not flagged:/);
      });
      it('declares parameters with descriptions and defaults within their limits', () => {
        for (const [name, spec] of Object.entries(check.meta.params)) {
          expect(spec.description, name).not.toBe('');
          if (typeof spec.default === 'number') {
            if (spec.min !== undefined) expect(spec.default).toBeGreaterThanOrEqual(spec.min);
            if (spec.max !== undefined) expect(spec.default).toBeLessThanOrEqual(spec.max);
          }
        }
      });
      it('has messages whose placeholders are all filled by its reports', () => {
        expect(Object.keys(check.meta.messages).length).toBeGreaterThan(0);
        for (const template of Object.values(check.meta.messages)) expect(Array.isArray(placeholdersOf(template))).toBe(true);
      });
    });
  }
});
