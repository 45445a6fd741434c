import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

// The data flow of the layout rules: table → learn → attribute → relate / bound → report; knots
// produces tables. A stage imports only util, errors and the stages before it (type imports too).
const EARLIER: Record<string, string[]> = {
  table: [],
  knots: ['table'],
  learn: ['table'],
  attribute: ['table', 'learn'],
  relate: ['table'],
  bound: ['table'],
  report: ['table', 'learn', 'attribute', 'relate', 'bound'],
};
const src = fileURLToPath(new URL('../src', import.meta.url));

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

describe('layout: a stage never imports a later one', () => {
  for (const [stage, allowed] of Object.entries(EARLIER)) {
    it(`${stage} imports only ${[...allowed, 'util', 'errors'].join(', ')}`, () => {
      const bad: string[] = [];
      for (const f of files(join(src, stage))) {
        for (const m of readFileSync(f, 'utf8').matchAll(/(?:from|import)\s*\(?\s*'(\.[^']+)'/g)) {
          const target = relative(src, resolve(dirname(f), m[1]!)).split(sep)[0]!;
          if (target === stage || target === 'util' || target === 'errors.ts' || target === 'version.ts' || allowed.includes(target)) continue;
          bad.push(`${relative(src, f)} → ${m[1]}`);
        }
      }
      expect(bad).toEqual([]);
    });
  }
});
