import { mkdir, rename, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { RenderedReport } from './types.ts';

/**
 * Write report.html, report.md and plots/<name>.svg|.png under `dir`, each first to `<file>.tmp`
 * and then renamed into place, so a reader never sees a half-written file.
 */
export async function writeReportFiles(dir: string, r: RenderedReport): Promise<string[]> {
  await mkdir(join(dir, 'plots'), { recursive: true });
  const files: Array<[string, string | Uint8Array]> = [
    ['report.html', r.html],
    ['report.md', r.markdown],
  ];
  for (const p of r.plots) {
    files.push([join('plots', `${p.name}.svg`), p.svg]);
    if (p.png.length > 0) files.push([join('plots', `${p.name}.png`), p.png]);
  }
  for (const [rel, data] of files) {
    const target = join(dir, rel);
    await writeFile(`${target}.tmp`, data);
    await rename(`${target}.tmp`, target);
  }
  return files.map(([rel]) => rel);
}
