import { contentStems, isWord, type Doc } from '../text/analyze.ts';
import { defineCheck, type Evaluation } from './define-check.ts';

/** A document's TF-IDF weights over the model's vocabulary, with their Euclidean norm. */
export interface TfIdfVector {
  weights: Float64Array;
  norm: number;
}

/**
 * TF-IDF weighting with IDF from the documents given (smoothed: ln((1 + n) / (1 + df)) + 1),
 * and the cosine similarity of two documents' vectors. Stems get small ids over the corpus's
 * vocabulary, so vectors are dense arrays rather than maps.
 */
export class TfIdf {
  private readonly ids = new Map<string, number>();
  private readonly idf: Float64Array;

  constructor(corpus: string[][]) {
    const df: number[] = [];
    const lastDoc: number[] = [];
    corpus.forEach((doc, d) => {
      for (const s of doc) {
        let id = this.ids.get(s);
        if (id === undefined) {
          id = df.length;
          this.ids.set(s, id);
          df.push(0);
          lastDoc.push(-1);
        }
        if (lastDoc[id] !== d) {
          lastDoc[id] = d;
          df[id]++;
        }
      }
    });
    const n = corpus.length;
    this.idf = new Float64Array(df.length);
    for (let id = 0; id < df.length; id++) this.idf[id] = Math.log((1 + n) / (1 + df[id])) + 1;
  }

  /** The weighted vector of a stem list (stems outside the corpus are left out). */
  vector(stems: string[]): TfIdfVector {
    const weights = new Float64Array(this.idf.length);
    for (const s of stems) {
      const id = this.ids.get(s);
      if (id !== undefined) weights[id] += this.idf[id];
    }
    let squares = 0;
    for (const w of weights) squares += w * w;
    return { weights, norm: Math.sqrt(squares) };
  }

  static cosine(a: TfIdfVector, b: TfIdfVector): number {
    const d = a.norm * b.norm;
    if (!d) return 0;
    let dot = 0;
    for (let i = 0; i < a.weights.length; i++) dot += a.weights[i] * b.weights[i];
    return dot / d;
  }
}

/** Cosine similarity of two TF-IDF vectors given as stem lists; IDF from the documents given. */
export function tfidfCosine(a: string[], b: string[], corpus: string[][]): number {
  const model = new TfIdf(corpus);
  return TfIdf.cosine(model.vector(a), model.vector(b));
}

function jaccard(a: Set<string>, b: Set<string>): number {
  let shared = 0;
  for (const x of a) if (b.has(x)) shared++;
  const union = a.size + b.size - shared;
  return union ? shared / union : 0;
}

/** Does `text[start, end)` end in a question mark, white space aside? */
function endsWithQuestionMark(text: string, start: number, end: number): boolean {
  let i = end - 1;
  while (i >= start && /\s/.test(text[i])) i--;
  return i >= start && text[i] === '?';
}

/** The lower-case first word of a token range, if any. */
function firstWord(doc: Doc, from: number, to: number): string | undefined {
  for (let i = from; i < to; i++) if (isWord(doc.tokens[i])) return doc.tokens[i].lower;
  return undefined;
}

/**
 * Non-answers: an empty response; one too short to answer; one that continues the prompt instead
 * of answering it (it echoes the prompt's shape, typically as further questions of the same kind);
 * and one off the prompt's topic: TF-IDF cosine similarity of content stems (IDF over the prompt
 * and every candidate) below a threshold both with the prompt and with every other candidate.
 */
