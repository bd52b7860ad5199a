import type { OptionSpec, ParsedArgs } from './args.ts';

/** Where a command writes, and its environment: real process streams, or buffers in tests. */
export interface CommandIo {
  out(line: string): void;
  err(line: string): void;
  env: NodeJS.ProcessEnv;
  /** Standard input, for commands that read `-`. */
  stdin: NodeJS.ReadableStream;
}

/** One CLI command. `name` may hold two words ("db status"). */
export interface Command {
  name: string;
  summary: string;
  usage: string;
  options: OptionSpec;
  run(args: ParsedArgs, io: CommandIo): Promise<number>;
}
