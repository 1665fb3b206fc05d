import type { Command } from 'commander';
import type { CommandContext } from '../main';

/** `ringfall plan` (CONTRACT.md). Placeholder until its issue lands: exits 2 saying so. */
export function registerPlan(program: Command, context: CommandContext): void {
  program
    .command('plan')
    .description('not built yet')
    .allowUnknownOption(true)
    .allowExcessArguments(true)
    .action(() => {
      process.stderr.write('ringfall plan: not built yet.\n');
      context.setExitCode(2);
    });
}
