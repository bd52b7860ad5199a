import { FLAG_SEVERITIES } from '../review/flag-severity.ts';

/** One prompt with its candidate responses, as imported. */
export interface BatchItem {
  promptId: string;
  prompt: string;
  responses: { responseId: string; text: string }[];
  flag: { reason: string; severity: string } | null;
  meta: Record<string, unknown> | null;
  /** Line in the file where the item starts (1-based). */
  line: number;
}

/** A bad line: where, which field, what is wrong and what to do. */
export interface LineProblem {
  line: number;
  field: string | null;
  message: string;
}

export const MIN_RESPONSES = 2;
export const MAX_RESPONSES = 9;
export const DEFAULT_MAX_TEXT_BYTES = 100_000;

/**
 * Checks an item's fields (shared by JSONL and CSV): ids present and unique, 2–9 responses,
 * texts within the size limit, a known flag severity. Returns the problems found.
 */
export function itemProblems(item: BatchItem, maxTextBytes = DEFAULT_MAX_TEXT_BYTES): LineProblem[] {
  const problems: LineProblem[] = [];
  const at = (field: string, message: string) => problems.push({ line: item.line, field, message });
  if (!item.promptId.trim()) at('prompt_id', 'is empty — give every prompt an id');
  if (!item.prompt.trim()) at('prompt', 'is empty');
  if (Buffer.byteLength(item.prompt) > maxTextBytes) at('prompt', `is ${Buffer.byteLength(item.prompt)} bytes, over the limit of ${maxTextBytes}`);
  if (item.responses.length < MIN_RESPONSES) at('responses', `has ${item.responses.length} response${item.responses.length === 1 ? '' : 's'}; a prompt needs ${MIN_RESPONSES} to ${MAX_RESPONSES} to rank`);
  if (item.responses.length > MAX_RESPONSES) at('responses', `has ${item.responses.length} responses; at most ${MAX_RESPONSES} can be ranked — split the prompt's responses`);
  const seen = new Set<string>();
  item.responses.forEach((r, i) => {
    const field = `responses[${i + 1}]`;
    if (!r.responseId.trim()) at(`${field}.response_id`, 'is empty');
    else if (seen.has(r.responseId)) at(`${field}.response_id`, `"${r.responseId}" is used twice in this prompt — response ids must be unique within a prompt`);
    seen.add(r.responseId);
    if (Buffer.byteLength(r.text) > maxTextBytes) at(`${field}.text`, `is ${Buffer.byteLength(r.text)} bytes, over the limit of ${maxTextBytes}`);
  });
  if (item.flag && !(FLAG_SEVERITIES as readonly string[]).includes(item.flag.severity)) {
    at('flag.severity', `"${item.flag.severity}" is not a severity (use ${FLAG_SEVERITIES.join(', ')})`);
  }
  return problems;
}
