// Entry of a batch worker thread when the CLI runs from the sources (package-files.ts;
// the package runs dist/batch-worker.js instead). A worker does not inherit a loader from
// the CLI's thread, so it registers tsx itself and then loads the TypeScript worker
// module. It uses tsx's CommonJS hook: it transforms in this thread, where the ESM hook
// starts a loader thread of its own per worker, which made a worker take about three
// times as long to be ready (measured: ~0.4 s against ~1.2 s). So nothing the worker
// loads may use top-level await or import.meta.
import { createRequire } from 'node:module';
import { register } from 'tsx/cjs/api';

register();
createRequire(import.meta.url)('./batch-worker.ts');
