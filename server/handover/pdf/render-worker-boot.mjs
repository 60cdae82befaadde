// Node 20 loads a worker's entry file before any --import hook, so this plain-JavaScript entry
// registers tsx's loader first and then loads the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./render-worker.ts');
