/**
 * A streaming splitter for delimited text (CSV, TSV) following RFC 4180 section 2: records end
 * with CRLF or LF, the last record may lack a line break, fields may be quoted with `"`, a quote
 * inside a quoted field is doubled, and quoted fields may hold separators and line breaks.
 * Lines without a quote take a fast path (indexOf on the separator); a record with a quote is
 * read character by character. Fields go to a handler as strings, one call per cell, with no
 * per-row objects. Physical line numbers (1-based) are tracked for messages.
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { isAscii } from 'node:buffer';
import { StringDecoder } from 'node:string_decoder';
import { SurmiseError, fileErrorReason } from '../errors.ts';

export interface DelimitedHandler {
  /** One field of the current record; `quoted` when it was written in quotes. */
  cell(col: number, text: string, quoted: boolean): void;
  /** End of a record of `nFields` fields that starts on physical line `line`. */
  endRow(nFields: number, line: number): void;
  /** Column description for messages, e.g. "column 'x' (3)". */
  columnLabel(col: number): string;
  /**
   * Optional fast path for an unquoted field of a quote-free line: take the cell starting at
   * `text[start]` straight from the text (no substring), reading up to the first `sep` character
   * or `lineEnd`; `bytes`, when not null, holds the same characters as bytes (ASCII text). Returns the index where the field ends, or -1 to have it sent to `cell` instead.
   */
  cellAt?(col: number, text: string, bytes: Uint8Array | null, start: number, lineEnd: number, sep: number): number;
  /** Checked after each chunk: true stops the scan early. */
  done?(): boolean;
}

export interface ScanInfo {
  bytes: number;
  /** number of blank lines skipped */
  blankLines: number;
}

const CHUNK = 1 << 22;
const REPLACEMENT = Buffer.from([0xef, 0xbf, 0xbd]);
const QUOTE = 34;
const CR = 13;
const LF = 10;

/** Open a file for reading, turning system errors into `table.unreadable`. */
export function openForReading(path: string, display: string): { fd: number; size: number } {
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch (e) {
    throw unreadable(display, e);
  }
  const st = fstatSync(fd);
  if (st.isDirectory()) {
    closeSync(fd);
    throw new SurmiseError('table.unreadable', `cannot read ${display}: it is a folder, not a file`);
  }
  return { fd, size: st.size };
}

export function unreadable(display: string, e: unknown): SurmiseError {
  return new SurmiseError('table.unreadable', `cannot read ${display}: ${fileErrorReason(e)}`);
}

/** One chunk of decoded text; for ASCII text also its bytes, and the string is made on demand. */
export class TextChunk {
  /** the characters as bytes (`bytes[i] === text().charCodeAt(i)`) when the text is ASCII, else null */
  readonly bytes: Uint8Array | null;
  readonly length: number;
  private str: string | null;
  constructor(str: string | null, bytes: Uint8Array | null) {
    this.str = str;
    this.bytes = bytes;
    this.length = str !== null ? str.length : bytes!.length;
  }
  /** the chunk as a string (an ASCII chunk is copied once, on the first call) */
  text(): string {
    if (this.str === null) this.str = Buffer.from(this.bytes!.buffer, this.bytes!.byteOffset, this.bytes!.length).toString('latin1');
    return this.str;
  }
}

/**
 * Read a file as UTF-8 text in chunks, calling `onText(chunk, final)` which returns how many
 * characters it consumed; the rest is carried into the next call. `onFirst` sees the first
 * decoded chunk (for size estimates).
 */
