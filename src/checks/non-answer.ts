import { contentStems, isWord, type Doc } from '../text/analyze.ts';
import { defineCheck, type Evaluation } from './define-check.ts';

/**
 * TF-IDF weighting with IDF from the documents given (smoothed: ln((1 + n) / (1 + df)) + 1),
 * and the cosine similarity of two documents' vectors.
 */
export class TfIdf {
  private readonly df = new Map<string, number>();
  private readonly n: number;

  constructor(corpus: string[][]) {
    const seenIn = new Map<string, number>();
    corpus.forEach((doc, d) => {
      for (const s of doc) {
        if (seenIn.get(s) === d) continue;
        seenIn.set(s, d);
        this.df.set(s, (this.df.get(s) ?? 0) + 1);
      }
    });
    this.n = corpus.length;
  }

  /** The weighted vector of a stem list, with its Euclidean norm. */
  vector(stems: string[]): { weights: Map<string, number>; norm: number } {
    const weights = new Map<string, number>();
    for (const s of stems) weights.set(s, (weights.get(s) ?? 0) + 1);
    let squares = 0;
    for (const [s, count] of weights) {
      const w = count * (Math.log((1 + this.n) / (1 + (this.df.get(s) ?? 0))) + 1);
      weights.set(s, w);
      squares += w * w;
    }
    return { weights, norm: Math.sqrt(squares) };
  }

  static cosine(a: { weights: Map<string, number>; norm: number }, b: { weights: Map<string, number>; norm: number }): number {
    const [small, large] = a.weights.size <= b.weights.size ? [a, b] : [b, a];
    let dot = 0;
    for (const [s, w] of small.weights) dot += w * (large.weights.get(s) ?? 0);
    const d = a.norm * b.norm;
    return d ? dot / d : 0;
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
