/**
 * Test helpers: count the items vega drew in a named mark layer of an SVG, and decode a PNG
 * (W3C Portable Network Graphics Specification, 2nd ed., §5–§9: signature, chunks, zlib stream,
 * per-row filters 0–4) with node:zlib, for 8-bit RGB/RGBA/grey images without interlacing.
 */
import { inflateSync } from 'node:zlib';

/** Number of drawn items in the layer named `name` (vega writes `<g class="mark-… role-mark NAME_marks">`). */
export function countMarks(svg: string, name: string): number {
  const open = new RegExp(`<g class="mark-[a-z]+ role-mark ${name}_marks"[^>]*>`);
  const m = open.exec(svg);
  if (!m) return -1;
  const start = m.index + m[0].length;
  const end = svg.indexOf('</g>', start);
  const body = svg.slice(start, end);
  return (body.match(/<(path|line|rect|text|circle)\b/g) ?? []).length;
}

/** PNG signature (PNG spec §5.2). */
export const PNG_SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];

export interface DecodedPng {
  width: number;
  height: number;
  channels: number;
  pixels: Uint8Array;
}

export function decodePng(bytes: Uint8Array): DecodedPng {
  for (let i = 0; i < 8; i++) if (bytes[i] !== PNG_SIGNATURE[i]) throw new Error('not a PNG');
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let off = 8;
  let width = 0, height = 0, depth = 0, colorType = 0, interlace = 0;
  const idat: Uint8Array[] = [];
  while (off < bytes.length) {
    const len = dv.getUint32(off);
    const type = String.fromCharCode(...bytes.subarray(off + 4, off + 8));
    const data = bytes.subarray(off + 8, off + 8 + len);
    if (type === 'IHDR') {
      width = dv.getUint32(off + 8);
      height = dv.getUint32(off + 12);
      depth = data[8]!;
      colorType = data[9]!;
      interlace = data[12]!;
    } else if (type === 'IDAT') idat.push(data);
    else if (type === 'IEND') break;
    off += 12 + len;
  }
  if (depth !== 8 || interlace !== 0) throw new Error(`unsupported PNG: depth ${depth}, interlace ${interlace}`);
  const channels = ({ 0: 1, 2: 3, 4: 2, 6: 4 } as Record<number, number>)[colorType];
  if (channels === undefined) throw new Error(`unsupported colour type ${colorType}`);
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const out = new Uint8Array(height * stride);
  for (let y = 0; y < height; y++) {
    const f = raw[y * (stride + 1)]!;
    const src = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let x = 0; x < stride; x++) {
      const a = x >= channels ? out[y * stride + x - channels]! : 0;
      const b = y > 0 ? out[(y - 1) * stride + x]! : 0;
      const c = x >= channels && y > 0 ? out[(y - 1) * stride + x - channels]! : 0;
      let v = src[x]!;
      if (f === 1) v += a;
      else if (f === 2) v += b;
      else if (f === 3) v += (a + b) >> 1;
      else if (f === 4) {
        const p = a + b - c;
        const pa = Math.abs(p - a), pb = Math.abs(p - b), pc = Math.abs(p - c);
        v += pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      }
      out[y * stride + x] = v & 255;
    }
  }
  return { width, height, channels, pixels: out };
}

/** Fraction of pixels that are not (near) white, and the number of distinct colours. */
export function inkStats(p: DecodedPng): { inked: number; distinct: number } {
  let ink = 0;
  const seen = new Set<number>();
  const n = p.width * p.height;
  for (let i = 0; i < n; i++) {
    const o = i * p.channels;
    const r = p.pixels[o]!, g = p.pixels[o + (p.channels >= 3 ? 1 : 0)]!, b = p.pixels[o + (p.channels >= 3 ? 2 : 0)]!;
    if (r < 245 || g < 245 || b < 245) ink++;
    if (seen.size < 100_000) seen.add((r << 16) | (g << 8) | b);
  }
  return { inked: ink / n, distinct: seen.size };
}

/**
 * Layout figures of an open page (read in the browser): the document's scrollWidth against the
 * viewport's innerWidth, and the smallest on-screen size of any plot text (its font size times the
 * SVG's drawn width over its own width).
 */
export async function pageMetrics(page: { evaluate<T>(f: () => T): Promise<T> }): Promise<{ scrollWidth: number; innerWidth: number; smallestPlotText: number }> {
  return page.evaluate(() => {
    let smallest = Infinity;
    for (const svg of Array.from(document.querySelectorAll('figure.plot > svg'))) {
      const w = Number(svg.getAttribute('width'));
      const drawn = svg.getBoundingClientRect().width;
      if (!(w > 0) || !(drawn > 0)) continue;
      for (const t of Array.from(svg.querySelectorAll('text'))) {
        const size = parseFloat(t.getAttribute('font-size') ?? getComputedStyle(t).fontSize);
        if (size > 0 && (t.textContent ?? '').trim() !== '') smallest = Math.min(smallest, (size * drawn) / w);
      }
    }
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth, smallestPlotText: smallest };
  });
}

/**
 * The layout checks at one viewport width, folded sections opened: no horizontal page overflow
 * (scrollWidth ≤ innerWidth), plot text of at least 11 px on screen at 1280 px and wider, and a
 * screenshot that is not blank.
 */
export async function checkWidth(
  page: { setViewportSize(s: { width: number; height: number }): Promise<void>; evaluate<T>(f: () => T): Promise<T>; screenshot(o: { fullPage: boolean }): Promise<Uint8Array> },
  width: number,
  expectFn: (v: unknown, message?: string) => { toBeLessThanOrEqual(n: number): void; toBeGreaterThanOrEqual(n: number): void; toBeGreaterThan(n: number): void },
): Promise<void> {
  await page.setViewportSize({ width, height: 900 });
  await page.evaluate(() => document.querySelectorAll('details').forEach((d) => (d.open = true)));
  const m = await pageMetrics(page);
  expectFn(m.scrollWidth, `scrollWidth at ${width} px`).toBeLessThanOrEqual(m.innerWidth);
  if (width >= 1280) expectFn(m.smallestPlotText, `smallest plot text at ${width} px`).toBeGreaterThanOrEqual(11);
  const ink = inkStats(decodePng(new Uint8Array(await page.screenshot({ fullPage: false }))));
  expectFn(ink.inked, `screenshot at ${width} px`).toBeGreaterThan(0.01);
  expectFn(ink.distinct, `colours at ${width} px`).toBeGreaterThan(20);
}
