/**
 * The report as data: a list of blocks that the HTML and Markdown writers both render, so the
 * two files always carry the same words and the same numbers. Every string in a block is plain
 * text; the writers escape it.
 */

/** A run of text; `key` marks a key figure (HTML gets `data-key`, used by tests and readers). */
export type Inline = string | { text: string; key?: string; strong?: boolean; code?: boolean };

export type Block =
  | { kind: 'heading'; level: 1 | 2 | 3; text: string; id?: string }
  | { kind: 'paragraph'; parts: Inline[]; tone?: 'note' | 'flag' }
  | { kind: 'list'; items: Inline[][] }
  | { kind: 'table'; header: string[]; rows: Inline[][]; numeric?: boolean[] }
  | { kind: 'plot'; name: string; title: string }
  | { kind: 'code'; text: string }
  /** Links to the level-2 sections (ids as given to their headings). */
  | { kind: 'toc'; items: Array<{ id: string; text: string }> }
  /** The few figures that matter, each a label, a value and a line of detail. */
  | { kind: 'headline'; items: Array<{ label: string; value: Inline[]; detail: Inline[] }> }
  /** Blocks folded away under a one-line summary. */
  | { kind: 'details'; summary: string; blocks: Block[] };

export function inlineText(p: Inline): string {
  return typeof p === 'string' ? p : p.text;
}
