import { describe, it, expect } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync, mkdirSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RUN_MARKER, writeRunFolder } from '../../src/run/folder.ts';
import { PARTIAL_MARKER } from '../../src/util/partial.ts';
import { SurmiseError } from '../../src/errors.ts';

describe('run folder', () => {
  it('writes every file and leaves no staging folder behind', () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-folder-'));
    const out = join(dir, 'run');
    writeRunFolder(out, [{ path: 'results.json', data: '{}' }, { path: 'plots/a.svg', data: '<svg/>' }], false);
    expect(readFileSync(join(out, 'plots/a.svg'), 'utf8')).toBe('<svg/>');
    expect(readdirSync(dir)).toEqual(['run']);
  });

  it('refuses to replace an existing folder without force, and keeps its contents', () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-folder-'));
    const out = join(dir, 'run');
    mkdirSync(out);
    writeFileSync(join(out, 'mine.txt'), 'precious');
    expect(() => writeRunFolder(out, [{ path: 'results.json', data: '{}' }], false)).toThrow(SurmiseError);
    expect(readFileSync(join(out, 'mine.txt'), 'utf8')).toBe('precious');
  });

  it('with force, never deletes a folder of the user\'s own files', () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-folder-'));
    const out = join(dir, 'mine');
    mkdirSync(out);
    writeFileSync(join(out, 'notes.txt'), 'precious');
    let code = '';
    try {
      writeRunFolder(out, [{ path: 'results.json', data: '{}' }], true);
    } catch (e) {
      code = (e as SurmiseError).code;
    }
    expect(code).toBe('output.notRunFolder');
    expect(readFileSync(join(out, 'notes.txt'), 'utf8')).toBe('precious');
  });

  it('replaces an earlier run folder with force, atomically by rename', () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-folder-'));
    const out = join(dir, 'run');
    writeRunFolder(out, [{ path: 'results.json', data: '{"format":"surmise-run"}' }, { path: 'a.txt', data: '1' }], false);
    writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true);
    expect(existsSync(join(out, 'a.txt'))).toBe(false);
    expect(readFileSync(join(out, 'b.txt'), 'utf8')).toBe('2');
    expect(readdirSync(dir)).toEqual(['run']);
  });
});

describe('run folder marker: --force removes only what surmise wrote', () => {
  const fresh = () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-folder-'));
    const out = join(dir, 'run');
    writeRunFolder(out, [{ path: 'results.json', data: '{}' }, { path: 'plots/a.svg', data: '<svg/>' }], false);
    return { dir, out };
  };
  const codeAndMessage = (f: () => void): [string, string] => {
    try {
      f();
    } catch (e) {
      return [(e as SurmiseError).code, (e as SurmiseError).message];
    }
    return ['none', ''];
  };

  it('writes a manifest of every file with its size and SHA-256 (FIPS 180-4 digest of "{}")', () => {
    const { out } = fresh();
    const m = JSON.parse(readFileSync(join(out, RUN_MARKER), 'utf8')) as { files: Record<string, { bytes: number; sha256: string }> };
    expect(Object.keys(m.files).sort()).toEqual(['plots/a.svg', 'results.json']);
    // SHA-256("{}") from `printf '{}' | sha256sum` (coreutils, outside this project)
    expect(m.files['results.json']).toEqual({ bytes: 2, sha256: '44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a' });
  });

  it("refuses to replace an earlier run holding the user's own file, lists it and keeps everything", () => {
    const { out } = fresh();
    writeFileSync(join(out, 'notes.txt'), 'my notes');
    mkdirSync(join(out, 'data'));
    writeFileSync(join(out, 'data', 'mine.csv'), 'x\n1\n');
    const [code, msg] = codeAndMessage(() => writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true));
    expect(code).toBe('output.notRunFolder');
    expect(msg).toContain('notes.txt');
    expect(msg).toContain('data/mine.csv');
    expect(readFileSync(join(out, 'notes.txt'), 'utf8')).toBe('my notes');
    expect(readFileSync(join(out, 'plots', 'a.svg'), 'utf8')).toBe('<svg/>');
  });

  it('refuses when a file surmise wrote was edited since, naming it', () => {
    const { out } = fresh();
    writeFileSync(join(out, 'results.json'), '{"edited": true}');
    const [code, msg] = codeAndMessage(() => writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true));
    expect(code).toBe('output.notRunFolder');
    expect(msg).toContain('results.json (changed since surmise wrote it)');
  });

  it('does not take a format string or a forged marker for a run folder', () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-folder-'));
    const out = join(dir, 'run');
    mkdirSync(out);
    writeFileSync(join(out, 'results.json'), '{"format":"surmise-run"}');
    expect(codeAndMessage(() => writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true))[0]).toBe('output.notRunFolder');
    writeFileSync(join(out, RUN_MARKER), JSON.stringify({ kind: 'surmise run folder', version: 1, files: { 'results.json': { bytes: 24, sha256: '0'.repeat(64) } } }));
    expect(codeAndMessage(() => writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true))[0]).toBe('output.notRunFolder');
    writeFileSync(join(out, RUN_MARKER), 'format: surmise-run');
    expect(codeAndMessage(() => writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true))[0]).toBe('output.notRunFolder');
    expect(readFileSync(join(out, 'results.json'), 'utf8')).toBe('{"format":"surmise-run"}');
  });

  it('removes partial folders of dead processes (by the marker) and keeps look-alikes without it', () => {
    const { dir, out } = fresh();
    // pid 2^22 + 1 is above Linux's pid_max ceiling (2^22), so no process has it (proc(5))
    const dead = join(dir, '.run.surmise-partial-4194305-1');
    mkdirSync(dead);
    writeFileSync(join(dead, PARTIAL_MARKER), '4194305');
    writeFileSync(join(dead, 'results.json'), '{');
    const lookalike = join(dir, '.run.surmise-partial-4194305-2');
    mkdirSync(lookalike);
    writeFileSync(join(lookalike, 'mine.txt'), 'keep');
    const deadFile = join(dir, '.run.surmise-partial-4194305-3');
    writeFileSync(deadFile, 'half');
    writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true);
    expect(existsSync(dead)).toBe(false);
    expect(existsSync(deadFile)).toBe(false);
    expect(readFileSync(join(lookalike, 'mine.txt'), 'utf8')).toBe('keep');
    expect(readdirSync(dir).sort()).toEqual(['.run.surmise-partial-4194305-2', 'run']);
  });

  it('a dead process killed between making its folder and marking it left an empty folder: removed too', () => {
    const { dir, out } = fresh();
    const empty = join(dir, '.run.surmise-partial-4194305-4'); // pid above pid_max, as above
    mkdirSync(empty);
    writeRunFolder(out, [{ path: 'b.txt', data: '2' }], true);
    expect(existsSync(empty)).toBe(false);
    // the written folder keeps no partial marker
    expect(readdirSync(out).sort()).toEqual(['.surmise-run', 'b.txt']);
  });
});
