/**
 * The fast decimal reader (scanDecimal / scanDecimalBytes, used by parseNumberText and the CSV
 * reader) against the outside reference: ECMAScript Number() (ECMA-262 StringToNumber; V8 rounds
 * correctly, round-half-to-even). Equality is bit for bit (Object.is tells -0 from 0).
 */
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { parseNumberText, scanDecimal, scanDecimalBytes, scannedValue } from '../../src/table/cell.ts';
import { readTable } from '../../src/table/read.ts';
import type { RealColumn, LabelColumn } from '../../src/table/types.ts';
import { put, tempDir } from './helpers.ts';

/** scanDecimal over the whole string: the value, or undefined when it declines. */
function fast(s: string): number | undefined {
  return scanDecimal(s, 0, s.length, -1) === s.length ? scannedValue[0] : undefined;
}
function fastBytes(s: string): number | undefined {
  return scanDecimalBytes(Buffer.from(s, 'latin1'), 0, s.length, -1) === s.length ? scannedValue[0] : undefined;
}

const digits = (min: number, max: number) =>
  fc.array(fc.integer({ min: 0, max: 9 }), { minLength: min, maxLength: max }).map((d) => d.join(''));

/** Random decimal literals: sign, leading zeros, 1–22 significant digits, fraction, exponent. */
const decimalText = fc
  .record({
    sign: fc.constantFrom('', '-', '+'),
    zeros: fc.constantFrom('', '0', '00', '000000'),
    int: digits(0, 22),
    frac: fc.option(digits(0, 22), { nil: undefined }),
    exp: fc.option(fc.record({ e: fc.constantFrom('e', 'E'), s: fc.constantFrom('', '-', '+'), v: fc.integer({ min: 0, max: 340 }) }), {
      nil: undefined,
    }),
  })
  .map(({ sign, zeros, int, frac, exp }) => {
    let m = zeros + int + (frac === undefined ? '' : `.${frac}`);
    if (!/\d/.test(m)) m += '7';
    return sign + m + (exp ? `${exp.e}${exp.s}${exp.v}` : '');
  });

