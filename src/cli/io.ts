/** Where a command writes. The CLI passes process streams; tests pass collectors. */
export interface CliIO {
  stdout(text: string): void;
  stderr(text: string): void;
  /** True when stderr is a terminal: progress bars animate only then, else plain periodic lines. */
  isTTY: boolean;
  /** Working directory for relative paths. */
  cwd: string;
}

export function processIO(): CliIO {
  return {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    isTTY: Boolean(process.stderr.isTTY),
    cwd: process.cwd(),
  };
}

/** An IO that collects everything, for tests. */
export function memoryIO(cwd = process.cwd()): CliIO & { out: string; err: string } {
  const io = {
    out: '',
    err: '',
    isTTY: false,
    cwd,
    stdout(t: string) {
      io.out += t;
    },
    stderr(t: string) {
      io.err += t;
    },
  };
  return io;
}
