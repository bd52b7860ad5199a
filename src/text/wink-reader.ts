import { createRequire } from 'node:module';
import type winkNLP from 'wink-nlp';

type Nlp = ReturnType<typeof winkNLP>;
let nlp: Nlp | null = null;

/**
 * The one wink-nlp instance, built on first use with only the pipes the analysis reads:
 * sentence boundaries and negation flags (about twice as fast as the full pipeline). The
 * packages are loaded then, not on import: a process that never analyses text (a thread that
 * only stores an import's items, an export without redaction) never holds the model's 40 MB.
 */
export function winkReader(): Nlp {
  if (!nlp) {
    const require = createRequire(import.meta.url);
    const build = require('wink-nlp') as typeof winkNLP;
    nlp = build(require('wink-eng-lite-web-model'), ['sbd', 'negation']);
  }
  return nlp;
}
