/** Where the CLI writes: injected so that tests can capture output without a subprocess. */
export interface CliIo {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** True when stderr is a terminal (progress bars are drawn only then). */
  readonly isTTY: boolean;
  readonly cwd: string;
}

export function processIo(): CliIo {
  return {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    isTTY: Boolean(process.stderr.isTTY),
    cwd: process.cwd(),
  };
}
