import { describe, expect, it } from 'vitest';
import { createBatchProgress, formatSeconds } from './batch-progress';

function stream(isTTY: boolean) {
  const writes: string[] = [];
  return { writes, isTTY, columns: 80, write: (text: string) => writes.push(text) };
}

describe('createBatchProgress()', () => {
  it('createBatchProgress() off a terminal writes a start line, then a plain line at most every 2 s with files done, rate and time left', () => {
    let clock = 0;
    const out = stream(false);
    const progress = createBatchProgress(out, 100, 2, { now: () => clock });
    clock = 1000;
    progress.update(10);
    clock = 2500;
    progress.update(25);
    clock = 3000;
    progress.update(30);
    clock = 4000;
    progress.finish(40, false);
    // rate from the first chunk: 15 files in 1.5 s = 10 files/s; 75 left at 10 files/s = 7.5 s; the last line uses the whole run
    expect(out.writes).toEqual([
      'ringfall batch: 100 survey files on 2 workers\n',
      'ringfall batch: 25 of 100 files (25 %), 10.0 files/s, about 7.5 s left\n',
      'ringfall batch: 40 files in 4.0 s (10.0 files/s)\n',
    ]);
  });

  it('createBatchProgress() on a terminal redraws one bar in place with "\\r", rate from the first finished chunk on, and clears it before the last line', () => {
    let clock = 0;
    const out = stream(true);
    const progress = createBatchProgress(out, 10, 1, { now: () => clock });
    clock = 300;
    progress.update(2); // first chunk: no rate yet
    clock = 600;
    progress.update(5); // 3 files in 0.3 s = 10 files/s; 5 left → 0.5 s
    clock = 650;
    progress.update(6); // within 100 ms of the last redraw: skipped
    clock = 1000;
    progress.finish(7, true);
    // the short figures leave room for the widest bar, 40 characters; 2 of 10 files fill a fifth of it, 8
    expect(out.writes[1]).toBe(`\r[${'█'.repeat(8)}${'░'.repeat(32)}] 2/10 files · … files/s · …\x1b[K`);
    // the bar takes what the 80 columns leave after the 39-character figures, the brackets and one spare column: 38, half of them filled
    expect(out.writes[2]).toBe(`\r[${'█'.repeat(19)}${'░'.repeat(19)}] 5/10 files · 10.0 files/s · 0.5 s left\x1b[K`);
    expect(out.writes.slice(3)).toEqual(['\r\x1b[K', 'ringfall batch: stopped after 7 of 10 files (1.0 s); the summary covers those only.\n']);
  });
});

describe('formatSeconds()', () => {
  it('formatSeconds() gives tenths below 10 s, whole seconds below a minute, then minutes and seconds', () => {
    expect([formatSeconds(7.46), formatSeconds(42.4), formatSeconds(125)]).toEqual(['7.5 s', '42 s', '2 min 05 s']);
  });
});
