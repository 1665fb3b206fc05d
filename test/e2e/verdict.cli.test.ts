import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const meter = ['--uncertainty', '1.5%+2uT'];

function ringfall(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

interface Check { what: string; status: string; datum?: string; toDecide?: string }
interface JsonSurvey {
  coil: string;
  summaryModel: { model: string; basis: string } | null;
  spec: { applied: boolean; source: string; coils: string[] | null; model: string | null; reason: string | null } | null;
  verdict: { status: string; rule: string; model: string; findings: string[]; checks: Check[] } | null;
}
const surveysOf = (stdout: string) => (JSON.parse(stdout) as { surveys: JsonSurvey[] }).surveys;

describe('ringfall fit: decision rule and exit status (CONTRACT.md "Exit status", "Decision rule")', () => {
  it('the healthy QA-107 (sample-data/README: matches its label) passes every check, its claims read from the surface, exit 0', () => {
    const run = ringfall('fit', 'sample-data/qa-107-2025-03-11-healthy.csv', '--spec', 'sample-data/specs/qa-107.spec.json', ...meter, '--json');
    expect(run.stderr).toBe('');
    // ISO 14253-1:2017 / JCGM 106:2012 guarded acceptance: every 95 % interval inside its tolerance zone → pass, exit 0
    expect(run.status).toBe(0);
    const [survey] = surveysOf(run.stdout);
    expect(survey!.verdict!.status).toBe('pass');
    expect(survey!.verdict!.rule).toContain('ISO 14253-1');
    expect(survey!.verdict!.rule).toContain('JCGM 106');
    expect(survey!.verdict!.checks.filter((c) => c.datum === 'surface').map((c) => c.what)).toEqual(['field at 0 mm from the surface', 'field at 50.0 mm from the surface']);
    expect(survey!.spec).toEqual({ applied: true, source: 'sample-data/specs/qa-107.spec.json', coils: ['QA-107'], model: 'loop', reason: null });
    expect(survey!.summaryModel).toEqual({ model: 'loop', basis: 'spec' });
  });

  it('the degraded QA-107 (sample-data/README: ampere-turns 15 % low) fails as degraded, exit 1', () => {
    const run = ringfall('fit', 'sample-data/qa-107-2026-03-10-degraded.csv', '--spec', 'sample-data/specs/qa-107.spec.json', ...meter, '--json');
    // ISO 14253-1:2017 / JCGM 106:2012 guarded rejection: the ampere-turns interval lies wholly below the zone → fail, exit 1
    expect(run.status).toBe(1);
    const [survey] = surveysOf(run.stdout);
    expect(survey!.verdict!.status).toBe('fail');
    expect(survey!.verdict!.findings).toContain('degraded');
  });

  it('the mat QM-03, whose far-field survey leaves width and height undetermined, is inconclusive with what would decide it, exit 3', () => {
    const run = ringfall('fit', 'sample-data/qm-03-2026-01-20-mat.csv', '--spec', 'sample-data/specs/qm-03.spec.json', ...meter, '--json');
    // ISO 14253-1:2017 / JCGM 106:2012: an interval straddling a limit neither proves conformity nor nonconformity → inconclusive, exit 3
    expect(run.status).toBe(3);
    const [survey] = surveysOf(run.stdout);
    expect(survey!.verdict!.status).toBe('inconclusive');
    const open = survey!.verdict!.checks.filter((c) => c.status === 'inconclusive');
    expect(open.length).toBeGreaterThan(0);
    for (const check of open) expect(check.toDecide ?? '').not.toBe('');
    // the summary reads the mat as the spec's rectangle, not the loop that ranks first by AICc
    expect(survey!.summaryModel).toEqual({ model: 'rectangle', basis: 'spec' });
  });

  it('a spec for another coil is reported, not ignored: exit 2, one line on stderr, spec.applied false in JSON and "NOT MADE" in text', () => {
    const json = ringfall('fit', 'sample-data/qa-107-2025-03-11-healthy.csv', '--spec', 'sample-data/specs/qm-03.spec.json', '--model', 'loop', '--json');
    // CONTRACT.md: a --spec none of whose specs applies to the survey's coil is an input error (2)
    expect(json.status).toBe(2);
    expect(json.stderr).toMatch(/^ringfall: sample-data\/qa-107-2025-03-11-healthy\.csv \(QA-107\): The spec file sample-data\/specs\/qm-03\.spec\.json is for coil QM-03, not QA-107/);
    expect(json.stderr.trim().split('\n')).toHaveLength(1);
    const [survey] = surveysOf(json.stdout);
    expect(survey!.verdict).toBeNull();
    expect(survey!.spec!.applied).toBe(false);
    expect(survey!.spec!.coils).toEqual(['QM-03']);
    expect(survey!.summaryModel).toEqual({ model: 'loop', basis: 'best-physical' });
    const text = ringfall('fit', 'sample-data/qa-107-2025-03-11-healthy.csv', '--spec', 'sample-data/specs/qm-03.spec.json', '--model', 'loop');
    expect(text.status).toBe(2);
    expect(text.stdout).toContain('Spec check: NOT MADE — The spec file sample-data/specs/qm-03.spec.json is for');
  });

  it('with a file of several specs the report names the one that applied', () => {
    const run = ringfall('fit', 'sample-data/qa-214-2026-02-17-mislabeled.csv', '--spec', 'sample-data/specs/all-coils.spec.json', ...meter, '--json');
    expect(run.status).toBe(1);
    const [survey] = surveysOf(run.stdout);
    // all-coils.spec.json lists QA-107, QA-214, … in that order (scripts/sample-data/build-spec-files.ts)
    expect(survey!.spec!.source).toBe('sample-data/specs/all-coils.spec.json, spec 2');
    expect(survey!.verdict!.findings[0]).toBe('mislabeled');
    const text = ringfall('fit', 'sample-data/qa-214-2026-02-17-mislabeled.csv', '--spec', 'sample-data/specs/all-coils.spec.json', ...meter);
    expect(text.stdout).toMatch(/checked against spec sample-data\/specs\/all-coils\.spec\.json,\s+spec 2, loop\s+model/);
  });

  it('demo documents its own exit rule in its help and at the end of its output, and exits 0', () => {
    const help = ringfall('demo', '--help');
    expect(help.stdout.replace(/\s+/g, ' ')).toContain('Exit status of demo: 0 when the demo ran');
  });
});
