import type { Command } from 'commander';
import type { CommandContext } from '../main';

/** `ringfall predict` (CONTRACT.md). Placeholder until its issue lands: exits 2 saying so. */
export function registerPredict(program: Command, context: CommandContext): void {
  program
    .command('predict')
    .description('not built yet')
    .allowUnknownOption(true)
    .allowExcessArguments(true)
    .action(() => {
      process.stderr.write('ringfall predict: not built yet.\n');
      context.setExitCode(2);
    });
}
