import type { Block, Inline } from './doc.ts';
import { escapeMarkdown, markdownFence, slug } from './escape.ts';

function inline(p: Inline, inTable = false): string {
  if (typeof p === 'string') return escapeMarkdown(p);
  let t = escapeMarkdown(p.text);
  if (p.code) t = codeSpan(p.text, inTable);
  if (p.strong) t = `**${t}**`;
  return t;
}

/**
 * A code span (CommonMark 0.31 §6.1): delimiters longer than any backtick run inside; no HTML
 * forms in it. In a table cell `|` is escaped as `\|` (GitHub tables extension, §4.10).
 */
function codeSpan(text: string, inTable: boolean): string {
  let t = text.replace(/\r\n|\r|\n/g, ' ');
  if (inTable) t = t.replace(/\|/g, '\\|');
  let longest = 0;
  for (const m of t.matchAll(/`+/g)) longest = Math.max(longest, m[0].length);
  const d = '`'.repeat(longest + 1);
  const pad = t.startsWith('`') || t.endsWith('`') ? ' ' : '';
  return `${d}${pad}${t}${pad}${d}`;
}

function inlines(ps: Inline[]): string {
  return ps.map((p) => inline(p)).join('');
}

/** The report as GitHub-flavoured Markdown; plots are referenced as `plots/<name>.svg`. */
export function renderMarkdown(blocks: Block[]): string {
  const out: string[] = [];
  renderBlocks(blocks, out);
  return out.join('\n\n') + '\n';
}

/** GitHub's heading anchor: lower case, punctuation dropped, spaces to hyphens. */
function headingAnchor(text: string): string {
  return slug(text, 'section');
}

function renderBlocks(blocks: Block[], out: string[]): void {
  for (const b of blocks) {
    switch (b.kind) {
      case 'heading':
        out.push(`${'#'.repeat(b.level)} ${escapeMarkdown(b.text)}`);
        break;
      case 'paragraph':
        out.push(b.tone ? `> ${inlines(b.parts)}` : inlines(b.parts));
        break;
      case 'list':
        out.push(b.items.map((it) => `- ${inlines(it)}`).join('\n'));
        break;
      case 'table': {
        const num = b.numeric ?? [];
        const head = `| ${b.header.map(escapeMarkdown).join(' | ')} |`;
        const rule = `|${b.header.map((_, j) => (num[j] ? ' ---: ' : ' --- ')).join('|')}|`;
        const rows = b.rows.map((r) => `| ${r.map((c) => inline(c, true)).join(' | ')} |`);
        out.push([head, rule, ...rows].join('\n'));
        break;
      }
      case 'plot':
        out.push(`![${escapeMarkdown(b.title)}](plots/${b.name}.svg)`);
        break;
      case 'code':
        out.push(markdownFence(b.text));
        break;
      case 'toc':
        out.push(b.items.map((it) => `- [${escapeMarkdown(it.text)}](#${headingAnchor(it.text)})`).join('\n'));
        break;
      case 'headline':
        out.push(b.items.map((it) => `- **${escapeMarkdown(it.label)}:** ${inlines(it.value)} — ${inlines(it.detail)}`).join('\n'));
        break;
      case 'details':
        // Markdown has no folding without raw HTML: the summary becomes a bold line above the content
        out.push(`**${escapeMarkdown(b.summary)}**`);
        renderBlocks(b.blocks, out);
        break;
    }
  }
}
