import { describe, it, expect } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync, mkdirSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeRunFolder } from '../../src/run/folder.ts';
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
