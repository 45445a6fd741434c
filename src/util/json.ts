/**
 * The one JSON writer of every JSON output (results.json, rank.json, each command's --json).
 * JSON has no NaN or ±Infinity (RFC 8259 §6), and JSON.stringify would write them as null,
 * indistinguishable from "missing". Convention: a non-finite number is written as the string
 * "NaN", "Infinity" or "-Infinity" (what String(x) gives; Number(s) reads it back); a typed
 * array is written as an array of numbers.
 */

/** The replacer of the convention, for JSON.stringify. */
export function jsonReplacer(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) return Array.from(value as unknown as ArrayLike<number>);
  return value;
}

/** `value` as JSON text under the convention; `indent` as in JSON.stringify (default none). */
export function toJson(value: unknown, indent?: number): string {
  return JSON.stringify(value, jsonReplacer, indent);
}

