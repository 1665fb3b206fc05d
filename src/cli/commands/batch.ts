import type { Command } from 'commander';
import type { CommandContext } from '../main';

/** `ringfall batch` (CONTRACT.md). Placeholder until its issue lands: exits 2 saying so. */
export function registerBatch(program: Command, context: CommandContext): void {
  program
    .command('batch')
    .description('not built yet')
    .allowUnknownOption(true)
    .allowExcessArguments(true)
    .action(() => {
      process.stderr.write('ringfall batch: not built yet.\n');
      context.setExitCode(2);
    });
}
