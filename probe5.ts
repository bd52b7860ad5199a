import { analyzeItem } from './src/text/analyze.ts';
import { CHECKS } from './src/checks/registry.ts';
import { cairnfieldItems } from './src/demo/cairnfield-items.ts';
const counts: Record<string, number> = {};
const t0 = performance.now();
for (const item of cairnfieldItems) {
  const { responses } = analyzeItem(item.prompt, item.responses);
  responses.forEach((doc, i) => {
    for (const c of CHECKS) {
      const r = c.run(doc);
      if (r.findings.length) { counts[c.meta.id] = (counts[c.meta.id] ?? 0) + 1; if (process.argv[2] === c.meta.id) console.log(item.promptId, String.fromCharCode(97+i), r.findings.map(f => `${f.message}: ${f.evidence.slice(0,60)}`)); }
    }
  });
}
console.log(counts, (performance.now()-t0).toFixed(0), 'ms');
