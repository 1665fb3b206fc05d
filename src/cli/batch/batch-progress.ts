/** Where progress goes: stderr in the CLI, a buffer in tests. */
export interface ProgressStream {
  write(text: string): unknown;
  readonly isTTY?: boolean;
  readonly columns?: number;
}

/** Options of {@link createBatchProgress}. */
export interface BatchProgressOptions {
  /** Seconds between plain lines when the stream is not a terminal. Default 2. */
  readonly intervalSeconds?: number;
  /** Clock in milliseconds (tests pass their own). Default performance.now. */
  readonly now?: () => number;
}

/** Progress of a batch run on stderr. */
export interface BatchProgress {
  /** `done` of the total files have an outcome. */
  update(done: number): void;
  /** Close the bar and print the last line: how many files, how long, or that the run was stopped. */
  finish(done: number, interrupted: boolean): void;
}

/** Redraws of the terminal bar at most every this many ms. */
const barRedrawMs = 100;

/**
 * Progress for `ringfall batch` (files done, rate, time left). On a terminal: one bar
 * redrawn in place with "\r"; otherwise one plain line every `intervalSeconds` (2 s), so
 * logs stay readable. Time left = files left / rate since the first finished chunk (worker
 * start-up left out). Writes nothing to stdout.
 */
export function createBatchProgress(stream: ProgressStream, total: number, workers: number, options: BatchProgressOptions = {}): BatchProgress {
  const now = options.now ?? (() => performance.now());
  const started = now();
  const interval = (options.intervalSeconds ?? 2) * 1000;
  const tty = stream.isTTY === true;
  let lastDraw = started;
  let barShown = false;
  stream.write(`ringfall batch: ${count(total, 'survey file')} on ${count(workers, 'worker')}\n`);

  // The rate is measured from the first finished chunk, so worker start-up does not inflate the time left.
  let first: { at: number; done: number } | null = null;
  const figures = (done: number) => {
    const at = now();
    const seconds = (at - started) / 1000;
    const since = first === null ? 0 : (at - first.at) / 1000;
    const rate = first !== null && since > 0 ? (done - first.done) / since : 0;
    const left = rate > 0 ? (total - done) / rate : null;
    return { seconds, rate, left };
  };
  return {
    update(done) {
      const at = now();
      first ??= { at, done };
      if (tty) {
        if (at - lastDraw < barRedrawMs && done < total) return;
        lastDraw = at;
        stream.write(`\r${bar(done, total, figures(done), stream.columns || 80)}`);
        barShown = true;
      } else if (at - lastDraw >= interval) {
        lastDraw = at;
        const { rate, left } = figures(done);
        stream.write(`ringfall batch: ${done} of ${total} files (${percent(done, total)}), ${formatRate(rate)}, ${left === null ? 'time left unknown' : `about ${formatSeconds(left)} left`}\n`);
      }
    },
    finish(done, interrupted) {
      if (barShown) stream.write('\r\x1b[K');
      const seconds = (now() - started) / 1000;
      const rate = seconds > 0 ? done / seconds : 0;
      stream.write(interrupted
        ? `ringfall batch: stopped after ${done} of ${total} files (${formatSeconds(seconds)}); the summary covers those only.\n`
        : `ringfall batch: ${count(done, 'file')} in ${formatSeconds(seconds)} (${formatRate(rate)})\n`);
    },
  };
}

function bar(done: number, total: number, figures: { rate: number; left: number | null }, columns: number): string {
  const text = ` ${done}/${total} files · ${figures.rate > 0 ? formatRate(figures.rate) : '… files/s'} · ${figures.left === null ? '…' : `${formatSeconds(figures.left)} left`}`;
  const width = Math.max(10, Math.min(40, columns - text.length - 3));
  const filled = total > 0 ? Math.round((done / total) * width) : width;
  return `[${'█'.repeat(filled)}${'░'.repeat(width - filled)}]${text}\x1b[K`;
}

function count(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}

function percent(done: number, total: number): string {
  return `${total > 0 ? Math.floor((100 * done) / total) : 100} %`;
}

function formatRate(rate: number): string {
  return `${rate >= 100 ? Math.round(rate) : rate.toFixed(1)} files/s`;
}

/** "7 s", "2 min 05 s". */
export function formatSeconds(seconds: number): string {
  if (seconds < 10) return `${seconds.toFixed(1)} s`;
  if (seconds < 60) return `${Math.round(seconds)} s`;
  const whole = Math.round(seconds);
  return `${Math.floor(whole / 60)} min ${String(whole % 60).padStart(2, '0')} s`;
}