describe('fast decimal reading is bit-identical to Number() (ECMA-262 StringToNumber)', () => {
  it('random decimal strings: signs, leading zeros, 1–22 digit significands, exponents up to ±340', () => {
    let taken = 0;
    let all = 0;
    fc.assert(
      fc.property(decimalText, (s) => {
        const want = Number(s);
        const got = fast(s);
        all++;
        if (got !== undefined) {
          taken++;
          expect(Object.is(got, want), `${s}: ${got} vs Number ${want}`).toBe(true);
        }
        expect(Object.is(fastBytes(s), got), s).toBe(true);
        expect(Object.is(parseNumberText(s), want), s).toBe(true);
      }),
      { numRuns: 20000, seed: 1990 },
    );
    // the fast path must actually be exercised (it declines only for > 19 digits or |e| > 22)
    expect(taken / all).toBeGreaterThan(0.15);
  });

  it('15 to 20 digit significands with powers of ten within ±22 (the double-double path)', () => {
    const long = fc
      .tuple(fc.constantFrom('', '-'), fc.integer({ min: 1, max: 9 }), digits(14, 19), fc.integer({ min: -22, max: 22 }), fc.nat(20))
      .map(([sg, d0, rest, e, dot]) => {
        const m = `${d0}${rest}`;
        const p = Math.min(dot, m.length);
        return `${sg}${m.slice(0, p) || '0'}.${m.slice(p)}e${e}`;
      });
    let taken = 0;
    fc.assert(
      fc.property(long, (s) => {
        const got = fast(s);
        if (got !== undefined) {
          taken++;
          expect(Object.is(got, Number(s)), s).toBe(true);
        }
        expect(Object.is(parseNumberText(s), Number(s)), s).toBe(true);
      }),
      { numRuns: 20000, seed: 2024 },
    );
    expect(taken).toBeGreaterThan(10000);
  });

  it('shortest round-trip texts of random doubles, including subnormals (Number::toString, toPrecision, toExponential)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 1, max: 21 }), (x, k) => {
        for (const s of [String(x), x.toPrecision(k), x.toExponential(k - 1), x.toFixed(Math.min(k, 20))]) {
          expect(Object.is(parseNumberText(s), Number(s)), s).toBe(true);
          const got = fast(s);
          if (got !== undefined) expect(Object.is(got, Number(s)), s).toBe(true);
        }
      }),
      { numRuns: 20000, seed: 7 },
    );
  });

  it('exact ties round half to even and near-ties stay exact (IEEE 754 roundTiesToEven, from memory)', () => {
    // 2^53 + 1 lies halfway between 2^53 and 2^53 + 2; 2^54 + 2 halfway between 2^54 and 2^54 + 4
    expect(parseNumberText('9007199254740993')).toBe(9007199254740992);
    expect(parseNumberText('18014398509481986')).toBe(18014398509481984);
    expect(parseNumberText('18014398509481990')).toBe(18014398509481992);
    for (const s of [
      '9007199254740993',
      '9007199254740993.000',
      '9007199254740992.999',
      '9007199254740993.0001',
      '900719925474099.3e1',
      '0.9007199254740993e16',
      '1.0000000000000002220446049250313',
      '1.00000000000000011102230246251565',
      '0.1000000000000000055511151231257827',
      '4.9e-324',
      '2.4703282292062327e-324',
      '2.2250738585072011e-308',
      '1.7976931348623157e308',
      '1.7976931348623159e308',
      '-0',
      '-0.000e5',
      '0e99999',
    ])
      expect(Object.is(parseNumberText(s), Number(s)), s).toBe(true);
  });

  it('takes common cells on the fast path and stops at the separator', () => {
    expect(fast('1.5')).toBe(1.5);
    expect(fast('-12.345678901234567')).toBe(-12.345678901234567);
    expect(Object.is(fast('-0'), -0)).toBe(true);
    expect(scanDecimal('12,-3.5e2\n', 0, 9, 44)).toBe(2);
    expect(scannedValue[0]).toBe(12);
    expect(scanDecimal('12,-3.5e2\n', 3, 9, 44)).toBe(9);
    expect(scannedValue[0]).toBe(-350);
    // what Number() reads leniently or rejects is declined here and left to the strict checks
    for (const s of ['', ' 1', '1 ', '0x10', '1_000', '1e', 'e5', '.', '-', '+.', '1.2.3', 'inf', 'nan', '1e+', '--1', '12abc'])
      expect(fast(s), s).toBeUndefined();
  });
});

describe('CSV reading through the byte path keeps every value and text', () => {
  it('values equal Number() of the written text across 4 MiB chunks, with a BOM, a long line and UTF-8 arriving late', async () => {
    const dir = tempDir('fastnum');
    const rng = fc.sample(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e12, max: 1e12 }), { numRuns: 60000, seed: 11 });
    const texts: string[] = [];
    const labels: string[] = [];
    const lines = ['x,name'];
    for (let i = 0; i < rng.length; i++) {
      const x = rng[i]!;
      const t = i % 3 === 0 ? String(x) : i % 3 === 1 ? x.toPrecision(1 + (i % 19)) : x.toExponential(i % 20);
      // a line longer than half a chunk (the byte buffer grows) and non-ASCII after the first chunk
      const label = i === 30000 ? 'L'.repeat(3_000_000) : i === 50000 ? 'Zürich ✓' : `k${i}`;
      texts.push(t);
      labels.push(label);
      lines.push(`${t},${label}`);
    }
    const file = put(dir, 'late-utf8.csv', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(lines.join('\r\n') + '\r\n', 'utf8')]));
    const t = await readTable(file);
    expect(t.nRows).toBe(rng.length);
    expect(t.columns.map((c) => c.name)).toEqual(['x', 'name']);
    const x = t.columns[0] as RealColumn;
    const name = t.columns[1] as LabelColumn;
    let same = 0;
    for (let i = 0; i < texts.length; i++) if (Object.is(x.values[i], Number(texts[i]))) same++;
    expect(same).toBe(texts.length);
    expect(name.values[30000]!.length).toBe(3_000_000);
    expect(name.values[50000]).toBe('Zürich ✓');
    expect(name.values[59999]).toBe('k59999');
    expect(t.lines![59999]).toBe(60001);
  });

  it('a bad UTF-8 byte after an ASCII first chunk is still table.badEncoding', async () => {
    const dir = tempDir('fastnum');
    const body = 'a,b\n' + '1,2\n'.repeat(1_200_000);
    const file = put(dir, 'late-bad.csv', Buffer.concat([Buffer.from(body), Buffer.from([0x33, 0x2c, 0xff, 0x0a])]));
    await expect(readTable(file)).rejects.toMatchObject({ code: 'table.badEncoding' });
  });
});

