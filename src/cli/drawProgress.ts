// Draws a progress bar on standard error when it is a terminal; silent otherwise.
import cliProgress from 'cli-progress';

export interface ProgressDrawer {
  update: (done: number, total: number, label: string) => void;
  stop: () => void;
}

export function drawProgress(stream: NodeJS.WriteStream): ProgressDrawer {
  let bar: cliProgress.SingleBar | undefined;
  return {
    update(done, total, label) {
      if (!stream.isTTY || total < 2) return;
      if (bar === undefined) {
        bar = new cliProgress.SingleBar(
          { stream, format: '{bar} {value}/{total} {label}', hideCursor: true, clearOnComplete: true },
          cliProgress.Presets.shades_classic,
        );
        bar.start(total, done, { label });
      }
      bar.update(done, { label });
    },
    stop() {
      bar?.stop();
      bar = undefined;
    },
  };
}
