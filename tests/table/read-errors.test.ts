/**
 * Every kind of bad input gives a SurmiseError with a stable code and a message naming the file,
 * the physical line and the column; through the CLI it is one line on stderr and exit code 2.
 * Expected messages follow the task statement's example ("file.csv:17: row has 5 fields, header
 * has 6"); line numbers are counted by hand from the inputs below.
 */
import { describe, it, expect } from 'vitest';
import { chmodSync } from 'node:fs';
import { readTable } from '../../src/table/read.ts';
import { SurmiseError } from '../../src/errors.ts';
import { runCli } from '../../src/cli/main.ts';
import { memoryIO } from '../../src/cli/io.ts';
import { put, tempDir } from './helpers.ts';

const dir = tempDir('bad');

interface Case {
  name: string;
  file: string;
  text: string;
  code: string;
  message: string;
  /** The message as the CLI words it, when it names an option (flag instead of key). */
  cliMessage?: string;
}

const rows95 = Array.from({ length: 40 }, (_, i) => `${i},${i * 0.5}`);
rows95[30] = '30,12abc';

const cases: Case[] = [
  {
    name: 'tab-separated text in a .csv file',
    file: 'tabs.csv',
    text: 'a\tb\tc\n1\t2\t3\n',
    code: 'table.wrongDelimiter',
    message: 'tabs.csv:1: the header has no commas but 2 tabs, so it would be read as one column; read it as TSV (format tsv, or name the file .tsv)',
  },
  {
    name: 'comma-separated text in a .tsv file',
    file: 'commas.tsv',
    text: 'a,b\n1,2\n',
    code: 'table.wrongDelimiter',
    message: 'commas.tsv:1: the header has no tabs but 1 commas, so it would be read as one column; read it as CSV (format csv, or name the file .csv)',
  },
  { name: 'empty file', file: 'empty.csv', text: '', code: 'table.empty', message: 'empty.csv is empty: expected a header line and rows' },
  { name: 'header only', file: 'head.csv', text: 'a,b,c\n', code: 'table.noRows', message: 'head.csv has a header (line 1) but no rows' },
  {
    name: 'ragged row',
    file: 'ragged.csv',
    text: 'a,b,c,d,e,f\n' + '1,2,3,4,5,6\n'.repeat(15) + '1,2,3,4,5\n',
    code: 'table.raggedRow',
    message: 'ragged.csv:17: row has 5 fields, header has 6',
  },
  {
    name: 'unterminated quote (names the line where it opened)',
    file: 'quote.csv',
    text: 'name,x\nk1,1\n"k2\nstill open,2\nk3,3\n',
    code: 'table.unterminatedQuote',
    message: "quote.csv:3: unterminated quote: the quoted field that opens here in column 'name' (1) never closes",
  },
  {
    name: 'duplicate column names',
    file: 'dup.csv',
    text: 'amp,slope,amp\n1,2,3\n',
    code: 'table.duplicateColumn',
    message: "dup.csv: line 1: column name 'amp' appears twice (columns 1 and 3)",
  },
  {
    name: 'text cell in a column that is 97.5% numeric',
    file: 'text.csv',
    text: 'n,x\n' + rows95.join('\n') + '\n',
    code: 'table.badNumber',
    message:
      "text.csv:32: column 'x' (2): '12abc' is not a number, but 97.5% of the column's cells are (declare `kinds` x=label to read it as text)",
    cliMessage: "text.csv:32: column 'x' (2): '12abc' is not a number, but 97.5% of the column's cells are (declare --kind x=label to read it as text)",
  },
  {
    name: 'malformed complex number in a complex column',
    file: 'cx.csv',
    text: 'k,tau\n' + Array.from({ length: 30 }, (_, i) => `${i},${i}+${i + 1}j`).join('\n') + '\n30,1.5++2j\n',
    code: 'table.badComplex',
    message:
      "cx.csv:32: column 'tau' (2): '1.5++2j' is not a complex number (write 1.5+2.25j, 1.5-2.25i, (1.5,2.25) or 2.25j); 96.8% of the column's cells are numbers",
  },
  {
    name: 'nonexistent file',
    file: 'missing-never-written.csv',
    text: '',
    code: 'table.unreadable',
    message: 'cannot read missing-never-written.csv: no such file',
  },
  {
    name: 'text after a closing quote',
    file: 'badq.csv',
    text: 'a,b\n1,"x"y\n',
    code: 'table.badQuote',
    message: 'badq.csv:2: text after the closing quote in column \'b\' (2); a quote inside a quoted field is written twice ("")',
  },
  {
    name: 'invalid JSON Lines record',
    file: 'bad.jsonl',
    text: '{"a":1}\n{"a":2,}\n',
    code: 'table.badJson',
    message: 'bad.jsonl:2: not valid JSON: ',
  },
  {
    name: 'JSON that is not an array of objects',
    file: 'obj.json',
    text: '{"a":[1,2]}',
    code: 'table.badJson',
    message: 'obj.json: expected a JSON array of objects ([{"name": value, ...}, ...]), got object',
  },
  {
    name: 'unknown extension',
    file: 'data.xlsx',
    text: 'a\n1\n',
    code: 'table.unknownFormat',
    message: 'cannot tell the format of data.xlsx from its extension (.csv .tsv .tab .json .jsonl .ndjson); give `format` csv|tsv|json|jsonl',
    cliMessage: 'cannot tell the format of data.xlsx from its extension (.csv .tsv .tab .json .jsonl .ndjson); give --format csv|tsv|json|jsonl',
  },
];

