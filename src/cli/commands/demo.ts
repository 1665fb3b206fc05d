import type { Command } from 'commander';
import type { CommandContext } from '../main';

/** `ringfall demo` (CONTRACT.md). Placeholder until its issue lands: exits 2 saying so. */
export function registerDemo(program: Command, context: CommandContext): void {
  program
    .command('demo')
    .description('not built yet')
    .allowUnknownOption(true)
    .allowExcessArguments(true)
    .action(() => {
      process.stderr.write('ringfall demo: not built yet.\n');
      context.setExitCode(2);
    });
}
