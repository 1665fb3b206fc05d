/**
 * Run a command as a child process and measure it: wall seconds, CPU seconds of the child
 * and its descendants (user + system: the growth of this process's cutime + cstime in
 * /proc/self/stat once the child is reaped, proc(5); null off Linux; run one child at a
 * time), and peak RSS (VmHWM in /proc/PID/status, polled every 20 ms; the whole process
 * with its worker threads). Output is discarded unless `stdoutFile` is given.
 */
import { spawn } from 'node:child_process';
import { openSync, closeSync, readFileSync } from 'node:fs';

export interface Measured {
  readonly seconds: number;
  readonly cpuSeconds: number | null;
  readonly peakMb: number | null;
  readonly status: number | null;
}

const ticksPerSecond = 100; // USER_HZ on Linux (sysconf(_SC_CLK_TCK)), 100 on every common build

/** CPU ticks of this process's reaped children (cutime + cstime), or null off Linux. */
function childTicks(): number | null {
  try {
    const stat = readFileSync('/proc/self/stat', 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // counted from field 3 (state) at index 0: cutime is field 16, cstime field 17 (proc(5))
    return Number(fields[13]) + Number(fields[14]);
  } catch {
    return null;
  }
}

export function measureProcess(command: string, args: readonly string[], options: { stdoutFile?: string; env?: NodeJS.ProcessEnv } = {}): Promise<Measured> {
  const started = performance.now();
  const out = options.stdoutFile === undefined ? 'ignore' : openSync(options.stdoutFile, 'w');
  const child = spawn(command, [...args], { stdio: ['ignore', out, 'ignore'], env: options.env ?? process.env });
  const ticksBefore = childTicks();
  let peakKb: number | null = null;
  const poll = (): void => {
    const pid = child.pid;
    if (pid === undefined) return;
    try {
      const match = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
      if (match) peakKb = Math.max(peakKb ?? 0, Number(match[1]));
    } catch {
      // ended, or not Linux
    }
  };
  const timer = setInterval(poll, 20);
  return new Promise((done) => child.on('exit', (status) => {
    clearInterval(timer);
    if (typeof out === 'number') closeSync(out);
    const ticksAfter = childTicks();
    done({
      seconds: (performance.now() - started) / 1000,
      cpuSeconds: ticksBefore === null || ticksAfter === null ? null : (ticksAfter - ticksBefore) / ticksPerSecond,
      peakMb: peakKb === null ? null : peakKb / 1024,
      status,
    });
  }));
}
