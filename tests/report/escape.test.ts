import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { escapeHtml, escapeMarkdown, markdownFence, slug } from '../../src/report/escape.ts';
import { EVIL } from './fixture-input.ts';

// The five characters with meaning in HTML text and attribute values (HTML Living Standard,
// "Escaping a string"; OWASP XSS prevention cheat sheet, rule 1).
const ENTITY: Record<string, string> = { '&amp;': '&', '&lt;': '<', '&gt;': '>', '&quot;': '"', '&#39;': "'" };
const unescape = (s: string) => s.replace(/&(amp|lt|gt|quot|#39);/g, (m) => ENTITY[m]!);

describe('escapeHtml', () => {
  it('turns the malicious column name into inert text', () => {
    expect(escapeHtml(EVIL)).toBe('&lt;img src=x onerror=alert(1)&gt;');
    expect(escapeHtml(`"'&`)).toBe('&quot;&#39;&amp;');
  });
  it('leaves no markup character and loses nothing (property)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme' }), (s) => {
        const e = escapeHtml(s);
        expect(e).not.toMatch(/[<>"']/);
        expect(unescape(e)).toBe(s);
      }),
    );
  });
});

describe('escapeMarkdown', () => {
  it('leaves no raw HTML and escapes table and emphasis markup (CommonMark 0.31 §2.4, §6.6)', () => {
    const e = escapeMarkdown(EVIL);
    expect(e).not.toContain('<');
    expect(e).toBe('&lt;img src=x onerror=alert(1)&gt;');
    expect(escapeMarkdown('a|b*c_d`e[f]')).toBe('a\\|b\\*c\\_d\\`e\\[f\\]');
    expect(escapeMarkdown('two\nlines')).toBe('two lines');
  });
  it('never leaves an unescaped pipe, so a table cell cannot split (GFM tables §4.10; property)', () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        const e = escapeMarkdown(s);
        expect(e).not.toMatch(/(^|[^\\])\|/);
        expect(e).not.toMatch(/[<>\n\r]/);
      }),
    );
  });
});

describe('markdownFence', () => {
  it('uses a fence longer than any backtick run inside (CommonMark 0.31 §4.5)', () => {
    const text = 'a ``` b ```` c';
    const f = markdownFence(text);
    expect(f.startsWith('`````\n')).toBe(true);
    expect(f.endsWith('\n`````')).toBe(true);
    expect(f).toContain(text);
  });
});

describe('slug', () => {
  it('gives a file-safe stem', () => {
    expect(slug(EVIL)).toBe('img-src-x-onerror-alert-1');
    expect(slug('integrated gradients')).toBe('integrated-gradients');
    expect(slug('<>')).toBe('plot');
    fc.assert(fc.property(fc.string(), (s) => void expect(slug(s)).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/)));
  });
});
