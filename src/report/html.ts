import type { Block, Inline } from './doc.ts';
import { escapeHtml } from './escape.ts';

const STYLE = `
:root { color-scheme: light; }
body { font-family: "DejaVu Sans", "Helvetica Neue", Arial, sans-serif; color: #1b1b1b; background: #fff;
  max-width: 62rem; margin: 2rem auto; padding: 0 1.25rem; line-height: 1.5; }
h1 { font-size: 1.7rem; margin-bottom: 0.2rem; } h2 { margin-top: 2.2rem; border-bottom: 1px solid #ccc; }
h3 { margin-top: 1.6rem; }
html { -webkit-text-size-adjust: 100%; }
.table-wrap { overflow-x: auto; max-width: 100%; margin: 0.8rem 0; }
table { border-collapse: collapse; font-size: 0.92rem; }
th, td { border: 1px solid #d0d0d0; padding: 0.25rem 0.55rem; text-align: left; vertical-align: top; }
th { background: #f3f3f3; } td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
.n { white-space: nowrap; }
p code, li code, .card code { overflow-wrap: anywhere; }
nav.toc ul { display: flex; flex-wrap: wrap; gap: 0.3rem 1.2rem; list-style: none; padding: 0; margin: 0.6rem 0 0; }
nav.toc a { color: #2a5d8f; }
.headline { display: grid; grid-template-columns: repeat(auto-fit, minmax(13.5rem, 1fr)); gap: 0.8rem; margin: 1.2rem 0; }
.card { border: 1px solid #d6dde6; border-radius: 6px; padding: 0.6rem 0.8rem; background: #f8fafc; min-width: 0; }
.card .label { font-size: 0.8rem; text-transform: uppercase; letter-spacing: 0.04em; color: #52606d; }
.card .value { font-size: 1.15rem; font-weight: 600; margin: 0.2rem 0; overflow-wrap: anywhere; }
.card .detail { font-size: 0.88rem; color: #3e4c59; }
details { margin: 0.8rem 0; } summary { cursor: pointer; font-weight: 600; }
figure { margin: 1rem 0; } figure svg { max-width: 100%; height: auto; display: block; }
figcaption { color: #555; font-size: 0.9rem; }
pre { background: #f6f6f6; padding: 0.8rem; overflow-x: auto; border: 1px solid #ddd; }
code { font-family: "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 0.92em; }
p.note { background: #eef4fb; border-left: 4px solid #4c78a8; padding: 0.5rem 0.8rem; }
p.flag { background: #fdf0e6; border-left: 4px solid #d95f02; padding: 0.5rem 0.8rem; }
`;

/** A number as the report writes it (4 significant figures, thousands commas, exponent, minus sign). */
const NUMBER = /[-−]?\d[\d,]*(?:\.\d+)?(?:e[-+]?\d+)?/g;

/** Escaped text with every number in a no-wrap span, so no line breaks inside a number. */
function text(raw: string): string {
  let out = '';
  let last = 0;
  for (const m of raw.matchAll(NUMBER)) {
    out += escapeHtml(raw.slice(last, m.index)) + `<span class="n">${escapeHtml(m[0])}</span>`;
    last = m.index + m[0].length;
  }
  return out + escapeHtml(raw.slice(last));
}

function inline(p: Inline): string {
  if (typeof p === 'string') return text(p);
  let t = p.code ? escapeHtml(p.text) : text(p.text);
  if (p.code) t = `<code>${t}</code>`;
  if (p.strong) t = `<strong>${t}</strong>`;
  if (p.key !== undefined) t = `<span data-key="${escapeHtml(p.key)}">${t}</span>`;
  return t;
}

function inlines(ps: Inline[]): string {
  return ps.map(inline).join('');
}

/**
 * One self-contained HTML page: inline CSS, the SVGs inlined, no scripts, no external resources;
 * a Content-Security-Policy forbids scripts and every network load as a second line of defence.
 */
export function renderHtml(title: string, blocks: Block[], svgs: ReadonlyMap<string, string>): string {
  const out: string[] = [];
  const body: string[] = [];
  renderBlocks(blocks, svgs, body);
  out.push('<!DOCTYPE html>');
  out.push('<html lang="en">');
  out.push('<head>');
  out.push('<meta charset="utf-8">');
  out.push(
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`,
  );
  out.push('<meta name="viewport" content="width=device-width, initial-scale=1">');
  out.push(`<title>${escapeHtml(title)}</title>`);
  out.push(`<style>${STYLE}</style>`);
  out.push('</head>');
  out.push('<body>');
  out.push(...body);
  out.push('</body>');
  out.push('</html>');
  return out.join('\n') + '\n';
}

function renderBlocks(blocks: Block[], svgs: ReadonlyMap<string, string>, dst: string[]): void {
  for (const b of blocks) {
    switch (b.kind) {
      case 'heading': {
        const id = b.id !== undefined ? ` id="${escapeHtml(b.id)}"` : '';
        dst.push(`<h${b.level}${id}>${escapeHtml(b.text)}</h${b.level}>`);
        break;
      }
      case 'paragraph':
        dst.push(`<p${b.tone ? ` class="${b.tone}"` : ''}>${inlines(b.parts)}</p>`);
        break;
      case 'list':
        dst.push(`<ul>${b.items.map((it) => `<li>${inlines(it)}</li>`).join('')}</ul>`);
        break;
      case 'table': {
        const num = b.numeric ?? [];
        const head = b.header.map((h) => `<th>${escapeHtml(h)}</th>`).join('');
        const rows = b.rows
          .map((r) => `<tr>${r.map((c, j) => `<td${num[j] ? ' class="num"' : ''}>${inline(c)}</td>`).join('')}</tr>`)
          .join('\n');
        dst.push(`<div class="table-wrap"><table>\n<thead><tr>${head}</tr></thead>\n<tbody>\n${rows}\n</tbody>\n</table></div>`);
        break;
      }
      case 'plot': {
        const svg = svgs.get(b.name);
        if (svg === undefined) throw new Error(`report: plot '${b.name}' was not rendered`);
        dst.push(
          `<figure class="plot" data-plot="${escapeHtml(b.name)}">${svg}<figcaption>${escapeHtml(b.title)}</figcaption></figure>`,
        );
        break;
      }
      case 'code':
        dst.push(`<pre><code>${escapeHtml(b.text)}</code></pre>`);
        break;
      case 'toc':
        dst.push(`<nav class="toc" aria-label="Contents"><ul>${b.items.map((it) => `<li><a href="#${escapeHtml(it.id)}">${escapeHtml(it.text)}</a></li>`).join('')}</ul></nav>`);
        break;
      case 'headline':
        dst.push(
          `<section class="headline">${b.items
            .map((it) => `<div class="card"><div class="label">${escapeHtml(it.label)}</div><div class="value">${inlines(it.value)}</div><div class="detail">${inlines(it.detail)}</div></div>`)
            .join('')}</section>`,
        );
        break;
      case 'details': {
        dst.push(`<details><summary>${text(b.summary)}</summary>`);
        renderBlocks(b.blocks, svgs, dst);
        dst.push('</details>');
        break;
      }
    }
  }
}
