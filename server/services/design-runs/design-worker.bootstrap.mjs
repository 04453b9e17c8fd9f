// Entry of a design-run worker thread: TypeScript through tsx's loader (the server itself runs
// under tsx; a worker thread needs the loader registered in its own thread), then the worker.
import { register } from 'tsx/esm/api';

register();
await import('./design.worker.ts');
