import type { PlotSpec } from './render-plot.ts';
import { slug } from './escape.ts';

/** The plots a report needs, each with a unique file-safe name, collected while sections are built. */
export class PlotPlan {
  readonly items: Array<{ name: string; title: string; spec: PlotSpec }> = [];
  private readonly used = new Set<string>();

  /** Register a plot; returns its unique name (`base`, or `base-2`, `base-3`, …). */
  add(base: string, title: string, spec: PlotSpec): string {
    const stem = slug(base);
    let name = stem;
    for (let k = 2; this.used.has(name); k++) name = `${stem}-${k}`;
    this.used.add(name);
    this.items.push({ name, title, spec });
    return name;
  }
}
