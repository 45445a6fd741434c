import cliProgress from 'cli-progress';
import type { CliIO } from './io.ts';

export interface Progress {
  /** Report `done` of `total` units, with an optional short note. */
  update(done: number, total: number, note?: string): void;
  /** Finish the bar (or the plain lines). Safe to call twice. */
  stop(): void;
}

/**
 * Progress on stderr (stdout stays clean for --json): an animated bar on a terminal; plain lines
 * at most every `everyMs` (and at the end) when stderr is not a terminal; nothing when disabled.
 */
export function makeProgress(io: CliIO, label: string, enabled: boolean, everyMs = 5000): Progress {
  if (!enabled) return { update() {}, stop() {} };
  if (io.isTTY) {
    let bar: cliProgress.SingleBar | null = null;
    return {
      update(done, total, note = '') {
        if (!bar) {
          bar = new cliProgress.SingleBar(
            {
              format: `${label} [{bar}] {percentage}% {note}`,
              hideCursor: true,
              // io.stderr is a terminal here (io.isTTY); give cli-progress a stream view of it
              stream: { write: (s: string) => io.stderr(s), isTTY: true, columns: 80 } as unknown as NodeJS.WritableStream,
            },
            cliProgress.Presets.legacy,
          );
          bar.start(total, done, { note });
        }
        bar.setTotal(total);
        bar.update(done, { note });
      },
      stop() {
        bar?.stop();
        bar = null;
      },
    };
  }
  // Plain lines: none for work that ends within `everyMs`; then one line per `everyMs` and a last one.
  let last = Date.now();
  let lastLine = '';
  let printed = false;
  let stopped = false;
  return {
    update(done, total, note = '') {
      const now = Date.now();
      const pct = total > 0 ? Math.floor((100 * done) / total) : 0;
      lastLine = `${label}: ${pct}% (${done}/${total})${note ? ` ${note}` : ''}\n`;
      if (now - last >= everyMs) {
        last = now;
        printed = true;
        io.stderr(lastLine);
        lastLine = '';
      }
    },
    stop() {
      if (stopped) return;
      stopped = true;
      if (printed && lastLine) io.stderr(lastLine);
    },
  };
}

/** Files smaller than this are read without progress output. */
export const READ_PROGRESS_MIN_BYTES = 32 * 2 ** 20;

/**
 * A `readTable` onProgress callback for `file`: a bar on a terminal, plain lines every 5 s on a
 * pipe; nothing for small files or when disabled. Call `stop()` after reading.
 */
export function readingProgress(io: CliIO, file: string, enabled: boolean): Progress & { onProgress?: (bytes: number, total: number) => void } {
  const bar = makeProgress(io, `reading ${file}`, enabled);
  return {
    onProgress: enabled
      ? (bytes, total) => {
          if (total >= READ_PROGRESS_MIN_BYTES) bar.update(bytes, total);
        }
      : undefined,
    update: bar.update,
    stop: bar.stop,
  };
}
