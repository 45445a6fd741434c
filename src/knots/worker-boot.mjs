// Worker bootstrap: register the TypeScript loader in this thread, then load the worker module.
// (Plain JavaScript because a worker's first module is loaded before any loader is registered.)
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
