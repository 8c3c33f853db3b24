import cliProgress from 'cli-progress';
import type { CliIo } from './io.js';

export interface ProgressHooks {
  readonly onStage: (stage: string) => void;
  readonly onProgress: (stage: string, done: number, total: number) => void;
  readonly stop: () => void;
}

/**
 * Progress on stderr: a bar per stage when stderr is a terminal, nothing otherwise (logs and
 * pipes stay clean), and nothing at all with --quiet.
 */
export function createProgress(io: CliIo, quiet: boolean): ProgressHooks {
  if (quiet || !io.isTTY) return { onStage: () => {}, onProgress: () => {}, stop: () => {} };
  let bar: cliProgress.SingleBar | undefined;
  let current = '';
  const stop = (): void => {
    bar?.stop();
    bar = undefined;
  };
  return {
    onStage: (stage) => {
      stop();
      current = stage;
      io.stderr(`${stage}…\n`);
    },
    onProgress: (stage, done, total) => {
      if (stage !== current) return;
      if (!bar) {
        bar = new cliProgress.SingleBar(
          { format: `  ${stage} [{bar}] {percentage}% {value}/{total}`, stream: process.stderr, hideCursor: true },
          cliProgress.Presets.shades_classic,
        );
        bar.start(total, 0);
      }
      bar.setTotal(total);
      bar.update(done);
    },
    stop,
  };
}
