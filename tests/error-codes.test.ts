/**
 * The error-code registry (src/error-codes.ts) against the source: every code raised in src/ is
 * listed (the compiler checks literal codes through SurmiseError's type; this also reads the text)
 * and every listed code is raised somewhere. And the wording of option keys for each layer.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ERROR_CODES, isErrorCode } from '../src/error-codes.ts';
import { SurmiseError, wordOptionError } from '../src/errors.ts';

const SRC = fileURLToPath(new URL('../src', import.meta.url));

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? sources(p) : /\.(ts|mjs)$/.test(n) ? [p] : [];
  });
}

const text = sources(SRC)
  .filter((p) => !p.endsWith('error-codes.ts'))
  .map((p) => readFileSync(p, 'utf8'))
  .join('\n');

/** Codes built from a prefix: writeFileAtomic's `codePrefix` + `.exists` / `.unwritable` (src/util/atomic-write.ts). */
const COMPOSED: Record<string, RegExp> = {
  'knots.exists': /codePrefix: 'knots'/,
  'knots.unwritable': /codePrefix: 'knots'/,
  'output.unwritable': /const prefix = opts\.codePrefix \?\? 'output'/,
};

describe('error codes', () => {
  it('every code raised in src/ is in the registry', () => {
    const raised = [...text.matchAll(/new SurmiseError\(\s*'([^']+)'/g)].map((m) => m[1]!);
    expect(raised.length).toBeGreaterThan(100);
    for (const c of raised) expect(isErrorCode(c), c).toBe(true);
  });

  it('every code in the registry is raised somewhere, with a one-line meaning', () => {
    for (const [code, meaning] of Object.entries(ERROR_CODES)) {
      expect(meaning.length, code).toBeGreaterThan(10);
      expect(meaning.includes('\n'), code).toBe(false);
      const raised = text.includes(`'${code}'`) || COMPOSED[code]?.test(text) === true;
      expect(raised, `${code} is listed but never raised`).toBe(true);
    }
  });
});

describe('library messages name option keys, never CLI flags', () => {
  it('no string in src/ outside src/cli names a --flag (the CLI words keys as flags)', () => {
    const offenders: string[] = [];
    for (const p of sources(SRC)) {
      if (p.includes(`${join('src', 'cli')}`) || p.endsWith('error-codes.ts')) continue;
      const code = readFileSync(p, 'utf8')
        .split('\n')
        .filter((l) => !/^\s*(\*|\/\/|\/\*)/.test(l))
        .join('\n');
      for (const m of code.matchAll(/'(?:[^'\\\n]|\\.)*'|`(?:[^`\\]|\\.)*`|"(?:[^"\\\n]|\\.)*"/g)) {
        if (/(^|[\s(['"`])--[a-z]/.test(m[0].slice(1))) offenders.push(`${p.slice(SRC.length + 1)}: ${m[0].slice(0, 60)}`);
      }
    }
    expect(offenders).toEqual([]);
  });
});

describe('wordOptionError: the option key worded for the layer', () => {
  const e = new SurmiseError('bound.badRhs', 'rows with rhs ≤ 0. With `skipInvalid` they are dropped and counted instead', { option: 'skipInvalid' });
  it('as a CLI flag', () => {
    expect(wordOptionError(e, () => '--skip-invalid').message).toBe('rows with rhs ≤ 0. With --skip-invalid they are dropped and counted instead');
  });
  it('as a configuration key path, keeping code and details', () => {
    const w = wordOptionError(e, () => 'bounds[0].skipInvalid');
    expect(w.message).toBe('rows with rhs ≤ 0. With bounds[0].skipInvalid they are dropped and counted instead');
    expect(w.code).toBe('bound.badRhs');
    expect(w.details?.option).toBe('skipInvalid');
  });
  it('"expected KEY to be" and further keys in details.also', () => {
    const f = new SurmiseError('split.conflict', '`folds` 3 and `split` random ask for different splits', { option: 'split', also: ['folds'] });
    expect(wordOptionError(f, (k) => `--${k}`).message).toBe('--folds 3 and --split random ask for different splits');
    const g = new SurmiseError('option.badValue', 'expected seeds to be an integer ≥ 1, got 0', { option: 'seeds' });
    expect(wordOptionError(g, () => 'attribution.seeds').message).toBe('expected attribution.seeds to be an integer ≥ 1, got 0');
  });
  it('leaves an error alone that names no option, or was worded already', () => {
    const h = new SurmiseError('table.empty', 'x.csv is empty');
    expect(wordOptionError(h, () => '--x')).toBe(h);
    const once = wordOptionError(e, () => '--skip-invalid');
    expect(wordOptionError(once, () => 'bounds[0].skipInvalid')).toBe(once);
  });
});
