import type { ExportOptions, PairRecord } from './export-decisions.ts';

/** What an export saw, gathered while it streamed, for the data card. */
export class ExportTally {
  items = 0;
  responses = 0;
  pairs = 0;
  tiedPairs = 0;
  byMethod = { consensus: 0, adjudication: 0 };
  batches = new Set<string>();
  rubricVersions = new Set<string>();
  first: string | null = null;
  last: string | null = null;
  agreementSum = 0;
  agreementItems = 0;
  longerPreferred = 0;
  lengthComparable = 0;

  addItem(item: { batch: string; decidedBy: 'consensus' | 'adjudication'; decidedAt: string; responses: unknown[]; agreement: number | null; rubric: { id: string | null; version: string | null } }) {
    this.items++;
    this.responses += item.responses.length;
    this.byMethod[item.decidedBy]++;
    this.batches.add(item.batch);
    if (item.rubric.version) this.rubricVersions.add(`${item.rubric.id ?? '?'}@${item.rubric.version}`);
    if (!this.first || item.decidedAt < this.first) this.first = item.decidedAt;
    if (!this.last || item.decidedAt > this.last) this.last = item.decidedAt;
    if (item.agreement !== null) {
      this.agreementSum += item.agreement;
      this.agreementItems++;
    }
  }

  addPair(pair: PairRecord) {
    if (pair.tie) {
      this.tiedPairs++;
      return;
    }
    this.pairs++;
    if (pair.preferred_text.length !== pair.other_text.length) {
      this.lengthComparable++;
      if (pair.preferred_text.length > pair.other_text.length) this.longerPreferred++;
    }
  }
}

const pct = (x: number) => `${(x * 100).toFixed(1)}%`;

/** The Markdown data card written beside an export. */
export function dataCard(tally: ExportTally, options: ExportOptions & { file: string; as: 'jsonl' | 'csv'; createdAt: string }): string {
  const lines = [
    `# Data card: ${options.file}`,
    '',
    `Exported ${options.createdAt} by Plumbline — ${options.format === 'pairs' ? 'pairwise comparisons' : 'full rankings'} as ${options.as === 'jsonl' ? 'JSON Lines' : 'CSV'}.`,
    '',
    '## What it holds',
    '',
    `- Decided items: ${tally.items} (${tally.byMethod.consensus} by reviewer consensus, ${tally.byMethod.adjudication} by adjudication), ${tally.responses} responses.`,
    options.format === 'pairs'
      ? `- Pairs: ${tally.pairs} strictly ordered${options.includeTies ? ` and ${tally.tiedPairs} tied (marked \`tie: true\`)` : `; tied pairs left out`}. Every ordered pair of each final ranking is one record: Σ K(K−1)/2 over the items, less ties.`
      : '- One record per item with every response and its final rank (1 is best; equal ranks are ties).',
    `- Batches: ${[...tally.batches].sort().join(', ') || 'none'}.`,
    `- Decisions made: ${tally.first ? `${tally.first.slice(0, 10)} to ${tally.last!.slice(0, 10)}` : 'none'}${options.since ? ` (filtered: on or after ${options.since})` : ''}.`,
    `- Rubric versions the items were scored with: ${[...tally.rubricVersions].sort().join(', ') || 'not recorded'}.`,
    '',
    '## Agreement',
    '',
    tally.agreementItems
      ? `- Mean pairwise agreement between reviewers of the same item: ${pct(tally.agreementSum / tally.agreementItems)} over ${tally.agreementItems} items with two or more reviews. Published human–human agreement on pairwise preferences is about 72–77% (Ouyang et al. 2022; Stiennon et al. 2020).`
      : '- No item had two or more reviews, so reviewer agreement cannot be given.',
    '',
    '## Known biases',
    '',
    tally.lengthComparable
      ? `- Length: the longer response is preferred in ${pct(tally.longerPreferred / tally.lengthComparable)} of ${tally.lengthComparable} pairs of different length (50% would be no length preference). A reward model trained on these pairs may learn to favour length.`
      : '- Length: no pairs of different length.',
    '- Display position and anchoring after the reveal are measured by `plumbline stats calibrate --batch NAME`.',
    '- Rankings reflect these reviewers, this rubric and these prompts; they are not ground truth.',
    '',
    '## How it was made',
    '',
    '- Candidates were scored by transparent lexical and structural heuristics to sort the work; the scores are triage aids. Every final ranking is a person\'s: reviewers ranked blind first (when the batch says so), and disagreements went to an adjudicator.',
    '- Reviewer ids are pseudonyms (HMAC-SHA-256 of the user id with a salt kept by this installation): stable within it, not reversible without the salt.',
    '',
    '## Cautions',
    '',
    `- ${options.redactPii ? 'Personal data found by the personal-data check (e-mail, phone, card, IBAN, IP address, national id shapes) was replaced by its kind; the check is heuristic, so some may remain.' : 'Texts are exported as written: they may hold personal data. Export with --redact-pii to remove what the personal-data check finds.'}`,
    '- Model responses under review can hold harmful or unsafe text. Handle this file under your organisation\'s data policy and local law; limit who can read it.',
    '',
  ];
  return lines.join('\n');
}
