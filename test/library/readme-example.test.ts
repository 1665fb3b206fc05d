import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

// The README's library example is examples/library-example.ts, shown verbatim with the
// output it printed; these tests keep both true. It imports 'ringfall' as a user would;
// in the checkout the package.json condition ringfall-source points that at src/index.ts
// (the package's own import condition needs dist/, which only a build writes).
const readme = readFileSync('README.md', 'utf8');
const example = readFileSync('examples/library-example.ts', 'utf8');

function block(marker: string): string {
  const match = new RegExp(`<!-- ${marker} -->\\s*\`\`\`[a-z]*\\n([\\s\\S]*?)\`\`\``).exec(readme);
  if (!match) throw new Error(`README.md has no code block after <!-- ${marker} -->`);
  return match[1]!;
}

describe('README library example', () => {
  it('README shows examples/library-example.ts verbatim', () => {
    expect(block('library-example')).toBe(example);
  });

  it('examples/library-example.ts prints what the README says it prints', () => {
    const output = execFileSync('node_modules/.bin/tsx', ['--conditions=ringfall-source', 'examples/library-example.ts'], { encoding: 'utf8' });
    expect(output).toBe(block('library-example-output'));
  });

  it('the example recovers the sample coil: TRUTH.json ampere-turns inside the printed 95 % interval', () => {
    const output = execFileSync('node_modules/.bin/tsx', ['--conditions=ringfall-source', 'examples/library-example.ts'], { encoding: 'utf8' });
    const [, low, high] = /95 %: ([\d.]+) to ([\d.]+) A/.exec(output)!;
    const truth = JSON.parse(readFileSync('sample-data/TRUTH.json', 'utf8')) as { surveys: { file: string; params: Record<string, number> }[] };
    // truth of the invented sample coil (scripts/make-sample-data.ts → sample-data/TRUTH.json)
    const ampereTurns = truth.surveys.find((s) => s.file === 'qa-107-2025-03-11-healthy.csv')!.params['ampereTurns']!;
    expect(ampereTurns).toBeGreaterThan(Number(low));
    expect(ampereTurns).toBeLessThan(Number(high));
  });
});
