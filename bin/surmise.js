#!/usr/bin/env node
// The CLI: the compiled JavaScript in build/ when it is up to date (bin/build-fresh.js), else the
// TypeScript sources through tsx (a regular dependency), so a fresh `npm install` is enough.
import { freshBuild } from './build-fresh.js';

const root = new URL('../', import.meta.url);
let main;
if (freshBuild(root)) {
  ({ main } = await import(new URL('build/cli/main.js', root).href));
} else {
  const { register } = await import('tsx/esm/api');
  register();
  ({ main } = await import(new URL('src/cli/main.ts', root).href));
}
process.exitCode = await main(process.argv);
