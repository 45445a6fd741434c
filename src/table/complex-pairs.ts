/**
 * The complex-pair rule as a command-line option: `--complex-pairs auto|none|NAME=RE,IM`
 * (the last repeatable), parsed once at the entry point into the readers' `ComplexPairs`.
 */
import { SurmiseError } from '../errors.ts';
import type { ComplexPairs } from './columns.ts';

/**
 * `complexPairs` values (in order given; the CLI's `--complex-pairs`) into a rule: none given → 'auto'; a single `auto` or
 * `none`; or one or more `NAME=RE,IM` (each joins columns RE and IM into complex NAME). Mixing
 * `auto`/`none` with pairs, a name given twice, or a column used by two pairs is
 * `cli.badComplexPairs`, naming `option` and the value.
 */
export function parseComplexPairsOption(values: readonly string[], option = '`complexPairs`'): ComplexPairs {
  const bad = (v: string, why: string): never => {
    throw new SurmiseError(
      'cli.badComplexPairs',
      `${option} ${v}: ${why}; expected auto, none, or NAME=RE,IM (repeatable), e.g. ${option} za=za_re,za_im`,
      { option: 'complexPairs' },
    );
  };
  if (values.length === 0) return 'auto';
  const words = values.map((v) => v.trim());
  for (const w of ['auto', 'none'] as const) {
    if (!words.includes(w)) continue;
    if (words.length > 1) bad(words.join(' '), `'${w}' cannot be combined with other ${option} values`);
    return w;
  }
  const pairs: Array<{ name: string; re: string; im: string }> = [];
  const names = new Set<string>();
  const parts = new Map<string, string>();
  for (const v of words) {
    const eq = v.indexOf('=');
    if (eq < 0) bad(v, `'${v}' is neither auto, none nor NAME=RE,IM`);
    const name = v.slice(0, eq).trim();
    const cols = v.slice(eq + 1).split(',').map((s) => s.trim());
    if (name === '') bad(v, 'the name before = is empty');
    if (cols.length !== 2 || cols[0] === '' || cols[1] === '') bad(v, 'expected two column names after =, separated by a comma');
    const [re, im] = cols as [string, string];
    if (re === im) bad(v, `the real and imaginary parts are the same column '${re}'`);
    if (names.has(name)) bad(v, `the pair '${name}' is given twice`);
    for (const c of [re, im]) {
      const other = parts.get(c);
      if (other !== undefined) bad(v, `column '${c}' is already a part of pair '${other}'`);
      parts.set(c, name);
    }
    names.add(name);
    pairs.push({ name, re, im });
  }
  return pairs;
}
