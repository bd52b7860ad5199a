import { storageFailure } from '../store/storage-failure.ts';
import { UsageError, UserError } from '../errors.ts';
import { parseArgs } from './args.ts';
import type { Command, CommandIo } from './command.ts';
import { analyzeCommand } from './commands/analyze.ts';
import { dbStatusCommand } from './commands/db-status.ts';
import { importCommand } from './commands/import.ts';
import { exportCommand } from './commands/export.ts';
import { rubricCheckCommand, rubricDiffCommand, rubricTestCommand } from './commands/rubric.ts';
import { scoreCommand } from './commands/score.ts';
import { serveCommand } from './commands/serve.ts';
import { userAddCommand, userDisableCommand, userListCommand, userResetPasswordCommand } from './commands/user.ts';
import { statsAgreementCommand, statsCalibrateCommand, statsStrengthsCommand } from './commands/stats.ts';

/** Every command, in the order `plumbline --help` lists them. */
export const COMMANDS: Command[] = [serveCommand, dbStatusCommand, analyzeCommand, scoreCommand, importCommand, exportCommand, rubricCheckCommand, rubricTestCommand, rubricDiffCommand, statsAgreementCommand, statsStrengthsCommand, statsCalibrateCommand, userAddCommand, userListCommand, userDisableCommand, userResetPasswordCommand];

export function helpText(): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length));
  return [
    'Usage: plumbline <command> [options]',
    '',
    'Commands:',
    ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`),
    '',
    'Run "plumbline <command> --help" for a command\'s options.',
    'Environment: PLUMBLINE_DB (SQLite file), DATABASE_URL (postgres://…), HOST, PORT, DEBUG.',
  ].join('\n');
}

function findCommand(argv: string[]): { command: Command; rest: string[] } {
  for (const words of [2, 1]) {
    const name = argv.slice(0, words).join(' ');
    const command = COMMANDS.find((c) => c.name === name);
    if (command) return { command, rest: argv.slice(words) };
  }
  const group = COMMANDS.filter((c) => c.name.startsWith(`${argv[0]} `));
  if (group.length) {
    const sub = argv[1] ? `"${argv[1]}"` : 'nothing';
    throw new UsageError(`plumbline ${argv[0]}: unknown subcommand ${sub} (try: ${group.map((c) => c.name).join(', ')})`);
  }
  throw new UsageError(`plumbline: unknown command "${argv[0]}" — run "plumbline --help" for the list`);
}

const processIo: CommandIo = {
  out: (line) => process.stdout.write(`${line}\n`),
  err: (line) => process.stderr.write(`${line}\n`),
  env: process.env,
  stdin: process.stdin,
};

/**
 * Runs the CLI and returns the exit code: 0 done, 1 a problem with the input or setup,
 * 2 a usage mistake. Errors print as one line; DEBUG=1 adds the stack trace.
 */
export async function main(argv: string[], io: CommandIo = processIo): Promise<number> {
  try {
    if (argv.length === 0 || argv[0] === '--help' || argv[0] === '-h' || argv[0] === 'help') {
      io.out(helpText());
      return argv.length === 0 ? 2 : 0;
    }
    if (argv[0].startsWith('-')) throw new UsageError(`plumbline: unknown option ${argv[0]} — run "plumbline --help"`);
    const { command, rest } = findCommand(argv);
    if (rest.includes('--help') || rest.includes('-h')) {
      io.out(`Usage: ${command.usage}\n\n${command.summary}`);
      return 0;
    }
    return await command.run(parseArgs(rest, command.options, command.name), io);
  } catch (error) {
    if (error instanceof UserError) {
      io.err(`plumbline: ${error.message.replace(/^plumbline:? /, '')}`);
      if (io.env.DEBUG) io.err(error.stack ?? '');
      return error.exitCode;
    }
    const failure = storageFailure(error);
    if (failure) {
      io.err(`plumbline: ${failure.message}`);
      if (io.env.DEBUG && error instanceof Error) io.err(error.stack ?? '');
      return 1;
    }
    const message = error instanceof Error ? error.message : String(error);
    io.err(`plumbline: unexpected error: ${message}${io.env.DEBUG ? '' : ' (set DEBUG=1 for details)'}`);
    if (io.env.DEBUG && error instanceof Error) io.err(error.stack ?? '');
    return 1;
  }
}
