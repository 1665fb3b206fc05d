/** A signal that asks a run to stop: Ctrl-C (SIGINT) or a polite kill (SIGTERM). */
export type StopSignalName = 'SIGINT' | 'SIGTERM';

/** Signal numbers on Linux and macOS (POSIX.1-2017 signal.h: SIGINT 2, SIGTERM 15). */
const signalNumbers: Record<StopSignalName, number> = { SIGINT: 2, SIGTERM: 15 };

/**
 * The stop requests of one command run. The first SIGINT or SIGTERM is recorded and
 * every listener is called, so the run can stop its work and still write a valid report
 * marked partial; a second one ends the process at once with the same status (the files
 * it writes are renamed into place whole, so none is left half-written).
 */
export interface StopSignals {
  /** The first signal received, or null while none came. */
  readonly signal: StopSignalName | null;
  /** Call `listener` when the first signal comes (at once if it already came). */
  onStop(listener: (signal: StopSignalName) => void): void;
  /** Stop listening (the default handlers are back). */
  dispose(): void;
}

/**
 * Exit status of a run stopped by `signal`: 128 + its number, as shells report a process
 * ended by it (SIGINT 130, SIGTERM 143; common practice, bash(1) "EXIT STATUS").
 */
export function stoppedStatus(signal: StopSignalName): number {
  return 128 + signalNumbers[signal];
}

/** Listen for SIGINT and SIGTERM for the length of a command (see StopSignals). */
export function watchStopSignals(): StopSignals {
  let received: StopSignalName | null = null;
  const listeners: ((signal: StopSignalName) => void)[] = [];
  const handle = (signal: StopSignalName) => {
    if (received !== null) {
      process.stderr.write(`\nringfall: ${signal} again: stopping now, without the partial report.\n`);
      process.exit(stoppedStatus(received));
    }
    received = signal;
    for (const listener of listeners.splice(0)) listener(signal);
  };
  const onInt = () => handle('SIGINT');
  const onTerm = () => handle('SIGTERM');
  process.on('SIGINT', onInt);
  process.on('SIGTERM', onTerm);
  return {
    get signal() {
      return received;
    },
    onStop(listener) {
      if (received !== null) listener(received);
      else listeners.push(listener);
    },
    dispose() {
      process.off('SIGINT', onInt);
      process.off('SIGTERM', onTerm);
      listeners.length = 0;
    },
  };
}

/** Let pending events (a signal among them) run before the next piece of synchronous work. */
export function yieldToEvents(): Promise<void> {
  return new Promise((resolve) => setImmediate(resolve));
}
