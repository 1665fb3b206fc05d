// Entry of a batch worker thread. A worker does not inherit the tsx loader the CLI was
// started with (bin/ringfall.mjs), so it registers tsx itself and then loads the
// TypeScript worker module.
import { register } from 'tsx/esm/api';

register();
await import('./batch-worker.ts');
