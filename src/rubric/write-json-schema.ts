/** Writes rubrics/plumbline-rubric.schema.json from the rubric spec: `npm run build:schema`. */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { rubricJsonSchemaText } from './json-schema.ts';

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const out = fileURLToPath(new URL('../../rubrics/plumbline-rubric.schema.json', import.meta.url));
  writeFileSync(out, rubricJsonSchemaText());
  console.log(`wrote ${out}`);
}
