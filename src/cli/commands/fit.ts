import type { Command } from 'commander';
import type { CommandContext } from '../main';

/** `ringfall fit` (CONTRACT.md). Placeholder until its issue lands: exits 2 saying so. */
export function registerFit(program: Command, context: CommandContext): void {
  program
    .command('fit')
    .description('not built yet')
    .allowUnknownOption(true)
    .allowExcessArguments(true)
    .action(() => {
      process.stderr.write('ringfall fit: not built yet.\n');
      context.setExitCode(2);
    });
}
