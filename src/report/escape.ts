/**
 * Escaping of the user's strings (column names, labels, expressions, configuration text) for the
 * two report formats. Every string that came from the user's data passes through one of these.
 */

const HTML: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe inside HTML elements and quoted attributes (HTML Living Standard, §13.1.2.6 escaping). */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => HTML[c]!);
}

/**
 * Text safe inline in CommonMark/GitHub Markdown, including inside table cells: markup characters
 * (\\ ` * _ [ ] | ~ #) are backslash-escaped (CommonMark 0.31 §2.4: any ASCII punctuation may be
 * escaped; `(`, `)` and `!` need not be once `[` `]` are), `<`, `>` and
 * `&` become entities so no raw HTML can form, and line breaks become spaces.
 */
export function escapeMarkdown(s: string): string {
  return s
    .replace(/\r\n|\r|\n/g, ' ')
    .replace(/[\\`*_[\]|~#]/g, (c) => `\\${c}`)
    .replace(/[&<>]/g, (c) => HTML[c]!);
}

/**
 * A fenced code block holding `text` verbatim: the fence is one backtick longer than the longest
 * run of backticks inside (CommonMark 0.31 §4.5), so the text cannot close it.
 */
export function markdownFence(text: string, info = ''): string {
  let longest = 0;
  for (const m of text.matchAll(/`+/g)) longest = Math.max(longest, m[0].length);
  const fence = '`'.repeat(Math.max(3, longest + 1));
  const body = text.endsWith('\n') ? text : `${text}\n`;
  return `${fence}${info}\n${body}${fence}`;
}

/** A file-name stem from any string: lower-case ASCII letters, digits and single dashes. */
export function slug(s: string, fallback = 'plot'): string {
  const t = s
    .normalize('NFKD')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 48)
    .replace(/-+$/g, '');
  return t.length > 0 ? t : fallback;
}
