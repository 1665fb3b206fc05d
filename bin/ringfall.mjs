#!/usr/bin/env node
// Entry point installed as the package's bin. Runs the TypeScript CLI through tsx,
// so a checkout works right after `npm ci` with no build step.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv);
