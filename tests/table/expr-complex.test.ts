import { describe, it, expect } from 'vitest';
import { Rng } from '../../src/util/rng.ts';
import type { Table } from '../../src/table/types.ts';
import { evaluateExpression } from '../../src/table/expr/index.ts';

// Identities of complex arithmetic (from memory; standard facts of complex analysis), checked on
// random complex values to ~1e-12 relative error.
const n = 2000;
const rng = new Rng(7);
const draw = (): Float64Array => Float64Array.from({ length: n }, () => rng.uniform(-50, 50) * Math.pow(10, rng.uniform(-3, 1)));
const cols = { ar: draw(), ai: draw(), br: draw(), bi: draw() };
const t: Table = {
  source: 'random',
  nRows: n,
  columns: [
    { name: 'z', kind: 'complex', re: cols.ar, im: cols.ai, missing: new Uint8Array(n) },
    { name: 'w', kind: 'complex', re: cols.br, im: cols.bi, missing: new Uint8Array(n) },
  ],
};
const TOL = 1e-12;

function expectClose(src: string, ref: string, scaleBy = 'abs(z)'): void {
  const a = evaluateExpression(t, src);
  const b = evaluateExpression(t, ref);
  const s = evaluateExpression(t, scaleBy).re;
  for (let i = 0; i < n; i++) {
    const scale = Math.max(1, s[i]!);
    const dre = Math.abs(a.re[i]! - b.re[i]!) / scale;
    const dim = Math.abs((a.im ? a.im[i]! : 0) - (b.im ? b.im[i]! : 0)) / scale;
    if (!(dre <= TOL && dim <= TOL)) {
      throw new Error(`${src} vs ${ref} at row ${i}: ${a.re[i]}+${a.im?.[i]}i vs ${b.re[i]}+${b.im?.[i]}i`);
    }
  }
}

describe('complex identities on random values', () => {
  it('z·conj(z) = |z|² and is real', () => {
    expectClose('z * conj(z)', 'abs(z)^2', 'abs(z)^2');
    const r = evaluateExpression(t, 'z * conj(z)');
    expect(r.im).toBeNull();
  });
  it('|z|² = re(z)² + im(z)²', () => expectClose('abs(z)^2', 're(z)^2 + im(z)^2', 'abs(z)^2'));
  it('exp(log z) = z', () => expectClose('exp(log(z))', 'z'));
  it('(z/w)·w = z', () => expectClose('(z / w) * w', 'z'));
  it('sqrt(z)² = z and re(sqrt(z)) >= 0 (principal branch)', () => {
    expectClose('sqrt(z)^2', 'z');
    const r = evaluateExpression(t, 're(sqrt(z))').re;
    expect(r.every((x) => x >= 0)).toBe(true);
  });
  it('sin² + cos² = 1 on |im z| <= 5', () => {
    const u: Table = {
      source: 'random',
      nRows: n,
      columns: [{ name: 'z', kind: 'complex', re: cols.ar, im: cols.ai.map((x) => x / 20), missing: new Uint8Array(n) }],
    };
    const r = evaluateExpression(u, 'sin(z)^2 + cos(z)^2');
    const cs = evaluateExpression(u, 'abs(cos(z))^2 + abs(sin(z))^2').re;
    for (let i = 0; i < n; i++) {
      expect(Math.abs(r.re[i]! - 1) / cs[i]!).toBeLessThan(1e-13);
      expect(Math.abs(r.im ? r.im[i]! : 0) / cs[i]!).toBeLessThan(1e-13);
    }
  });
  it('tan z = sin z / cos z', () =>
    // tan is ill-conditioned near its poles: scale by the condition |z|·|sec² z| = |z|·|1 + tan² z|
    expectClose('tan(z / 10)', 'sin(z / 10) / cos(z / 10)', 'abs(1 + tan(z / 10)^2) * (1 + abs(z / 10))'));
  it('z^w = exp(w log z) and z^3 = z·z·z', () => {
    expectClose('z^(w/50)', 'exp(w/50 * log(z))', 'abs(z^(w/50))');
    expectClose('z^3', 'z * z * z', 'abs(z)^3');
  });
  it('arg(z) = atan2(im z, re z) and abs(z) = hypot', () => {
    expectClose('arg(z)', 'atan2(im(z), re(z))');
    const a = evaluateExpression(t, 'abs(z)').re;
    for (let i = 0; i < n; i++) expect(a[i]).toBe(Math.hypot(cols.ar[i]!, cols.ai[i]!));
  });
});

describe('famous values', () => {
  const one: Table = { source: 'one', nRows: 1, columns: [] };
  it('arg(i) = π/2', () => expect(evaluateExpression(one, 'arg(i)').re[0]).toBe(Math.PI / 2));
  it("e^(iπ) = −1 (Euler's identity)", () => {
    const r = evaluateExpression(one, 'e^(i*pi)');
    expect(r.re[0]).toBeCloseTo(-1, 15);
    expect(Math.abs(r.im ? r.im[0]! : 0)).toBeLessThan(1e-15);
    const s = evaluateExpression(one, 'exp(i*pi) + 1');
    expect(Math.abs(s.re[0]!)).toBeLessThan(1e-15);
  });
  it('i² = −1 exactly, i^i = e^(−π/2) (principal value, from memory)', () => {
    const r = evaluateExpression(one, 'i^2');
    expect(r.re[0]).toBe(-1);
    expect(r.im).toBeNull();
    const s = evaluateExpression(one, 'i^i');
    expect(s.re[0]).toBeCloseTo(Math.exp(-Math.PI / 2), 15);
    expect(s.im).toBeNull();
  });
  it('sqrt(-1) = i, log(i) = iπ/2', () => {
    const r = evaluateExpression(one, 'sqrt(-1)');
    expect([r.re[0], r.im![0]]).toEqual([0, 1]);
    const l = evaluateExpression(one, 'log(i)');
    expect(l.re[0]).toBe(0);
    expect(l.im![0]).toBe(Math.PI / 2);
  });
});
