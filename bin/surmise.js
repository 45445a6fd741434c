#!/usr/bin/env node
// Runs the TypeScript sources through tsx (a regular dependency), so a fresh `npm install` is enough.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv);
