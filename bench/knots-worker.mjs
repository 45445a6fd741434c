// Worker entry for bench/knots.ts: registers tsx (as bin/surmise.js does), then loads the TypeScript.
import { register } from 'tsx/esm/api';

register();
await import('./knots.ts');