describe('the byte path for ASCII files reads exactly what the UTF-8 string path reads', () => {
  // Differential check (internal consistency, common practice): the same rows under a header
  // `a,b,c` (ASCII: read from bytes) and `a,b,cé` (UTF-8: read from decoded strings) must give the
  // same columns, missing masks, line numbers, notes, or the same error code.
  const cell = fc.constantFrom('1.5', '-0', '12345678901234567', '1e400', '0.1e-30', 'NA', '', 'abc', ' 2 ', '"3,5"', '"q""x"', '1\r2', '"a\nb"', '+.5', '7.', 'inf', '1.5+2j');
  const row = fc.tuple(cell, cell, cell).map((c) => c.join(','));
  const rows = fc.array(fc.tuple(row, fc.constantFrom('\n', '\r\n'), fc.constantFrom('', '', '', '\n', '\r\n')), { minLength: 1, maxLength: 12 });
  it('random rows with CRLF/LF, blank lines, quotes, lone CR, missing and text cells', async () => {
    const dir = tempDir('fastnum');
    let k = 0;
    const outcome = async (text: string) => {
      const file = put(dir, `d${k++}.csv`, Buffer.from(text, 'utf8'));
      try {
        const t = await readTable(file);
        return { t, code: '' };
      } catch (e) {
        return { t: null, code: (e as { code?: string }).code ?? String(e) };
      }
    };
    await fc.assert(
      fc.asyncProperty(rows, fc.boolean(), async (rs, lastBreak) => {
        let body = rs.map(([r, eol, blank]) => r + eol + blank).join('');
        if (!lastBreak) body = body.replace(/\r?\n$/, '');
        const ascii = await outcome('a,b,c\n' + body);
        const utf8 = await outcome('a,b,cé\n' + body);
        expect(ascii.code).toBe(utf8.code);
        if (ascii.t && utf8.t) {
          expect(ascii.t.nRows).toBe(utf8.t.nRows);
          expect(Array.from(ascii.t.lines ?? [])).toEqual(Array.from(utf8.t.lines ?? []));
          expect(ascii.t.notes).toEqual(utf8.t.notes?.map((n) => n.replace('cé', 'c')));
          for (let j = 0; j < 3; j++) {
            const x = ascii.t.columns[j]!;
            const y = utf8.t.columns[j]!;
            expect(x.kind).toBe(y.kind);
            expect(Array.from(x.missing)).toEqual(Array.from(y.missing));
            if (x.kind === 'label') expect(x.values).toEqual((y as LabelColumn).values);
            else if (x.kind === 'complex') expect([Array.from(x.re), Array.from(x.im)]).toEqual([Array.from((y as typeof x).re), Array.from((y as typeof x).im)]);
            else expect(Array.from(x.values).map((v) => Object.is(v, -0) ? '-0' : v)).toEqual(Array.from((y as RealColumn).values).map((v) => Object.is(v, -0) ? '-0' : v));
          }
        }
      }),
      { numRuns: 300, seed: 4180 },
    );
  });
});
