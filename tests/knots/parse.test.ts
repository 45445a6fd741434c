import { describe, it, expect } from 'vitest';
import { parseDiagram, detectKind, naturalSlope, computeInvariants, splitDiagramLines } from '../../src/knots/index.ts';
import { SurmiseError } from '../../src/errors.ts';
import { codeOf } from '../helpers/errors.ts';


describe('reading codes', () => {
  it('accepts the trefoil in every form with the same invariants (standard table, from memory)', () => {
    const forms = ['[[1,5,2,4],[3,1,4,6],[5,3,6,2]]', 'X[1,5,2,4] X[3,1,4,6] X[5,3,6,2]', 'PD[X[1,5,2,4], X[3,1,4,6], X[5,3,6,2]]', '1 1 1', '[1, 1, 1]', '2: 1 1 1', '{"strands": 2, "word": [1, 1, 1]}', 'DT[4,6,2]'];
    for (const f of forms) {
      const r = computeInvariants(parseDiagram(f));
      expect(r.determinant, f).toBe(3);
      expect(Math.abs(r.signature!), f).toBe(2);
      expect(r.alexanderText, f).toBe('t - 1 + t^-1');
    }
    expect(computeInvariants(parseDiagram('4 6 2', 'dt')).determinant).toBe(3);
  });

  it('detects kinds and refuses all-even integer lists without --kind', () => {
    expect(detectKind('1 -2 1 -2')).toBe('braid');
    expect(detectKind('DT[4,6,2]')).toBe('dt');
    expect(detectKind('X[1,5,2,4]')).toBe('pd');
    expect(codeOf(() => detectKind('4 6 2'))).toBe('knots.ambiguousKind');
    // σ2³ on 3 strands: a trefoil on strands 2–3 and a split unknot (so Δ = 0, det = 0)
    const split = computeInvariants(parseDiagram('2 2 2', 'braid'));
    expect([split.components, split.determinant, split.alexanderText, split.signature]).toEqual([2, 0, '0', -2]);
  });

  it('error codes for bad input', () => {
    expect(codeOf(() => parseDiagram('X[1,5,2,4] X[3,1,4,6] X[5,3,6,7]'))).toBe('knots.badEdge');
    expect(codeOf(() => parseDiagram('3:', 'braid'))).toBe('knots.emptyBraid');
    expect(codeOf(() => parseDiagram('3: 1 3'))).toBe('knots.generatorRange');
    expect(codeOf(() => parseDiagram('X[1,5,2'))).toBe('knots.parse');
    expect(codeOf(() => parseDiagram('1 1 x'))).toBe('knots.parse');
    expect(codeOf(() => parseDiagram('DT[4,6,6]'))).toBe('knots.parse');
    // the virtual trefoil: the standard trefoil with one crossing's rotation reversed lives on a
    // torus, not the sphere (from memory: L. Kauffman, "Virtual knot theory", Europ. J. Combin. 20 (1999))
    expect(codeOf(() => parseDiagram('X[1,4,2,5] X[3,1,4,6] X[5,3,6,2]'))).toBe('knots.nonPlanar');
    // a DT code with no planar realisation (found non-realisable by the exhaustive search; the
    // standard 5-crossing codes are 6 8 10 2 4 and 4 8 10 2 6 only)
    expect(codeOf(() => parseDiagram('DT[4,6,8,10,2]'))).toBe('knots.nonPlanar');
  });

  it('messages name the crossing', () => {
    expect(() => parseDiagram('X[1,5,2,4] X[3,1,4,6] X[5,3,6,7]')).toThrow(/edge label 2 is used 1 time \(in crossing 1: X\[1,5,2,4\]\)/);
    expect(() => parseDiagram('X[1,4,2,5] X[3,1,4,6] X[5,3,6,2]')).toThrow(/V − E \+ F = 3 − 6 \+ 3 = 0, not 2/);
  });

  it('lines: names, comments, header, duplicates', () => {
    const s = splitDiagramLines('name\tcode\n# c\n\na\t1 1 1\n1 -2 1 -2\n', 'f.txt');
    expect(s.map((x) => [x.name, x.code, x.line, x.column])).toEqual([['a', '1 1 1', 4, 3], ['row5', '1 -2 1 -2', 5, 1]]);
    expect(codeOf(() => splitDiagramLines('a\t1\na\t1 1\n', 'f.txt'))).toBe('knots.duplicateName');
    // `name<TAB>` with nothing after it is a name without a code, not the code 'name'
    expect(() => splitDiagramLines('ok\t1 1 1\nb\t  \n', 'f.txt')).toThrow('f.txt:2: b: no code after the name');
    expect(codeOf(() => splitDiagramLines('a\t\n', 'f.txt'))).toBe('knots.parse');
  });
});

describe('natural slope re(λ/μ)', () => {
  it('a real longitude over a purely imaginary meridian gives slope 0 (common practice: amphichiral knots such as the figure-eight have rectangular cusps)', () => {
    expect(naturalSlope(2 * Math.sqrt(3), 0, 0, 1)).toBe(0);
    expect(naturalSlope(5, 0, 0, -0.7)).toBe(0);
  });
  it('agrees with complex division done by hand: (3 + 4i)/(1 + 2i) = (11 − 2i)/5', () => {
    expect(naturalSlope(3, 4, 1, 2)).toBeCloseTo(11 / 5, 15);
    expect(Number.isNaN(naturalSlope(1, 1, 0, 0))).toBe(true);
  });
});
