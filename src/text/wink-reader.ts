import winkNLP from 'wink-nlp';
import model from 'wink-eng-lite-web-model';

type Nlp = ReturnType<typeof winkNLP>;
let nlp: Nlp | null = null;

/**
 * The one wink-nlp instance, built on first use with only the pipes the analysis reads:
 * sentence boundaries and negation flags (about twice as fast as the full pipeline).
 */
export function winkReader(): Nlp {
  nlp ??= winkNLP(model, ['sbd', 'negation']);
  return nlp;
}
