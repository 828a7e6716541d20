// Entry of a compute thread: registers the TypeScript loader the server runs under (tsx), then loads the
// worker proper. A thread's first module is loaded before inherited `--import` hooks apply, hence this file.
import { register } from 'tsx/esm/api';

register();
await import('./batch-worker.ts');
