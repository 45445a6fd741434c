/**
 * The CSV splitter against RFC 4180 ("Common Format and MIME Type for CSV Files", Y. Shafranovich,
 * 2005), section 2, rules 1–7. The example records below are the RFC's own (aaa,bbb,ccc /
 * zzz,yyy,xxx), quoted from memory; since surmise always reads a header line (rule 3), each
 * example is given the header line h1,h2,h3.
 */
import { describe, it, expect } from 'vitest';
import { readTable } from '../../src/table/read.ts';
import type { LabelColumn, Table } from '../../src/table/types.ts';
import { put, tempDir } from './helpers.ts';

const dir = tempDir('rfc4180');
let k = 0;
async function read(text: string, ext = 'csv'): Promise<Table> {
  return readTable(put(dir, `t${k++}.${ext}`, text));
}
function labels(t: Table): string[][] {
  return t.columns.map((c) => (c as LabelColumn).values);
}

describe('RFC 4180 section 2', () => {
  it('rule 1: records end with CRLF', async () => {
    // RFC 4180 §2.1 example: aaa,bbb,ccc CRLF zzz,yyy,xxx CRLF
    const t = await read('h1,h2,h3\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
    expect(t.nRows).toBe(2);
    expect(labels(t)).toEqual([['aaa', 'zzz'], ['bbb', 'yyy'], ['ccc', 'xxx']]);
    expect(Array.from(t.lines!)).toEqual([2, 3]);
  });

  it('rule 2: the last record may lack a line break; a trailing line break is not a row', async () => {
    // RFC 4180 §2.2 example: aaa,bbb,ccc CRLF zzz,yyy,xxx
    const a = await read('h1,h2,h3\r\naaa,bbb,ccc\r\nzzz,yyy,xxx');
    const b = await read('h1,h2,h3\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
    expect(a.nRows).toBe(2);
    expect(b.nRows).toBe(2);
    expect(labels(a)).toEqual(labels(b));
  });

  it('rule 3: the first line is a header with the field names', async () => {
    // RFC 4180 §2.3 example: field_name,field_name,field_name — here distinct names
    const t = await read('field_a,field_b,field_c\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
    expect(t.columns.map((c) => c.name)).toEqual(['field_a', 'field_b', 'field_c']);
  });

  it('rule 4: spaces are part of a field; the last field has no trailing comma', async () => {
    // RFC 4180 §2.4: "Spaces are considered part of a field and should not be ignored."
    const t = await read('h1,h2,h3\r\n aaa,bbb ,c c c\r\nzzz,yyy,xxx\r\n');
    expect(labels(t)).toEqual([[' aaa', 'zzz'], ['bbb ', 'yyy'], ['c c c', 'xxx']]);
  });

  it('rule 5: fields may or may not be enclosed in double quotes', async () => {
    // RFC 4180 §2.5 example: "aaa","bbb","ccc" CRLF zzz,yyy,xxx
    const t = await read('h1,h2,h3\r\n"aaa","bbb","ccc"\r\nzzz,yyy,xxx');
    expect(labels(t)).toEqual([['aaa', 'zzz'], ['bbb', 'yyy'], ['ccc', 'xxx']]);
  });

  it('rule 6: quoted fields may hold line breaks (CRLF), quotes and commas; lines stay physical', async () => {
    // RFC 4180 §2.6 example: "aaa","b CRLF bb","ccc" CRLF zzz,yyy,xxx
    const t = await read('h1,h2,h3\r\n"aaa","b\r\nbb","ccc"\r\nzzz,yyy,"x,x"\r\n');
    expect(labels(t)).toEqual([['aaa', 'zzz'], ['b\r\nbb', 'yyy'], ['ccc', 'x,x']]);
    // the second record starts on physical line 4 because the first spans lines 2-3
    expect(Array.from(t.lines!)).toEqual([2, 4]);
  });

  it('rule 7: a double quote inside a quoted field is written twice', async () => {
    // RFC 4180 §2.7 example: "aaa","b""bb","ccc"
    const t = await read('h1,h2,h3\r\n"aaa","b""bb","ccc"\r\n');
    expect(labels(t)).toEqual([['aaa'], ['b"bb'], ['ccc']]);
  });

  it('quoted numbers are numbers, and LF-only files read like CRLF files (common practice)', async () => {
    const t = await read('x,y\n"1.5",2\n"-3",4e-2\n');
    expect(t.columns[0]!.kind).toBe('real');
    expect(t.columns[1]!.kind).toBe('real');
    expect(Array.from((t.columns[0] as { values: Float64Array }).values)).toEqual([1.5, -3]);
  });

  it('TSV uses the same rules with a tab separator (IANA text/tab-separated-values, from memory)', async () => {
    const t = await read('a\tb\n1\t"x\ty"\n2\tz\n', 'tsv');
    expect(t.columns.map((c) => c.kind)).toEqual(['integer', 'label']);
    expect((t.columns[1] as LabelColumn).values).toEqual(['x\ty', 'z']);
  });

  it('a record straddling the reader\'s 4 MiB chunk boundary at every position is read whole', async () => {
    // common practice: a chunked reader must carry partial records (inside quotes, between "" and between CR LF)
    const CHUNK = 4 * 2 ** 20;
    const rowA = '1,"q""x\r\ny"\r\n';
    for (let d = 1; d < rowA.length; d++) {
      const head = 'i,s\n';
      const pad = 'p'.repeat(CHUNK - d - head.length - 3);
      const text = `${head}0,${pad}\n${rowA}2,end\n`;
      expect(text.indexOf(rowA)).toBe(CHUNK - d);
      const t = await read(text);
      expect((t.columns[1] as LabelColumn).values, `boundary ${d} characters into the record`).toEqual([pad, 'q"x\r\ny', 'end']);
      expect(Array.from(t.lines!)).toEqual([2, 3, 5]);
    }
  });
});
