/**
 * Interrupted writes leave nothing half-written and no debris: real processes (the CLI through
 * bin/surmise.js) are stopped with SIGINT, SIGTERM and SIGKILL at several points, and then the
 * output and the folder above it are checked. After a SIGKILL (which cannot be caught) the next
 * run removes the partial output the killed one left. Nothing here depends on timing: whenever
 * the signal lands, the output is either absent or complete.
 */
import { describe, it, expect } from 'vitest';
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { tempDir, put } from '../table/helpers.ts';
import { checkRunFolder, RUN_MARKER } from '../../src/run/folder.ts';

const BIN = fileURLToPath(new URL('../../bin/surmise.js', import.meta.url));

interface Stopped {
  code: number | null;
  signal: NodeJS.Signals | null;
  stderr: string;
  sent: boolean;
}

/** Run the CLI in `cwd`; send `signal` once stderr matches `at` (or after `at` ms). */
function runAndStop(args: string[], cwd: string, at: RegExp | number | null, signal: NodeJS.Signals): Promise<Stopped> {
  return new Promise((resolveP, reject) => {
    const child = spawn(process.execPath, [BIN, ...args], { cwd, stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    let sent = false;
    const send = () => {
      if (!sent && child.exitCode === null) {
        sent = true;
        child.kill(signal);
      }
    };
    child.stderr.on('data', (d: Buffer) => {
      stderr += d.toString();
      if (at instanceof RegExp && at.test(stderr)) send();
    });
    if (typeof at === 'number') setTimeout(send, at);
    child.on('error', reject);
    child.on('exit', (code, sig) => resolveP({ code, signal: sig, stderr, sent }));
  });
}

/** Entries of `dir` that are partial outputs or temporary files. */
const debris = (dir: string): string[] => readdirSync(dir).filter((f) => /surmise-(partial|old)|\.tmp$|\.partial/.test(f));

const CONFIG = [
  'table: small.csv',
  'target: y',
  'network:',
  '  epochs: 2',
  '  hidden: [4]',
  'attribution:',
  '  seeds: 1',
  '  methods: [saliency]',
  'bounds:',
  '  - lhs: abs(y)',
  '    rhs: u',
  'output: out',
  '',
].join('\n');

/** An invented table for the machinery: y = 2u - v + a small wobble, 200 rows. */
function smallTable(): string {
  const lines = ['u,v,w,y'];
  for (let i = 0; i < 200; i++) {
    const u = 1 + (i % 17) / 4;
    const v = ((i * 7) % 23) / 5;
    const w = ((i * 13) % 29) / 7;
    lines.push(`${u},${v},${w},${2 * u - v + 0.01 * Math.sin(i)}`);
  }
  return lines.join('\n') + '\n';
}

function runFolderCase(): string {
  const dir = tempDir('interrupt');
  put(dir, 'small.csv', smallTable());
  put(dir, 'run.yaml', CONFIG);
  return dir;
}

/** The run folder is absent, or complete: its manifest checks out and the report is there. */
function absentOrComplete(out: string): 'absent' | 'complete' {
  if (!existsSync(out)) return 'absent';
  expect(existsSync(join(out, RUN_MARKER))).toBe(true);
  expect(existsSync(join(out, 'report.html'))).toBe(true);
  expect(() => checkRunFolder(out, true)).not.toThrow();
  return 'complete';
}

describe('interrupted runs leave no debris', () => {
  it('SIGINT and SIGTERM at several stages of a run: folder absent or complete, nothing else beside it', async () => {
    const points: Array<[RegExp, NodeJS.Signals]> = [
      [/learning and attribution/, 'SIGINT'],
      [/writing /, 'SIGINT'],
      [/writing /, 'SIGTERM'],
    ];
    const dirs = points.map(() => runFolderCase());
    const results = await Promise.all(points.map(([at, sig], k) => runAndStop(['run', 'run.yaml'], dirs[k]!, at, sig)));
    results.forEach((r, k) => {
      const dir = dirs[k]!;
      expect(r.sent, r.stderr).toBe(true);
      // the handler exits 130/143; a signal before it is installed ends the process by the signal
      expect(r.code === 130 || r.code === 143 || r.signal === points[k]![1] || r.code === 0, `exit ${r.code} ${r.signal}`).toBe(true);
      expect(r.stderr).not.toMatch(/\n\s+at /);
      expect(debris(dir)).toEqual([]);
      absentOrComplete(join(dir, 'out'));
      expect(readdirSync(dir).sort()).toEqual(existsSync(join(dir, 'out')) ? ['out', 'run.yaml', 'small.csv'] : ['run.yaml', 'small.csv']);
    });
    // a run that ended before the signal reached it (exit 0) left a complete folder
    results.forEach((r, k) => {
      if (r.code === 0) expect(absentOrComplete(join(dirs[k]!, 'out'))).toBe('complete');
    });
  });

  it('SIGKILL during a run: the next run removes the partial folder it left and writes a complete one', async () => {
    const dir = runFolderCase();
    const killed = await runAndStop(['run', 'run.yaml'], dir, /writing /, 'SIGKILL');
    expect(killed.signal).toBe('SIGKILL');
    // whatever was left is complete, or partial debris of ours: never a half folder named out
    absentOrComplete(join(dir, 'out'));
    const again = await runAndStop(['run', 'run.yaml', '--force', '--no-progress'], dir, null, 'SIGINT');
    expect(again.code, again.stderr).toBe(0);
    expect(debris(dir)).toEqual([]);
    expect(absentOrComplete(join(dir, 'out'))).toBe('complete');
  });

  it('demo-data --out: SIGTERM and SIGKILL leave the file absent or whole; the next write clears debris', async () => {
    const cases: Array<[number, NodeJS.Signals]> = [
      [1500, 'SIGTERM'],
      [3000, 'SIGKILL'],
    ];
    const dirs = cases.map(() => tempDir('interrupt-demo'));
    const results = await Promise.all(cases.map(([ms, sig], k) => runAndStop(['demo-data', '--no-progress', '--out', 'knots.csv'], dirs[k]!, ms, sig)));
    const whole = (file: string) => readFileSync(file, 'utf8').endsWith('\n') && readFileSync(file, 'utf8').startsWith('name,');
    results.forEach((r, k) => {
      const dir = dirs[k]!;
      const file = join(dir, 'knots.csv');
      if (existsSync(file)) expect(whole(file)).toBe(true);
      if (cases[k]![1] !== 'SIGKILL') expect(debris(dir)).toEqual([]);
    });
    // after either, a fresh write (with --force) leaves exactly one whole file and nothing else
    const again = await Promise.all(dirs.map((dir) => runAndStop(['demo-data', '--no-progress', '--out', 'knots.csv', '--force'], dir, null, 'SIGINT')));
    again.forEach((r, k) => {
      expect(r.code, r.stderr).toBe(0);
      expect(readdirSync(dirs[k]!)).toEqual(['knots.csv']);
      expect(whole(join(dirs[k]!, 'knots.csv'))).toBe(true);
    });
  });
});
