import { Command, CommanderError } from 'commander';
import { isRingfallError } from '../core/errors';
import { printable } from '../core/text/printable';
import { registerPredict } from './commands/predict';
import { registerFit } from './commands/fit';
import { registerBatch } from './commands/batch';
import { registerPlan } from './commands/plan';
import { registerDemo } from './commands/demo';
import { exitCodeFor, exitStatus, worseStatus } from './exit-codes';

/**
 * Run the ringfall CLI with `argv` (as process.argv). Returns the exit status
 * (CONTRACT.md, exit-codes.ts): 0 done and every check passed; 1 a check failed; 2 usage
 * or input error; 3 no check failed but one is inconclusive; 70 internal error (a defect).
 */
export async function main(argv: readonly string[]): Promise<number> {
  const debug = argv.includes('--debug');
  if (argv.length <= 2) {
    // a bare `ringfall` is a usage error: a short usage on stderr and exit 2, as git, cp and
    // npm do (common practice); `ringfall --help` prints the whole help and exits 0
    process.stderr.write(shortUsage);
    return 2;
  }
  // A reader that stops early (`ringfall … | head`) closes the pipe: nothing more to say,
  // so end quietly instead of printing a stack trace for EPIPE.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw error;
  });
  const program = new Command('ringfall')
    .description('Reconcile gaussmeter survey readings with coil physics.')
    .option('--debug', 'print stack traces on errors')
    .exitOverride()
    .configureOutput({
      writeErr: (text) => process.stderr.write(text),
      outputError: (text, write) => write(usageErrorLine(text, argv, program.commands.map((command) => command.name()))),
    });
  const status = { code: 0 };
  const context = { setExitCode: (code: number) => { status.code = worseStatus(status.code, code); } };
  registerPredict(program, context);
  registerFit(program, context);
  registerBatch(program, context);
  registerPlan(program, context);
  registerDemo(program, context);
  try {
    await program.parseAsync(argv as string[]);
    return status.code;
  } catch (error) {
    if (error instanceof CommanderError) {
      // help and version exit 0; everything else commander reports is a usage error
      return error.exitCode === 0 ? exitStatus.passed : exitStatus.input;
    }
    if (isRingfallError(error)) {
      process.stderr.write(`ringfall: ${printable(error.message)}\n`);
      if (debug) process.stderr.write(`${error.stack ?? ''}\n`);
      return worseStatus(status.code, exitCodeFor(error));
    }
    process.stderr.write(`ringfall: internal error: ${printable((error as Error)?.message ?? String(error))}\n`);
    if (debug) process.stderr.write(`${(error as Error)?.stack ?? ''}\n`);
    else process.stderr.write('Run again with --debug for details, and report it with the input file.\n');
    return exitStatus.internal;
  }
}

/** What a bare `ringfall` prints (stderr, exit 2). */
export const shortUsage =
  'Usage: ringfall <command> [options]   (commands: fit, predict, batch, plan, demo)\n' +
  'Try "ringfall demo" for a sample report, or "ringfall --help" and "ringfall <command> --help" for the options.\n';

/**
 * A usage error commander reports ("error: unknown option '--x'\n(Did you mean --y?)\n")
 * as the one line CONTRACT.md asks for: what was wrong, then the help of the command named
 * in `argv` (one of `commands`) or of ringfall.
 * @example usageErrorLine("error: missing required argument 'files'\n", ['node', 'ringfall', 'fit'], ['fit'])
 *   // ringfall: missing required argument 'files'. See "ringfall fit --help" for the usage.\n
 */
export function usageErrorLine(text: string, argv: readonly string[], commands: readonly string[]): string {
  // commander's lines joined by a split (linear: `\s*\n` backtracked over long runs of spaces
  // in an argument), then the argument's own control characters shown escaped
  const joined = text.trim().split('\n').map((line) => line.trim()).filter((line) => line !== '').join(' ');
  const what = printable(joined.replace(/^error: /, '').replace(' (Did you mean', ' (did you mean').replace(/\.$/, ''), 300);
  const command = argv.slice(2).find((arg) => !arg.startsWith('-'));
  const help = command !== undefined && commands.includes(command) ? `ringfall ${command} --help` : 'ringfall --help';
  return `ringfall: ${what}. See "${help}" for the usage.\n`;
}
