import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { writeFileAtomic } from '../util/atomic-write.ts';
import type { RenderedReport } from './types.ts';

/**
 * Write report.html, report.md and plots/<name>.svg|.png under `dir` (replacing earlier copies),
 * each through the shared partial-file writer (`writeFileAtomic`): a reader never sees a
 * half-written file, and a failed or interrupted write leaves no partial file behind.
 */
export async function writeReportFiles(dir: string, r: RenderedReport): Promise<string[]> {
  mkdirSync(join(dir, 'plots'), { recursive: true });
  const files: Array<[string, string | Uint8Array]> = [
    ['report.html', r.html],
    ['report.md', r.markdown],
  ];
  for (const p of r.plots) {
    files.push([join('plots', `${p.name}.svg`), p.svg]);
    if (p.png.length > 0) files.push([join('plots', `${p.name}.png`), p.png]);
  }
  for (const [rel, data] of files) writeFileAtomic(join(dir, rel), data, { force: true, display: rel });
  return files.map(([rel]) => rel);
}
