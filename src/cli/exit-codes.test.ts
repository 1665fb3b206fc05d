import { describe, expect, it, vi } from 'vitest';
import { exitStatus, worseStatus } from './exit-codes';

// A command that hits a defect: a TypeError, not a RingfallError.
vi.mock('./commands/plan', () => ({
  registerPlan: (program: { command(name: string): { action(f: () => void): unknown } }) => {
    program.command('plan').action(() => {
      throw new TypeError('defect for the test');
    });
  },
}));

describe('exit status (CONTRACT.md "Exit status")', () => {
  it('worseStatus() ranks a failed check above an inconclusive one although 1 < 3', () => {
    // CONTRACT.md: 1 a check failed, 3 none failed but one is inconclusive
    expect(worseStatus(exitStatus.inconclusive, exitStatus.failed)).toBe(1);
    expect(worseStatus(exitStatus.failed, exitStatus.inconclusive)).toBe(1);
    expect(worseStatus(exitStatus.passed, exitStatus.inconclusive)).toBe(3);
    expect(worseStatus(exitStatus.failed, exitStatus.input)).toBe(2);
    expect(worseStatus(exitStatus.input, exitStatus.internal)).toBe(70);
  });

  it('main() exits 70 on an internal error: EX_SOFTWARE of sysexits.h (4.4BSD), asking for --debug', async () => {
    const { main } = await import('./main');
    const written: string[] = [];
    const spy = vi.spyOn(process.stderr, 'write').mockImplementation((text) => { written.push(String(text)); return true; });
    try {
      // sysexits.h: #define EX_SOFTWARE 70 /* internal software error */
      expect(await main(['node', 'ringfall', 'plan'])).toBe(70);
    } finally {
      spy.mockRestore();
    }
    expect(written.join('')).toContain('ringfall: internal error: defect for the test');
    expect(written.join('')).toContain('--debug');
  });
});
