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
            { format: `${label} [{bar}] {percentage}% {note}`, hideCursor: true, stream: process.stderr },
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
  let last = 0;
  let lastLine = '';
  let stopped = false;
  return {
    update(done, total, note = '') {
      const now = Date.now();
      const pct = total > 0 ? Math.floor((100 * done) / total) : 0;
      lastLine = `${label}: ${pct}% (${done}/${total})${note ? ` ${note}` : ''}\n`;
      if (now - last >= everyMs) {
        last = now;
        io.stderr(lastLine);
        lastLine = '';
      }
    },
    stop() {
      if (stopped) return;
      stopped = true;
      if (lastLine) io.stderr(lastLine);
    },
  };
}