function write(c: Case): string {
  return c.code === 'table.unreadable' ? `${dir}/${c.file}` : put(dir, c.file, c.text);
}

describe('bad input through readTable', () => {
  for (const c of cases)
    it(`${c.name}: ${c.code}`, async () => {
      const path = write(c);
      const err = await readTable(path, { displayName: c.file }).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(SurmiseError);
      expect((err as SurmiseError).code).toBe(c.code);
      if (c.message.endsWith(': ')) expect((err as SurmiseError).message.startsWith(c.message)).toBe(true);
      else expect((err as SurmiseError).message).toBe(c.message);
      expect((err as SurmiseError).exitCode).toBe(2);
    });

  it('a declared numeric column rejects its first text cell (table.badNumber)', async () => {
    const p = put(dir, 'decl.csv', 'k,v\na,1\nb,x\nc,y\n');
    const err = (await readTable(p, { displayName: 'decl.csv', kinds: { v: 'real' } }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.badNumber');
    expect(err.message).toBe("decl.csv:3: column 'v' (2): 'x' is not a number, and the column is declared real");
  });

  it('a declared integer column rejects 2.5 (table.notInteger)', async () => {
    const p = put(dir, 'int.csv', 'v\n1\n2.5\n');
    const err = (await readTable(p, { displayName: 'int.csv', kinds: { v: 'integer' } }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.notInteger');
    expect(err.message).toBe("int.csv:3: column 'v' (1): 2.5 is not an integer, and the column is declared integer");
  });

  it('a --kind for a column that does not exist suggests the nearest name (table.unknownColumn)', async () => {
    const p = put(dir, 'kinds.csv', 'volume,slope\n1,2\n');
    const err = (await readTable(p, { displayName: 'kinds.csv', kinds: { volum: 'real' } }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.unknownColumn');
    expect(err.message).toBe("`kinds` volum=real: no column 'volum' in kinds.csv (did you mean 'volume'?)");
  });

  it('a column below 95% numeric becomes labels, and the decision is reported in notes', async () => {
    const p = put(dir, 'mixed.csv', 'x\n1\n2\nthree\n4\n');
    const t = await readTable(p, { displayName: 'mixed.csv' });
    expect(t.columns[0]!.kind).toBe('label');
    expect((t.columns[0] as { values: string[] }).values).toEqual(['1', '2', 'three', '4']);
    expect(t.notes).toEqual(["column 'x' read as labels: 1 of 4 cells are not numbers (first: line 4, 'three')"]);
  });

  it('invalid UTF-8 is table.badEncoding', async () => {
    const p = put(dir, 'latin1.csv', Buffer.from([0x61, 0x0a, 0xe9, 0x0a]));
    const err = (await readTable(p, { displayName: 'latin1.csv' }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.badEncoding');
  });

  it.skipIf(process.getuid?.() === 0)('an unreadable file is table.unreadable (permission denied)', async () => {
    const p = put(dir, 'locked.csv', 'a\n1\n');
    chmodSync(p, 0o000);
    const err = (await readTable(p, { displayName: 'locked.csv' }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.unreadable');
    expect(err.message).toBe('cannot read locked.csv: permission denied');
  });
});

describe('notes about odd cells and names', () => {
  it('a 5 MB cell of control bytes is cut and escaped in the note, never echoed', async () => {
    const p = put(dir, 'huge.csv', 'a,b\n1,2\n2,' + '\u0007x'.repeat(2_500_000) + '\n3,4\n');
    const t = await readTable(p, { displayName: 'huge.csv' });
    const note = t.notes!.find((n) => n.startsWith("column 'b' read as labels"))!;
    expect(note.length).toBeLessThan(500);
    expect(note).toContain('\\u0007x');
    expect(note).toContain('(5,000,000 characters)');
    expect(note).not.toMatch(/[\u0000-\u001f]/);
  });

  it('an empty column name is named column_N with a note', async () => {
    const p = put(dir, 'blank.csv', 'a,,"",d\n1,2,3,4\n');
    const t = await readTable(p, { displayName: 'blank.csv' });
    expect(t.columns.map((c) => c.name)).toEqual(['a', 'column_2', 'column_3', 'd']);
    expect(t.notes).toEqual([
      "column 2 has no name in the header (line 1); it is called 'column_2'",
      "column 3 has no name in the header (line 1); it is called 'column_3'",
    ]);
  });
});

describe('bad input through the CLI: exit code 2, one line on stderr, no stack trace', () => {
  for (const c of cases)
    it(`surmise inspect ${c.file} -> ${c.code}`, async () => {
      write(c);
      const io = memoryIO(dir);
      const code = await runCli(['inspect', c.file], io);
      expect(code).toBe(2);
      expect(io.out).toBe('');
      const lines = io.err.split('\n').filter((l) => l.length > 0);
      expect(lines).toHaveLength(1);
      // the CLI words an option the library names (`format`) as its flag (--format)
      expect(lines[0]!.startsWith(`surmise: ${c.cliMessage ?? c.message}`)).toBe(true);
      expect(lines[0]!.endsWith(`[${c.code}]`)).toBe(true);
      expect(io.err).not.toMatch(/\n\s+at /);
    });
});

describe('encoding', () => {
  it('a U+FFFD written in the file is text, not an encoding error (Unicode: EF BF BD is valid UTF-8, from memory)', async () => {
    const p = put(dir, 'fffd.csv', Buffer.from([0x61, 0x0a, 0xef, 0xbf, 0xbd, 0x0a]));
    const t = await readTable(p);
    expect((t.columns[0] as { values: string[] }).values).toEqual(['\ufffd']);
  });

  it('a truncated multi-byte character at the end is table.badEncoding', async () => {
    const p = put(dir, 'trunc.csv', Buffer.from([0x61, 0x0a, 0xe2, 0x82]));
    const err = (await readTable(p, { displayName: 'trunc.csv' }).catch((e) => e)) as SurmiseError;
    expect(err.code).toBe('table.badEncoding');
  });

  it('a byte-order mark before the header is not part of the first name (common practice)', async () => {
    const p = put(dir, 'bom.csv', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('amp,c\n1,2\n')]));
    expect((await readTable(p)).columns.map((c) => c.name)).toEqual(['amp', 'c']);
  });
});
