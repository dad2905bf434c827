// Worker entry: registers the TypeScript loader in this thread, then loads the worker proper.
import { register } from 'tsx/esm/api';

register();
await import('./engine-task-worker.ts');
