import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../support/expect-close';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const ringfall = (...args: string[]) => {
  const result = spawnSync(process.execPath, [join(root, 'bin', 'ringfall.mjs'), ...args], { cwd: root, encoding: 'utf8' });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
};
// μ0, CODATA 2018 recommended value (the one physics/vacuum-permeability.ts uses)
const mu0 = 1.25663706212e-6;

describe('ringfall predict (CLI)', () => {
  it('predict --json prints the CONTRACT shape with the loop field off axis in SI', () => {
    // CONTRACT.md example; values computed with mpmath 1.3.0 (DOMAIN.md §1.2 closed form, 30 digits)
    const run = ringfall('predict', '--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=50mm', '--at', '10mm', '--radial', '20mm', '--json');
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout);
    expect(json.field.unit).toBe('T');
    expect(json.components.axial.unit).toBe('T');
    expect(json.components.radial.unit).toBe('T');
    expectClose(json.components.axial.value, 1.3050886516024164e-5, { rel: 1e-13 });
    expectClose(json.components.radial.value, 1.8077389170466586e-6, { rel: 1e-13 });
    expectClose(json.field.value, Math.hypot(1.3050886516024164e-5, 1.8077389170466586e-6), { rel: 1e-13 });
  });

  it('predict on the axis equals μ0·NI·R²/(2(R²+z²)^1.5), with the probe offset added to the distance', () => {
    // DOMAIN.md §1.1; DESIGN.md: the sensing point sits probeOffset beyond the stated distance
    const run = ringfall('predict', '--model', 'loop', '--set', 'ampereTurns=400A', '--set', 'radius=5 cm', '--set', 'probeOffset=2mm', '--at', '0.018 m', '--json');
    expect(run.status).toBe(0);
    const z = 0.02;
    expectClose(JSON.parse(run.stdout).field.value, (mu0 * 400 * 0.05 ** 2) / (2 * (0.05 ** 2 + z * z) ** 1.5), { rel: 1e-13 });
  });

  it('predict prints text for people: the field in a sensible unit and in gauss, and the point restated', () => {
    // DOMAIN.md §9 row 23: Helmholtz centre of 100 A·turns, R = 0.15 m → 5.994508574e-4 T = 0.5995 mT
    const run = ringfall('predict', '--model', 'coil-pair', '--set', 'ampereTurns=100A', '--set', 'radius=150mm', '--set', 'separation=150mm', '--at', '0mm');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('599.5 µT');
    expect(run.stdout).toContain('5.995 G');
    expect(run.stdout).toContain('from the midpoint between the coils');
  });

  const bad: [string, string[], RegExp][] = [
    ['an unknown model', ['--model', 'helix', '--at', '10mm'], /"helix" is not a model.*Use one of: loop/],
    ['a missing parameter', ['--model', 'loop', '--set', 'ampereTurns=1A', '--at', '10mm'], /needs radius\. Pass --set radius=/],
    ['an unknown parameter', ['--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=5cm', '--set', 'turns=10', '--at', '1cm'], /"turns" is not a parameter of loop/],
    ['a unit of the wrong kind', ['--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=5mT', '--at', '1cm'], /is a field but a length is needed/],
    ['an unknown unit', ['--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=5cm', '--at', '3 furlongs'], /unknown unit "furlongs"/],
    ['a point on the winding', ['--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=5cm', '--at', '0mm', '--radial', '50mm'], /undefined .* Move the point/],
  ];
  for (const [what, args, message] of bad) {
    it(`predict exits 2 with a one-line message for ${what}`, () => {
      // CONTRACT.md: exit status 2 for usage or input errors, one line, no stack trace
      const run = ringfall('predict', ...args);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toMatch(message);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
    });
  }
});