export const nonAnswer = defineCheck<{ minWords: number; minSimilarity: number; echoSimilarity: number }>({
  meta: {
    id: 'non-answer',
    description: 'Empty or too-short responses, responses that continue the prompt instead of answering, and off-topic responses.',
    params: {
      minWords: { type: 'integer', default: 3, min: 1, max: 100, description: 'Fewer words than this is too short to answer.' },
      minSimilarity: { type: 'number', default: 0.05, min: 0, max: 1, description: 'TF-IDF cosine with the prompt below this is off-topic.' },
      echoSimilarity: { type: 'number', default: 0.3, min: 0, max: 1, description: 'Content-stem Jaccard similarity with the prompt at which a sentence echoes it.' },
    },
    messages: {
      empty: 'the response is empty',
      'too-short': 'only {words} word(s): too short to answer',
      'continues-prompt': 'continues the prompt instead of answering it',
      'off-topic': 'shares almost nothing with the prompt or the other candidates (similarity {similarity})',
    },
  },
  evaluate(doc, params, report): Evaluation {
    const words = doc.wordTokens.length;
    const prompt = doc.context.prompt;
    if (words === 0) {
      report('empty', { start: 0, end: doc.text.length });
      return { metrics: { words, prompt_similarity: null, echoing_sentences: 0 }, value: 0, undefinedMetrics: { prompt_similarity: 'the response has no words' } };
    }
    if (words < params.minWords) report('too-short', { start: 0, end: doc.text.length }, { words });
    if (!prompt) return { metrics: { words, prompt_similarity: null, echoing_sentences: null }, value: words < params.minWords ? 0.5 : 1, undefinedMetrics: { prompt_similarity: 'no prompt given', echoing_sentences: 'no prompt given' } };

    const promptStems = contentStems(prompt);
    const promptSet = new Set(promptStems);
    const promptIsQuestion = /\?\s*$/.test(prompt.text.trim());
    const promptOpening = prompt.tokens.find(isWord)?.lower;
    let echoing = 0;
    const echoes: { start: number; end: number }[] = [];
    for (const s of doc.sentences) {
      const sameShape = (promptIsQuestion && endsWithQuestionMark(doc.text, s.start, s.end)) || (promptOpening !== undefined && firstWord(doc, s.firstToken, s.endToken) === promptOpening);
      if (!sameShape) continue;
      const stems = new Set(contentStems(doc, s.firstToken, s.endToken));
      if (stems.size && jaccard(stems, promptSet) >= params.echoSimilarity) {
        echoing++;
        echoes.push(s);
      }
    }
    const answering = doc.sentences.filter((s) => s.words > 0).length - echoing;
    const continues = echoing >= 2 || (echoing >= 1 && answering === 0);
    if (continues) for (const e of echoes) report('continues-prompt', e);

    const siblings = doc.context.siblings ?? [];
    const corpus = [promptStems, contentStems(doc), ...siblings.map((d) => contentStems(d))];
    const model = new TfIdf(corpus);
    const own = model.vector(contentStems(doc));
    const similarity = TfIdf.cosine(own, model.vector(promptStems));
    // Good answers often share few words with a short prompt but many with the other candidates:
    // a response is off-topic only when it is far from both.
    const siblingSimilarity = Math.max(0, ...siblings.map((d) => TfIdf.cosine(own, model.vector(contentStems(d)))));
    const topical = Math.max(similarity, siblingSimilarity);
    // With no other candidates to compare with, a short answer sharing no words with a short
    // prompt is weak evidence ("Light is fast…" for a question about thunder): ask for more text.
    const enoughText = siblings.length > 0 ? words >= params.minWords : words >= Math.max(params.minWords, 20);
    const offTopic = !continues && enoughText && promptStems.length > 0 && topical < params.minSimilarity;
    if (offTopic) {
      const first = doc.sentences.find((s) => s.words > 0)!;
      report('off-topic', first, { similarity: topical.toFixed(2) });
    }
    const value = continues ? 0 : offTopic ? 0.2 : words < params.minWords ? 0.5 : 1;
    return { metrics: { words, prompt_similarity: Math.round(similarity * 1000) / 1000, sibling_similarity: siblings.length ? Math.round(siblingSimilarity * 1000) / 1000 : null, echoing_sentences: echoing }, value, undefinedMetrics: siblings.length ? {} : { sibling_similarity: 'no sibling responses' } };
  },
});
