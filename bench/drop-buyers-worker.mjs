// The drop's buyers run in a worker thread. A worker does not inherit the parent's `--import tsx` (Node 20 keeps
// loader hooks per thread), so this entry registers tsx in the worker before it loads the TypeScript.
import { register } from 'tsx/esm/api';

register();
await import('./drop-buyers.ts');
