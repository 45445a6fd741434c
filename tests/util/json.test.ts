import { describe, it, expect } from 'vitest';
import { jsonReplacer, toJson } from '../../src/util/json.ts';

describe('toJson: the one JSON convention for non-finite numbers', () => {
  it('writes NaN and ±Infinity as the strings String(x) gives, which Number() reads back (ECMA-262 ToNumber)', () => {
    const text = toJson({ a: NaN, b: Infinity, c: -Infinity, d: 1.5, e: null });
    // RFC 8259 §6: JSON has no NaN or Infinity literal, so the text must still parse as JSON
    const back = JSON.parse(text) as Record<string, unknown>;
    expect(back).toEqual({ a: 'NaN', b: 'Infinity', c: '-Infinity', d: 1.5, e: null });
    expect(Number(back.a)).toBeNaN();
    expect(Number(back.b)).toBe(Infinity);
    expect(Number(back.c)).toBe(-Infinity);
  });
  it('keeps missing (null) apart from not-a-number, which plain JSON.stringify merges', () => {
    expect(JSON.stringify([NaN, null])).toBe('[null,null]');
    expect(toJson([NaN, null])).toBe('["NaN",null]');
  });
  it('writes typed arrays as arrays, non-finite entries included, and indents like JSON.stringify', () => {
    expect(JSON.parse(toJson({ v: Float64Array.of(1, NaN, -0.5) }))).toEqual({ v: [1, 'NaN', -0.5] });
    expect(toJson({ a: [1] }, 2)).toBe(JSON.stringify({ a: [1] }, null, 2));
    expect(JSON.stringify({ x: Int32Array.of(3) }, jsonReplacer)).toBe('{"x":[3]}');
  });
});
