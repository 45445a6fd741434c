import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import type { Table } from '../../src/table/types.ts';
import { evaluateExpression } from '../../src/table/expr/index.ts';

// Identities of complex arithmetic (from memory; standard facts of complex analysis), checked as
// fast-check properties to ~1e-12 relative error. Magnitudes are bounded so the identities stay
// meaningful in double precision: each part is m·10^e with m in [−50, 50] and e in [−3, 1] (so
// |part| ≤ 500), and |z| ≥ 1e-3 where an identity needs z ≠ 0 (log, division, powers).
const RUNS = 400;
const part = fc
  .tuple(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -3, max: 1, noNaN: true }))
  .map(([m, e]) => m * Math.pow(10, e));
const complexArb = fc.record({ re: part, im: part });
const nonZero = complexArb.filter((z) => Math.hypot(z.re, z.im) >= 1e-3);
type C = { re: number; im: number };
const TOL = 1e-12;

/** One-row table with complex columns z and w. */
function table(z: C, w: C = { re: 1, im: 0 }): Table {
  const col = (name: string, c: C) => ({ name, kind: 'complex' as const, re: Float64Array.of(c.re), im: Float64Array.of(c.im), missing: new Uint8Array(1) });
  return { source: 'property', nRows: 1, columns: [col('z', z), col('w', w)] };
}

/** src and ref agree to TOL relative to max(1, scaleBy), in both parts. */
function close(t: Table, src: string, ref: string, scaleBy = 'abs(z)'): boolean {
  const a = evaluateExpression(t, src);
  const b = evaluateExpression(t, ref);
  const scale = Math.max(1, evaluateExpression(t, scaleBy).re[0]!);
  const dre = Math.abs(a.re[0]! - b.re[0]!) / scale;
  const dim = Math.abs((a.im ? a.im[0]! : 0) - (b.im ? b.im[0]! : 0)) / scale;
  return dre <= TOL && dim <= TOL;
}

const holds = (arb: fc.Arbitrary<C>, src: string, ref: string, scaleBy?: string, seed = 7) =>
  fc.assert(
    fc.property(arb, (z) => close(table(z), src, ref, scaleBy)),
    { numRuns: RUNS, seed },
  );

describe('complex identities (fast-check properties)', () => {
  it('z·conj(z) = |z|² and is real', () => {
    holds(complexArb, 'z * conj(z)', 'abs(z)^2', 'abs(z)^2', 1);
    fc.assert(
      fc.property(complexArb, (z) => evaluateExpression(table(z), 'z * conj(z)').im === null),
      { numRuns: RUNS, seed: 2 },
    );
  });
  it('|z|² = re(z)² + im(z)²', () => holds(complexArb, 'abs(z)^2', 're(z)^2 + im(z)^2', 'abs(z)^2', 3));
  it('exp(log z) = z', () => holds(nonZero, 'exp(log(z))', 'z', undefined, 4));
  it('(z/w)·w = z', () =>
    fc.assert(
      fc.property(complexArb, nonZero, (z, w) => close(table(z, w), '(z / w) * w', 'z')),
      { numRuns: RUNS, seed: 5 },
    ));
  it('sqrt(z)² = z and re(sqrt(z)) >= 0 (principal branch)', () => {
    holds(complexArb, 'sqrt(z)^2', 'z', undefined, 6);
    fc.assert(
      fc.property(complexArb, (z) => evaluateExpression(table(z), 're(sqrt(z))').re[0]! >= 0),
      { numRuns: RUNS, seed: 7 },
    );
  });
  it('sin² + cos² = 1 on |im z| <= 5', () =>
    fc.assert(
      fc.property(part, fc.double({ min: -5, max: 5, noNaN: true }), (re, im) => {
        const u = table({ re, im });
        const r = evaluateExpression(u, 'sin(z)^2 + cos(z)^2');
        const cs = evaluateExpression(u, 'abs(cos(z))^2 + abs(sin(z))^2').re[0]!;
        return Math.abs(r.re[0]! - 1) / cs < 1e-13 && Math.abs(r.im ? r.im[0]! : 0) / cs < 1e-13;
      }),
      { numRuns: RUNS, seed: 8 },
    ));
  it('tan z = sin z / cos z', () =>
    // tan is ill-conditioned near its poles: scale by the condition |z|·|sec² z| = |z|·|1 + tan² z|
    holds(complexArb, 'tan(z / 10)', 'sin(z / 10) / cos(z / 10)', 'abs(1 + tan(z / 10)^2) * (1 + abs(z / 10))', 9));
  it('z^w = exp(w log z) and z^3 = z·z·z', () => {
    fc.assert(
      fc.property(nonZero, complexArb, (z, w) => close(table(z, w), 'z^(w/50)', 'exp(w/50 * log(z))', 'abs(z^(w/50))')),
      { numRuns: RUNS, seed: 10 },
    );
    holds(complexArb, 'z^3', 'z * z * z', 'abs(z)^3', 11);
  });
  it('arg(z) = atan2(im z, re z) and abs(z) = hypot', () => {
    holds(nonZero, 'arg(z)', 'atan2(im(z), re(z))', undefined, 12);
    fc.assert(
      fc.property(complexArb, (z) => evaluateExpression(table(z), 'abs(z)').re[0] === Math.hypot(z.re, z.im)),
      { numRuns: RUNS, seed: 13 },
    );
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
