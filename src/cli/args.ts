import { UsageError } from '../errors.ts';

/** What a command accepts: option names (without --) that take a value, and flags that do not. */
export interface OptionSpec {
  values?: string[];
  flags?: string[];
  /** How many positional arguments it takes at most (default none). */
  maxPositionals?: number;
}

export interface ParsedArgs {
  positionals: string[];
  values: Record<string, string>;
  flags: Set<string>;
}

/**
 * Parses `--name value`, `--name=value` and `--flag` against a spec. An unknown option is a
 * `UsageError` (exit 2) naming it and the command's options.
 *
 * @example
 * parseArgs(['--json', 'file.txt'], { flags: ['json'], maxPositionals: 1 }, 'analyze')
 */
export function parseArgs(argv: string[], spec: OptionSpec, command: string): ParsedArgs {
  const values: Record<string, string> = {};
  const flags = new Set<string>();
  const positionals: string[] = [];
  const known = [...(spec.values ?? []), ...(spec.flags ?? [])].map((o) => `--${o}`).join(', ') || 'none';
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--') {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (arg.startsWith('--')) {
      const [name, inline] = arg.slice(2).split(/=(.*)/s, 2);
      if (spec.flags?.includes(name) && inline === undefined) {
        flags.add(name);
      } else if (spec.values?.includes(name)) {
        const value = inline ?? argv[++i];
        if (value === undefined) throw new UsageError(`plumbline ${command}: --${name} needs a value`);
        values[name] = value;
      } else {
        throw new UsageError(`plumbline ${command}: unknown option --${name} (options: ${known})`);
      }
    } else if (arg.startsWith('-') && arg !== '-') {
      throw new UsageError(`plumbline ${command}: unknown option ${arg} (options: ${known})`);
    } else {
      positionals.push(arg);
    }
  }
  if (positionals.length > (spec.maxPositionals ?? 0)) {
    throw new UsageError(`plumbline ${command}: unexpected argument "${positionals[spec.maxPositionals ?? 0]}"`);
  }
  return { positionals, values, flags };
}
