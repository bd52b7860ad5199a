import { isMap, isScalar, isSeq, LineCounter, parseDocument, type Node, type Pair } from 'yaml';
import { checkParamSpecs, RUBRIC_SPEC, type Field, type Spec } from './spec.ts';
import { regexProblem } from './regex-safety.ts';
import { closest } from './suggest.ts';

/** One problem in a rubric file, with the place it was found (1-based line and column). */
export interface Problem {
  line: number;
  column: number;
  message: string;
}

type Raw = Record<string, unknown>;

/** A walker over one parsed file: collects problems and builds plain values with defaults filled. */
class Walker {
  readonly problems: Problem[] = [];
  private readonly paramSpecs = checkParamSpecs();
  constructor(private readonly lines: LineCounter) {}

  at(node: Node | Pair['key'] | null | undefined, message: string, fallback?: Node | null): void {
    const target = (node as Node | null | undefined)?.range ? (node as Node) : fallback;
    const offset = target?.range?.[0] ?? 0;
    const { line, col } = this.lines.linePos(offset);
    this.problems.push({ line, column: col, message });
  }

  value(node: unknown, spec: Spec, where: string, parent: Node | null): unknown {
    const n = node as Node | null;
    switch (spec.kind) {
      case 'object':
        return this.object(n, spec, where, parent);
      case 'map':
        return this.map(n, spec, where, parent);
      case 'array':
        return this.array(n, spec, where, parent);
      case 'params':
        return isMap(n) ? n : null; // checked with its criterion, which knows the check
      default:
        return this.scalar(n, spec, where, parent);
    }
  }

  private scalar(n: Node | null, spec: Exclude<Spec, { kind: 'object' | 'map' | 'array' | 'params' }>, where: string, parent: Node | null): unknown {
    if (!isScalar(n)) {
      this.at(n, `${where} must be ${describe(spec)}, not ${kindOf(n)}`, parent);
      return undefined;
    }
    const v = n.value;
    switch (spec.kind) {
      case 'string':
      case 'regex': {
        if (typeof v !== 'string') return this.bad(n, where, spec, v);
        if (spec.kind === 'string' && spec.minLength && v.trim().length < spec.minLength) this.at(n, `${where} is empty — give it a value or remove it`);
        else if (spec.kind === 'string' && spec.pattern && !spec.pattern.test(v)) this.at(n, `${where} "${v}" must use only lower-case letters, digits and hyphens`);
        if (spec.kind === 'regex') {
          const problem = regexProblem(v);
          if (problem) this.at(n, `${where} ${problem}`);
        }
        return v;
      }
      case 'number':
      case 'integer': {
        if (v === null && spec.nullable) return null;
        if (typeof v !== 'number' || (spec.kind === 'integer' && !Number.isInteger(v))) return this.bad(n, where, spec, v);
        if (spec.min !== undefined && v < spec.min) this.at(n, `${where} is ${v}, below the minimum ${spec.min}`);
        else if (spec.max !== undefined && v > spec.max) this.at(n, `${where} is ${v}, above the maximum ${spec.max}`);
        return v;
      }
      case 'boolean':
        return typeof v === 'boolean' ? v : this.bad(n, where, spec, v);
      case 'enum': {
        if (typeof v === 'string' && spec.values.includes(v)) return v;
        const guess = typeof v === 'string' ? closest(v, spec.values) : undefined;
        const noun = where.endsWith('check') ? 'check' : 'value';
        this.at(n, `unknown ${noun} "${String(v)}" for ${where}${guess ? ` — did you mean "${guess}"?` : ` (one of: ${spec.values.join(', ')})`}`);
        return undefined;
      }
    }
  }

  private bad(n: Node, where: string, spec: Spec, v: unknown): undefined {
    this.at(n, `${where} must be ${describe(spec)}, not ${JSON.stringify(v)}`);
    return undefined;
  }

  private object(n: Node | null, spec: Extract<Spec, { kind: 'object' }>, where: string, parent: Node | null): Raw | undefined {
    if (!isMap(n)) {
      this.at(n, `${where} must be a mapping of keys to values, not ${kindOf(n)}`, parent);
      return undefined;
    }
    const out: Raw = {};
    const nodes: Record<string, Node> = {};
    const known = Object.keys(spec.fields);
    for (const pair of n.items) {
      const key = isScalar(pair.key) ? String(pair.key.value) : '';
      const field = spec.fields[key];
      if (!field) {
        const guess = closest(key, known);
        this.at(pair.key as Node, `unknown key "${key}" in ${where}${guess ? ` — did you mean "${guess}"?` : ` (allowed: ${known.filter((k) => k !== '$schema').join(', ')})`}`, n);
        continue;
      }
      nodes[key] = pair.value as Node;
      out[key] = this.value(pair.value, field, `${where === 'rubric' ? '' : `${where}.`}${key}`, (pair.key as Node) ?? n);
    }
    for (const [key, field] of Object.entries(spec.fields)) {
      if (!(key in out) && (field as Field).required) this.at(n, `${where} is missing "${key}" (${field.description.replace(/\.$/, '').toLowerCase()})`);
      if (out[key] === undefined && (field as Field).default !== undefined && !(key in nodes)) out[key] = structuredClone((field as Field).default);
    }
    if (spec.oneOf) {
      const present = spec.oneOf.filter((keys) => keys.every((k) => k in out));
      if (present.length !== 1) this.at(n, `${where} needs exactly one of ${spec.oneOf.map((k) => `"${k.join('+')}"`).join(' or ')}`);
    }
    Object.defineProperty(out, '__nodes', { value: nodes, enumerable: false });
    return out;
  }