export function readTextChunks(
  path: string,
  display: string,
  onText: (chunk: TextChunk, final: boolean) => number,
  opts: { onFirst?: (text: string, fileBytes: number) => void; onProgress?: (bytes: number, total: number) => void; stop?: () => boolean } = {},
): number {
  const { fd, size } = openForReading(path, display);
  // StringDecoder is ~3x faster than a fatal TextDecoder here; invalid bytes become U+FFFD, so a
  // chunk holding U+FFFD is re-checked strictly (a file may also contain U+FFFD legitimately).
  // ASCII is UTF-8 read byte for byte: while the file is ASCII (after a BOM), the chunk is handed
  // over as bytes (its string, when asked for, is a latin1 copy at a fraction of the decoder's
  // cost), and the unconsumed rest is carried as
  // bytes at the front of the buffer so that every text is one flat string (a concatenation
  // `carry + piece` made character access about twice as slow, measured). From the first byte
  // >= 0x80 on, everything goes through the UTF-8 decoder, which starts fresh at that chunk (the
  // bytes before it were ASCII, so no character is split).
  const decoder = new StringDecoder('utf8');
  let tail = Buffer.alloc(0);
  let buf = Buffer.allocUnsafe(CHUNK);
  let carry = '';
  let kept = 0; // carried bytes at buf[0..kept) while the file is ASCII
  let total = 0;
  let first = true;
  let allAscii = true;
  try {
    for (;;) {
      if (allAscii && buf.length - kept < CHUNK / 2) {
        const bigger = Buffer.allocUnsafe(buf.length * 2);
        buf.copy(bigger, 0, 0, kept);
        buf = bigger;
      }
      const at = allAscii ? kept : 0;
      let n: number;
      try {
        n = readSync(fd, buf, at, buf.length - at, null);
      } catch (e) {
        throw unreadable(display, e);
      }
      total += n;
      const final = n === 0;
      const end = at + n;
      const from = total === n && n >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf ? 3 : 0;
      if (allAscii && !isAscii(buf.subarray(Math.max(at, from), end))) allAscii = false;
      let chunk: TextChunk;
      if (allAscii) chunk = new TextChunk(null, buf.subarray(from, end));
      else {
        const raw = buf.subarray(from, end);
        const piece = final ? decoder.end() : decoder.write(raw);
        if (piece.indexOf('\ufffd') >= 0 || (final && piece.length > 0)) {
          // count U+FFFD written in the file (bytes EF BF BD, possibly begun in the previous chunk's tail)
          const joined = Buffer.concat([tail, raw]);
          let written = 0;
          for (let k = joined.indexOf(REPLACEMENT); k >= 0; k = joined.indexOf(REPLACEMENT, k + 3)) written++;
          let decoded = 0;
          for (let k = piece.indexOf('\ufffd'); k >= 0; k = piece.indexOf('\ufffd', k + 1)) decoded++;
          if (decoded > written)
            throw new SurmiseError('table.badEncoding', `cannot read ${display}: it is not UTF-8 text (invalid bytes before byte ${total})`);
        }
        if (raw.length >= 2) tail = Buffer.from(raw.subarray(raw.length - 2));
        chunk = new TextChunk(carry.length > 0 ? carry + piece : piece, null);
      }
      if (first && chunk.length > 0) {
        opts.onFirst?.(chunk.text(), size);
        first = false;
      }
      const used = onText(chunk, final);
      if (allAscii) {
        kept = used >= chunk.length ? 0 : chunk.length - used;
        if (kept > 0) buf.copy(buf, 0, from + used, end);
      } else carry = used >= chunk.length ? '' : chunk.text().substring(used);
      opts.onProgress?.(total, size);
      if (final || opts.stop?.()) break;
    }
  } finally {
    closeSync(fd);
  }
  return total;
}

