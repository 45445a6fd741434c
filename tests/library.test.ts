import { describe, it, expect } from 'vitest';
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const entry = fileURLToPath(new URL('../src/library.js', import.meta.url));

describe('the package entry a Node user imports', () => {
  it('loads without a build step and fits Anscombe set I (Anscombe 1973: y ≈ 3.0001 + 0.5001x)', () => {
    // data: F. J. Anscombe, "Graphs in Statistical Analysis", The American Statistician 27 (1973), set I
    const script = `
      const s = await import(${JSON.stringify('file://' + entry)});
      const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
      const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
      const t = s.table.tableFromRecords(x.map((v, i) => ({ x: v, y: y[i] })));
      const f = s.fitRelation(t, { target: 'y', terms: ['x'] });
      console.log(JSON.stringify(f.terms.map((q) => q.coef)));
    `;
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8' });
    const [a, b] = JSON.parse(out.trim()) as number[];
    expect(a).toBeCloseTo(3.000091, 5); // intercept, reference-checks (computed and cross-checked)
    expect(b).toBeCloseTo(0.500091, 5); // slope
  });

  it("runs the README's library example from the project folder and prints what the README says", () => {
    // the only ```js block under "## Library use"
    const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
    const section = readme.slice(readme.indexOf('## Library use'));
    const code = /```js\n([\s\S]*?)```/.exec(section)![1]!;
    expect(code).toContain("from 'surmise'");
    const root = fileURLToPath(new URL('..', import.meta.url));
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', code], { encoding: 'utf8', cwd: root }).trim().split('\n');
    // the README's "→" lines are the expected output (Seifert's algorithm: g = (c − n + 1)/2; |σ| ≤ 2g with equality for T(2,3))
    const expected = [...code.matchAll(/\/\/ → (.*)/g)].map((m) => m[1]!.trim());
    expect(out).toEqual(expected);
  }, 120_000);
});
