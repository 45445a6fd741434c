import type * as VegaModule from 'vega';
import type * as VegaLiteModule from 'vega-lite';
import { Resvg, renderAsync } from '@resvg/resvg-js';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

/** vega and vega-lite, imported when the first plot is drawn (together ~0.6 CPU-s to load: kept out of the CLI's start). */
let plotLibs: Promise<[typeof VegaModule, typeof VegaLiteModule]> | null = null;
const loadPlotLibs = () => (plotLibs ??= Promise.all([import('vega'), import('vega-lite')]));

/** A vega-lite specification (kept loose: the plot builders own its shape). */
export type PlotSpec = Record<string, unknown>;

/**
 * Compile a vega-lite spec to vega and render it headless to an SVG string (renderer 'none':
 * no DOM, no canvas). Vega escapes every text it writes (titles, axis labels, legends). Element
 * ids are prefixed with `idPrefix` so several SVGs can be inlined in one HTML page.
 */
export async function specToSvg(spec: PlotSpec, idPrefix: string): Promise<string> {
  const [vega, vl] = await loadPlotLibs();
  const compiled = vl.compile(spec as unknown as VegaLiteModule.TopLevelSpec).spec;
  const view = new vega.View(vega.parse(compiled), { renderer: 'none' });
  try {
    const svg = await view.toSVG();
    return prefixIds(roundGeometry(svg), idPrefix);
  } finally {
    view.finalize();
  }
}

/**
 * Round numbers in geometry attributes (d, transform, x, y, width, height, …) to 2 decimals:
 * a hundredth of a pixel is invisible and the SVG shrinks by about a third. Text is untouched.
 */
export function roundGeometry(svg: string): string {
  return svg.replace(
    /(\s(?:d|transform|x|y|x1|y1|x2|y2|width|height|cx|cy|r)=")([^"]*)"/g,
    (_m, a: string, v: string) => `${a}${v.replace(/(\d\.\d\d)\d+/g, '$1')}"`,
  );
}

/**
 * Rename the ids in an SVG to `<prefix>-1`, `<prefix>-2`, … in order of appearance, with their
 * `url(#…)` and `href="#…"` references: vega numbers gradients and clips with a process-wide
 * counter, so this makes the SVG deterministic and lets several SVGs share one HTML page.
 */
export function prefixIds(svg: string, prefix: string): string {
  const map = new Map<string, string>();
  for (const m of svg.matchAll(/\sid="([^"]+)"/g)) if (!map.has(m[1]!)) map.set(m[1]!, `${prefix}-${map.size + 1}`);
  if (map.size === 0) return svg;
  return svg
    .replace(/(\sid=")([^"]+)"/g, (_m, a: string, id: string) => `${a}${map.get(id)}"`)
    .replace(/url\(#([^)]+)\)/g, (m, id: string) => (map.has(id) ? `url(#${map.get(id)})` : m))
    .replace(/(href=")#([^"]+)"/g, (m, a: string, id: string) => (map.has(id) ? `${a}#${map.get(id)}"` : m));
}

/**
 * PNG bytes of an SVG, drawn by resvg with the system fonts (DejaVu Sans as the default family),
 * on white, at `scale` times the SVG's own size.
 */
export function svgToPng(svg: string, scale = 2): Uint8Array {
  const png = new Resvg(svg, pngOptions(scale)).render().asPng();
  return new Uint8Array(png.buffer, png.byteOffset, png.byteLength);
}

/** svgToPng off the main thread (resvg's thread pool), so several plots render in parallel. */
export async function svgToPngAsync(svg: string, scale = 2): Promise<Uint8Array> {
  const png = (await renderAsync(svg, pngOptions(scale))).asPng();
  return new Uint8Array(png.buffer, png.byteOffset, png.byteLength);
}

function pngOptions(scale: number) {
  return {
    fitTo: { mode: 'zoom' as const, value: scale },
    background: 'white',
    font: { loadSystemFonts: true, defaultFontFamily: 'DejaVu Sans', sansSerifFamily: 'DejaVu Sans' },
  };
}

/** Versions of the plotting libraries, for the reproducibility section. */
export const plotLibraryVersions: Record<string, string> = { vega: installedVersion('vega'), 'vega-lite': installedVersion('vega-lite') };

/** An installed package's version, from the package.json above its entry file (without loading the package). */
function installedVersion(name: string): string {
  try {
    let dir = dirname(createRequire(import.meta.url).resolve(name));
    for (;;) {
      try {
        const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8')) as { name?: string; version?: string };
        if (pkg.name === name && pkg.version) return pkg.version;
      } catch {
        // no package.json at this level
      }
      const up = dirname(dir);
      if (up === dir) return 'unknown';
      dir = up;
    }
  } catch {
    return 'unknown';
  }
}
