import { describe, it, expect, vi, afterEach } from 'vitest';
import { main } from '../main';

async function run(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const out = vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => { stdout += String(chunk); return true; });
  const err = vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => { stderr += String(chunk); return true; });
  try {
    const code = await main(['node', 'ringfall', 'plan', ...args]);
    return { code, stdout, stderr };
  } finally {
    out.mockRestore();
    err.mockRestore();
  }
}

afterEach(() => vi.restoreAllMocks());

describe('ringfall plan', () => {
  it('ringfall plan prints recommended positions and expected intervals beside the user\'s plan', async () => {
    const result = await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--reach', '5mm..200mm', '--compare', '100,120,140,160,180,200mm');
    expect(result.code).toBe(0);
    expect(result.stdout).toContain('recommended (12 positions)');
    expect(result.stdout).toContain('your plan (6 positions): 100 120 140 160 180 200 mm');
    expect(result.stdout).toMatch(/ampereTurns\s+±/);
    // a plan between 2.2R and 4.4R stays in the far field (DOMAIN.md §7.6)
    expect(result.stdout).toContain('your plan: This plan stays in the far field');
  });

  it('ringfall plan --json gives SI positions and half-widths with units', async () => {
    const result = await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=4.5cm', '--fix', 'background=0T', '--points', '8', '--reach', '5mm..150mm', '--json');
    expect(result.code).toBe(0);
    const json = JSON.parse(result.stdout);
    expect(json.schema).toBe('ringfall-plan/1');
    expect(json.parameters.radius).toEqual({ value: 0.045, unit: 'm', free: true });
    expect(json.parameters.background.free).toBe(false);
    const plan = json.plans.recommended;
    expect(plan.points).toHaveLength(8);
    for (const point of plan.points) {
      expect(point.distance.unit).toBe('m');
      expect(point.distance.value).toBeGreaterThanOrEqual(0.005);
      expect(point.distance.value).toBeLessThanOrEqual(0.15);
    }
    expect(plan.expected.radius.unit).toBe('m');
    expect(plan.expected.radius.halfWidth95).toBeGreaterThan(0);
    expect(json.plans.compared).toBeNull();
  });

  it('ringfall plan exits 2 with a one-line message for a missing value, an unknown model or too few points', async () => {
    const missing = await run('--model', 'loop', '--set', 'ampereTurns=120A');
    expect(missing.code).toBe(2);
    expect(missing.stderr).toBe('ringfall: --set: loop needs rough values for radius. Give them like --set radius=50mm.\n');
    expect((await run('--model', 'helix', '--set', 'radius=4mm')).stderr).toContain('Use one of: loop');
    expect((await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--points', '3')).code).toBe(2);
    // a billion positions would exhaust memory (it did: V8 out of memory, exit 134); refused up front
    const huge = await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--points', '1e9');
    expect(huge.code).toBe(2);
    expect(huge.stderr).toBe('ringfall: --points: "1e9" is not a whole number from 2 to 1000. Give the number of probe positions, e.g. --points 12.\n');
    expect((await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mT')).stderr).toContain('length');
    expect((await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--reach', '5mm-200mm')).stderr).toContain('5mm..200mm');
  });

  it('ringfall plan exits 2 for a parameter given twice, by --set twice or by --set and --fix, rather than keep the last silently', async () => {
    const twice = await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--set', 'radius=50mm');
    expect(twice.code).toBe(2);
    expect(twice.stderr).toBe('ringfall: --set: radius is given twice (--set and --fix together count). Give each parameter once.\n');
    const both = await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--fix', 'radius=50mm');
    expect(both.code).toBe(2);
    expect(both.stderr).toContain('--fix: radius is given twice');
    expect(both.stdout).toBe('');
  });

  it('ringfall plan --scan plans signed ruler positions on both sides of the coil, beside one side only', async () => {
    const result = await run('--model', 'coil-pair', '--set', 'ampereTurns=100A', '--set', 'radius=35mm', '--set', 'separation=35mm', '--set', 'centre=40mm', '--scan', '--reach', '-110mm..190mm', '--json');
    expect(result.code).toBe(0);
    const json = JSON.parse(result.stdout);
    expect(json.axis).toBe('position');
    expect(json.parameters.centre).toEqual({ value: 0.04, unit: 'm', free: true });
    expect(json.parameters.probeOffset).toBeUndefined();
    const positions = json.plans.recommended.points.map((p: { distance: { value: number } }) => p.distance.value);
    // the ruler's zero is not the coil's centre here: both sides means both sides of 40 mm
    expect(positions.some((p: number) => p < 0.04 - 0.02)).toBe(true);
    expect(positions.some((p: number) => p > 0.04 + 0.02)).toBe(true);
    for (const p of positions) expect(p >= -0.110 - 1e-12 && p <= 0.190 + 1e-12).toBe(true);
    // one side of a pair leaves ampere-turns trading off against the probe offset (the reason to scan through it)
    expect(json.plans.oneSided.expected.ampereTurns.halfWidth95).toBeGreaterThan(3 * json.plans.recommended.expected.ampereTurns.halfWidth95);
    const text = await run('--model', 'coil-pair', '--set', 'ampereTurns=100A', '--set', 'radius=35mm', '--set', 'separation=35mm', '--scan', '--reach', '-150mm..150mm');
    expect(text.stdout).toContain('recommended (12 positions on the ruler)');
    expect(text.stdout).toContain('one side only (12 positions)');
    expect(text.stdout).toContain('so negative positions are on the far side');
  });

  it('ringfall plan without --scan refuses a negative reach and points to --scan', async () => {
    const result = await run('--model', 'loop', '--set', 'ampereTurns=120A', '--set', 'radius=45mm', '--reach', '-5mm..200mm');
    expect(result.code).toBe(2);
    expect(result.stderr).toBe('ringfall: --reach: "-5mm" is negative. Give a distance ≥ 0, or add --scan to plan signed positions of a scan through the coil.\n');
  });
});