/** Scan a delimited file, sending every field to `h`. */
export function scanDelimited(
  path: string,
  display: string,
  sep: string,
  h: DelimitedHandler,
  opts: { onFirst?: (text: string, fileBytes: number) => void; onProgress?: (bytes: number, total: number) => void } = {},
): ScanInfo {
  const SEP = sep.charCodeAt(0);
  let line = 1;
  let blankLines = 0;
  const MAX = Number.MAX_SAFE_INTEGER;
  const fast = h.cellAt !== undefined;

  // a record containing a quote, read character by character; returns the new position or -1 when incomplete
  const slow = (text: string, pos: number, final: boolean): number => {
    const len = text.length;
    const fields: string[] = [];
    const quotedFlags: boolean[] = [];
    let i = pos;
    for (;;) {
      if (i < len && text.charCodeAt(i) === QUOTE) {
        const open = i;
        let j = i + 1;
        let seg = j;
        let value = '';
        for (;;) {
          const k = text.indexOf('"', j);
          if (k < 0) {
            if (!final) return -1;
            throw new SurmiseError(
              'table.unterminatedQuote',
              `${display}:${line + countLF(text, pos, open)}: unterminated quote: the quoted field that opens here in ${h.columnLabel(fields.length)} never closes`,
            );
          }
          if (k + 1 >= len && !final) return -1;
          if (k + 1 < len && text.charCodeAt(k + 1) === QUOTE) {
            value += text.substring(seg, k + 1);
            j = k + 2;
            seg = j;
            continue;
          }
          value += text.substring(seg, k);
          i = k + 1;
          break;
        }
        fields.push(value);
        quotedFlags.push(true);
        if (i >= len) {
          if (!final) return -1;
          break;
        }
        const c = text.charCodeAt(i);
        if (c === SEP) {
          i++;
          continue;
        }
        if (c === LF) {
          i++;
          break;
        }
        if (c === CR) {
          if (i + 1 >= len && !final) return -1;
          if (i + 1 >= len) {
            i++;
            break;
          }
          if (text.charCodeAt(i + 1) === LF) {
            i += 2;
            break;
          }
        }
        throw new SurmiseError(
          'table.badQuote',
          `${display}:${line + countLF(text, pos, i)}: text after the closing quote in ${h.columnLabel(fields.length - 1)}; a quote inside a quoted field is written twice ("")`,
        );
      }
      // unquoted field (a quote inside it is taken literally)
      let k = i;
      while (k < len) {
        const c = text.charCodeAt(k);
        if (c === SEP || c === LF) break;
        k++;
      }
      if (k >= len && !final) return -1;
      let end = k;
      if ((k >= len || text.charCodeAt(k) === LF) && end > i && text.charCodeAt(end - 1) === CR) end--;
      fields.push(text.substring(i, end));
      quotedFlags.push(false);
      if (k < len && text.charCodeAt(k) === SEP) {
        i = k + 1;
        continue;
      }
      i = k < len ? k + 1 : k;
      break;
    }
    for (let f = 0; f < fields.length; f++) h.cell(f, fields[f]!, quotedFlags[f]!);
    h.endRow(fields.length, line);
    line += countLF(text, pos, i);
    return i;
  };

  // a quote-free chunk of ASCII text, read from its bytes: numeric cells go to h.cellAt without
  // any string being made; other cells are cut from the chunk's string (made once, on demand)
  const onBytes = (chunk: TextChunk, final: boolean): number => {
    const b = chunk.bytes!;
    const len = b.length;
    // complete lines end at the chunk's last LF (or at its end in the final chunk)
    const limit = final ? len : b.lastIndexOf(LF) + 1;
    let pos = 0;
    let q = -1; // next quote at or after pos (cached)
    while (pos < limit) {
      if (q < pos && q !== MAX) {
        q = b.indexOf(QUOTE, pos);
        if (q < 0) q = MAX;
      }
      if (q !== MAX) {
        let nl = b.indexOf(LF, pos);
        if (nl < 0) nl = len;
        if (q < nl) {
          const r = slow(chunk.text(), pos, final);
          if (r < 0) return pos;
          pos = r;
          continue;
        }
      }
      const c0 = b[pos];
      if (c0 === LF || (c0 === CR && (pos + 1 === len || b[pos + 1] === LF))) {
        blankLines++;
        line++;
        pos += c0 === LF || pos + 1 === len ? 1 : 2;
        continue;
      }
      let col = 0;
      let a = pos;
      for (;;) {
        let f = h.cellAt!(col, '', b, a, limit, SEP);
        if (f < 0) {
          // not a plain number: the field runs to the separator or the line end (a CR before LF is not part of it)
          f = a;
          while (f < limit) {
            const c = b[f];
            if (c === SEP || c === LF) break;
            f++;
          }
          const e = (f === limit || b[f] === LF) && f > a && b[f - 1] === CR ? f - 1 : f;
          h.cell(col, chunk.text().substring(a, e), false);
          if (e < f) f = e; // f now at the CR that ends the line
        }
        col++;
        if (f >= limit) {
          pos = limit;
          break;
        }
        const c = b[f];
        if (c === SEP) {
          a = f + 1;
          continue;
        }
        // LF, or CR before LF (or at the end of the file)
        pos = c === LF ? f + 1 : f + 2 <= len ? f + 2 : len;
        break;
      }
      h.endRow(col, line);
      line++;
    }
    if (final && pos < len) return len;
    return pos;
  };

  const onText = (chunk: TextChunk, final: boolean): number => {
    if (fast && chunk.bytes !== null) return onBytes(chunk, final);
    const text = chunk.text();
    const len = text.length;
    let pos = 0;
    let q = -1; // next quote at or after pos (cached)
    let s = -1; // next separator at or after the field start (cached)
    while (pos < len) {
      let nl = text.indexOf('\n', pos);
      if (nl < 0) {
        if (!final) break;
        nl = len;
      }
      if (q < pos && q !== MAX) {
        q = text.indexOf('"', pos);
        if (q < 0) q = MAX;
      }
      if (q >= nl) {
        let end = nl;
        if (end > pos && text.charCodeAt(end - 1) === CR) end--;
        if (end === pos) {
          blankLines++;
        } else {
          let col = 0;
          let a = pos;
          for (;;) {
            if (fast) {
              const f = h.cellAt!(col, text, null, a, end, SEP);
              if (f >= 0) {
                col++;
                if (f >= end) break;
                a = f + 1;
                continue;
              }
            }
            if (s < a) {
              s = text.indexOf(sep, a);
              if (s < 0) s = MAX;
            }
            if (s >= end) {
              h.cell(col++, text.substring(a, end), false);
              break;
            }
            h.cell(col++, text.substring(a, s), false);
            a = s + 1;
          }
          h.endRow(col, line);
        }
        line++;
        pos = nl + 1;
      } else {
        const r = slow(text, pos, final);
        if (r < 0) break;
        pos = r;
        q = -1;
        s = -1;
      }
    }
    if (final && pos < len) return len;
    return pos;
  };
  const bytes = readTextChunks(path, display, onText, { ...opts, stop: h.done ? () => h.done!() : undefined });
  // a file ending without a line break counts the last line once; blank trailing lines are not rows
  return { bytes, blankLines };
}

function countLF(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = text.indexOf('\n', from); i >= 0 && i < to; i = text.indexOf('\n', i + 1)) n++;
  return n;
}
