import type { RenderedPlot, RenderedReport, ReportInput, ReportOptions } from './types.ts';
import type { Block } from './doc.ts';
import { PlotPlan } from './plan.ts';
import { resolveOptions, validateInput } from './validate.ts';
import { summaryBlocks } from './summary.ts';
import {
  attributionSection,
  boundsSection,
  dataSection,
  predictabilitySection,
  relationsSection,
  reproducibilitySection,
  residualSection,
} from './sections.ts';
import { specToSvg, svgToPngAsync } from './render-plot.ts';
import { renderHtml } from './html.ts';
import { renderMarkdown } from './markdown.ts';

/** The report's blocks and the plots they reference, before anything is drawn. */
export function planReport(input: ReportInput, opts?: ReportOptions): { blocks: Block[]; plan: PlotPlan } {
  const o = resolveOptions(opts);
  validateInput(input);
  const plan = new PlotPlan();
  const set = { seed: o.seed, maxPoints: o.maxPoints, scatterMode: o.scatterMode };
  const blocks: Block[] = [
    { kind: 'heading', level: 1, text: input.title },
    { kind: 'paragraph', parts: [`Created ${input.createdAt} by ${input.tool.name} ${input.tool.version}.`] },
    ...summaryBlocks(input),
    ...dataSection(input),
    ...predictabilitySection(input, plan, set),
    ...attributionSection(input, plan, set),
    ...relationsSection(input, plan, set),
    ...residualSection(input),
    ...boundsSection(input, plan, set),
    ...reproducibilitySection(input),
  ];
  // a short table of contents after the title line: the level-2 sections
  const toc = blocks.filter((b): b is Extract<Block, { kind: 'heading' }> => b.kind === 'heading' && b.level === 2 && b.id !== undefined);
  if (toc.length > 2) blocks.splice(2, 0, { kind: 'toc', items: toc.map((h) => ({ id: h.id!, text: h.text })) });
  return { blocks, plan };
}

/**
 * Render the report: one self-contained HTML page, the same content as Markdown (plots referenced
 * as plots/<name>.svg), and every plot as SVG and PNG. Pure: nothing is written.
 */
export async function renderReport(input: ReportInput, opts?: ReportOptions): Promise<RenderedReport> {
  const o = resolveOptions(opts);
  const { blocks, plan } = planReport(input, opts);
  const svgList: string[] = [];
  for (const item of plan.items) svgList.push(await specToSvg(item.spec, `p-${item.name}`));
  // PNGs in resvg's thread pool, all at once: the SVG work above is single-threaded JavaScript.
  const pngs = await Promise.all(svgList.map((svg) => (o.png ? svgToPngAsync(svg, o.pngScale) : Promise.resolve(new Uint8Array(0)))));
  const plots: RenderedPlot[] = plan.items.map((item, k) => ({ name: item.name, title: item.title, svg: svgList[k]!, png: pngs[k]! }));
  const svgs = new Map(plots.map((p) => [p.name, p.svg]));
  return { html: renderHtml(input.title, blocks, svgs), markdown: renderMarkdown(blocks), plots };
}
