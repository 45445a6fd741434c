import type { PlotSpec } from '../render-plot.ts';
import { formatCount } from '../format.ts';

/**
 * Break each subtitle line at spaces into lines of at most `chars` characters, so vega's title
 * `limit` never cuts a subtitle short with "…" (a word longer than `chars` stays whole).
 */
export function wrapSubtitle(lines: string | string[], chars: number): string[] {
  const out: string[] = [];
  for (const line of Array.isArray(lines) ? lines : [lines]) {
    let cur = '';
    for (const word of line.split(' ')) {
      if (cur && cur.length + 1 + word.length > chars) {
        out.push(cur);
        cur = word;
      } else cur = cur ? `${cur} ${word}` : word;
    }
    out.push(cur);
  }
  return out;
}

/**
 * Characters per subtitle line. Measured on the rendered demo plots: vega cuts a subtitle line at
 * about 0.72 × the plot width (not at the title limit), at ~6.3 px per character at 10 px type;
 * subtitles are 12 px (~7.6 px per character), so we wrap at 0.7 × width / 7.8 px.
 */
export function subtitleChars(width: number): number {
  return Math.max(20, Math.floor((0.7 * width) / 7.8));
}

/**
 * Settings every plot shares: fixed size (at most 560 px wide, so a 1280 px page shows it at full
 * size), text of at least 12 px (tick labels, legends, subtitles), no ARIA text (large charts), the
 * DejaVu font family.
 */
export function baseSpec(title: string, subtitle: string | string[] | undefined, width = 560, height = 360): PlotSpec {
  const limit = width + 140;
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: subtitle
      ? { text: title, subtitle: wrapSubtitle(subtitle, subtitleChars(width)), anchor: 'start', limit }
      : { text: title, anchor: 'start', limit },
    width,
    height,
    background: 'white',
    config: {
      aria: false,
      font: 'DejaVu Sans, sans-serif',
      axis: { labelLimit: 180, titleLimit: 520, labelFontSize: 12, titleFontSize: 13 },
      legend: { titleLimit: 240, labelFontSize: 12, titleFontSize: 12 },
      title: { subtitleColor: '#555', fontSize: 15, subtitleFontSize: 12 },
    },
  };
}

/** "all 1,234 points" or "2,000 of 100,000 points (seeded random sample)…"; the seed is derived from the run's seed. */
export function sampleNote(shown: number, total: number, extra = ''): string {
  if (shown >= total) return `all ${formatCount(total)} points`;
  return `${formatCount(shown)} of ${formatCount(total)} points (seeded random sample)${extra}`;
}

/** Finite-only copy of paired arrays, with the count of rows left out. */
export function finitePairs(x: ArrayLike<number>, y: ArrayLike<number>, idx: ArrayLike<number>): {
  rows: Array<{ x: number; y: number; i: number }>;
  nonFinite: number;
} {
  const rows: Array<{ x: number; y: number; i: number }> = [];
  let nonFinite = 0;
  for (let k = 0; k < idx.length; k++) {
    const i = idx[k]!;
    const a = x[i]!;
    const b = y[i]!;
    if (Number.isFinite(a) && Number.isFinite(b)) rows.push({ x: a, y: b, i });
    else nonFinite++;
  }
  return { rows, nonFinite };
}

/** " (k rows with a missing or non-finite value not drawn)" or "". */
export function nonFiniteNote(k: number): string {
  return k > 0 ? `; ${formatCount(k)} row${k === 1 ? '' : 's'} with a non-finite value not drawn` : '';
}