  private map(n: Node | null, spec: Extract<Spec, { kind: 'map' }>, where: string, parent: Node | null): Raw | undefined {
    if (!isMap(n)) {
      this.at(n, `${where} must be a mapping, not ${kindOf(n)}`, parent);
      return undefined;
    }
    const out: Raw = {};
    const keys: Record<string, Node> = {};
    for (const pair of n.items) {
      const key = isScalar(pair.key) ? String(pair.key.value) : '';
      if (spec.keyPattern && !spec.keyPattern.test(key)) this.at(pair.key as Node, `${where} key "${key}" must use only lower-case letters, digits and hyphens`, n);
      keys[key] = pair.key as Node;
      out[key] = this.value(pair.value, spec.of, `${where}.${key}`, pair.key as Node);
    }
    Object.defineProperty(out, '__keys', { value: keys, enumerable: false });
    return out;
  }

  private array(n: Node | null, spec: Extract<Spec, { kind: 'array' }>, where: string, parent: Node | null): unknown[] | undefined {
    if (!isSeq(n)) {
      this.at(n, `${where} must be a list, not ${kindOf(n)}`, parent);
      return undefined;
    }
    if (spec.minItems && n.items.length < spec.minItems) this.at(n, `${where} needs at least ${spec.minItems} item${spec.minItems > 1 ? 's' : ''}`);
    const out = n.items.map((item, i) => this.value(item, spec.of, `${where}[${i + 1}]`, n));
    if (spec.unique) {
      const seen = new Map<string, Node>();
      n.items.forEach((item, i) => {
        const value = spec.unique === 'value' ? out[i] : (out[i] as Raw | undefined)?.[spec.unique!];
        if (typeof value !== 'string') return;
        const node = spec.unique === 'value' ? (item as Node) : (((out[i] as Raw)?.__nodes as Record<string, Node> | undefined)?.[spec.unique!] ?? (item as Node));
        const key = value.trim().toLowerCase();
        const first = seen.get(key);
        if (first) {
          const noun = spec.itemName ?? 'entry';
          const what = spec.unique === 'id' ? `${noun} id` : noun;
          this.at(node, `duplicate ${what} "${value}" in ${where} (first at line ${this.lines.linePos(first.range![0]).line})`);
        } else seen.set(key, node);
      });
    }
    return out;
  }

  /** A criterion's parameters, checked against its check's declared parameters. */
  params(node: Node | null, check: string, where: string): Raw {
    const specs = this.paramSpecs[check];
    const out: Raw = {};
    if (!node || !specs) return out;
    if (isScalar(node) && (node.value === null || node.value === '')) return out; // "params:" with nothing under it
    if (!isMap(node)) {
      this.at(node, `${where} must be a mapping of parameter names to values, not ${kindOf(node)} — indent each parameter under "params:"`, null);
      return out;
    }
    const known = Object.keys(specs);
    for (const pair of node.items as Pair[]) {
      const key = isScalar(pair.key) ? String(pair.key.value) : '';
      const spec = specs[key];
      if (!spec) {
        const guess = closest(key, known);
        this.at(pair.key as Node, `check "${check}" has no parameter "${key}"${guess ? ` — did you mean "${guess}"?` : known.length ? ` (parameters: ${known.join(', ')})` : ' (it takes none)'}`, node);
        continue;
      }
      out[key] = this.value(pair.value, spec, `${where}.${key}`, pair.key as Node);
    }
    return out;
  }
}

function kindOf(n: Node | null | undefined): string {
  if (n === null || n === undefined) return 'nothing';
  if (isMap(n)) return 'a mapping';
  if (isSeq(n)) return 'a list';
  if (isScalar(n)) return n.value === null ? 'empty' : JSON.stringify(n.value);
  return 'something else';
}

function describe(spec: Spec): string {
  switch (spec.kind) {
    case 'string':
    case 'regex':
      return 'text';
    case 'number':
      return `a number${spec.nullable ? ' or null' : ''}`;
    case 'integer':
      return 'a whole number';
    case 'boolean':
      return 'true or false';
    case 'enum':
      return `one of ${spec.values.join(', ')}`;
    default:
      return spec.kind;
  }
}

export interface ParsedFile {
  /** The file's contents as plain values with defaults filled; undefined when it is not a mapping. */
  raw: Raw | undefined;
  problems: Problem[];
  walker: Walker;
}

/** Parses and structurally validates one rubric file's text. */
export function parseRubricText(text: string): ParsedFile {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, prettyErrors: false });
  const walker = new Walker(lines);
  for (const error of doc.errors) {
    const pos = error.linePos?.[0] ?? lines.linePos(error.pos[0]);
    walker.problems.push({ line: pos.line, column: pos.col, message: `YAML: ${error.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '')}` });
  }
  const raw = doc.contents ? (walker.value(doc.contents, RUBRIC_SPEC, 'rubric', null) as Raw | undefined) : undefined;
  if (!doc.contents && !doc.errors.length) walker.problems.push({ line: 1, column: 1, message: 'the file is empty — a rubric needs at least "id", "title" and "criteria"' });
  return { raw, problems: walker.problems, walker };
}

export type { Walker };
