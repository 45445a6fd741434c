/**
 * The run folder: written whole into a partial folder beside it and renamed into place, so a
 * reader sees the old folder or the complete new one, never a half-written report. Surmise marks
 * a folder it wrote with `.surmise-run`, a manifest of every file it wrote with its size and
 * SHA-256. `--force` replaces a folder only when the manifest checks out in full: every file in
 * the folder is one surmise wrote, unchanged. Anything else (the user's notes, data, an edited
 * report) is in the way, and the run is refused with a list of it; nothing of the user's is lost.
 */
import { createHash } from 'node:crypto';
import { existsSync, lstatSync, mkdirSync, readFileSync, readdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { SurmiseError, printable } from '../errors.ts';
import { beginPartial, endPartial, PARTIAL_MARKER, removeStalePartials } from '../util/partial.ts';

export interface OutputFile {
  /** Path inside the run folder, with '/' separators (e.g. 'plots/ranking.svg'). */
  path: string;
  data: string | Uint8Array;
}

/** The marker file of a run folder. */
export const RUN_MARKER = '.surmise-run';
const MARKER_KIND = 'surmise run folder';

interface Manifest {
  kind: typeof MARKER_KIND;
  version: 1;
  files: Record<string, { bytes: number; sha256: string }>;
}

const sha256 = (data: string | Uint8Array): string => createHash('sha256').update(data).digest('hex');

function manifestOf(files: OutputFile[]): Manifest {
  const out: Manifest = { kind: MARKER_KIND, version: 1, files: {} };
  for (const f of files) out.files[f.path] = { bytes: Buffer.byteLength(f.data), sha256: sha256(f.data) };
  return out;
}

/** The manifest in `dir`, or null when it is absent or not one surmise wrote. */
function readManifest(dir: string): Manifest | null {
  try {
    const m = JSON.parse(readFileSync(join(dir, RUN_MARKER), 'utf8')) as Partial<Manifest>;
    if (m.kind !== MARKER_KIND || m.version !== 1 || m.files === null || typeof m.files !== 'object') return null;
    for (const [p, f] of Object.entries(m.files)) {
      if (typeof p !== 'string' || !f || typeof f.bytes !== 'number' || typeof f.sha256 !== 'string' || !/^[0-9a-f]{64}$/.test(f.sha256)) return null;
    }
    return m as Manifest;
  } catch {
    return null;
  }
}

/** Every entry below `dir` as '/'-separated paths: files, links, and folders that hold nothing. */
function listEntries(dir: string, prefix = ''): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const rel = prefix + name;
    const full = join(dir, name);
    const st = lstatSync(full);
    if (st.isDirectory()) {
      const inner = listEntries(full, `${rel}/`);
      out.push(...(inner.length ? inner : [`${rel}/`]));
    } else out.push(rel);
  }
  return out;
}

/** Entries of an earlier run folder that surmise did not write (or that changed since). */
function entriesInTheWay(dir: string, m: Manifest): string[] {
  const inTheWay: string[] = [];
  for (const rel of listEntries(dir)) {
    if (rel === RUN_MARKER || rel === PARTIAL_MARKER) continue;
    const f = m.files[rel];
    const full = join(dir, ...rel.split('/'));
    if (!f || rel.endsWith('/') || !lstatSync(full).isFile()) {
      inTheWay.push(rel);
      continue;
    }
    const data = readFileSync(full);
    if (data.length !== f.bytes || sha256(data) !== f.sha256) inTheWay.push(`${rel} (changed since surmise wrote it)`);
  }
  return inTheWay;
}

function listed(paths: string[]): string {
  const shown = paths.slice(0, 8).map((p) => printable(p, 80));
  return shown.join(', ') + (paths.length > 8 ? ` and ${paths.length - 8} more` : '');
}

/**
 * Refuse early (before any work) when the run folder exists and `force` is not given. Even with
 * `force` only a folder surmise wrote, holding nothing but its own unchanged files, is replaced
 * (an empty folder too); otherwise `output.notRunFolder` lists what is in the way.
 */
export function checkRunFolder(outDir: string, force: boolean): void {
  removeStalePartials(outDir);
  if (!existsSync(outDir)) return;
  if (!force) {
    throw new SurmiseError('output.exists', `${outDir} already exists; pass \`force\` to replace it, or choose another \`out\``, { option: 'force', also: ['out'] });
  }
  if (!statSync(outDir).isDirectory()) {
    throw new SurmiseError('output.notRunFolder', `${outDir} is a file, not a run folder; choose another \`out\``, { option: 'out' });
  }
  const entries = listEntries(outDir);
  if (entries.length === 0) return;
  const m = readManifest(outDir);
  if (!m) {
    throw new SurmiseError(
      'output.notRunFolder',
      `${outDir} is not a surmise run folder (no valid ${RUN_MARKER} marker); it holds ${listed(entries)}; nothing was replaced, choose another \`out\``,
      { inTheWay: entries.slice(0, 100), option: 'out' },
    );
  }
  const inTheWay = entriesInTheWay(outDir, m);
  if (inTheWay.length > 0) {
    throw new SurmiseError(
      'output.notRunFolder',
      `${outDir} holds files surmise did not write, which replacing it would delete: ${listed(inTheWay)}; move them or choose another \`out\``,
      { inTheWay: inTheWay.slice(0, 100), option: 'out' },
    );
  }
}

/**
 * Write every file of a run into a partial folder beside `outDir` (with a marker naming it ours),
 * then move it into place with renames. An existing folder is replaced only with `force` and
 * only after checkRunFolder accepts it (it is removed after the new one is in place).
 */
export function writeRunFolder(outDir: string, files: OutputFile[], force: boolean): void {
  checkRunFolder(outDir, force);
  const parent = dirname(outDir);
  try {
    mkdirSync(parent, { recursive: true });
  } catch (e) {
    throw new SurmiseError('output.unwritable', `cannot create ${parent}: ${(e as Error).message}`);
  }
  const staging = beginPartial(outDir);
  let old: string | null = null;
  try {
    mkdirSync(staging);
    writeFileSync(join(staging, PARTIAL_MARKER), String(process.pid));
    for (const f of files) {
      const target = join(staging, ...f.path.split('/'));
      mkdirSync(dirname(target), { recursive: true });
      writeFileSync(target, f.data);
    }
    writeFileSync(join(staging, RUN_MARKER), JSON.stringify(manifestOf(files), null, 1) + '\n');
    if (existsSync(outDir)) {
      old = beginPartial(outDir);
      writeFileSync(join(outDir, PARTIAL_MARKER), String(process.pid));
      renameSync(outDir, old);
      renameSync(staging, outDir);
      rmSync(old, { recursive: true, force: true });
    } else {
      renameSync(staging, outDir);
    }
    // the partial marker goes only once the folder is in place: until then a SIGKILL leaves a
    // folder the next run recognises as debris (a stray marker in a complete folder is ignored)
    rmSync(join(outDir, PARTIAL_MARKER), { force: true });
  } catch (e) {
    rmSync(staging, { recursive: true, force: true });
    if (e instanceof SurmiseError) throw e;
    throw new SurmiseError('output.unwritable', `cannot write the run folder ${outDir}: ${(e as Error).message}`);
  } finally {
    endPartial(staging);
    if (old) endPartial(old);
  }
}
