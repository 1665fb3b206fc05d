import { describe, expect, it } from 'vitest';
import { getModel } from '../models';
import { summaryFit, summaryModelWords } from './summary-fit';
import { syntheticFit } from '../analysis/testing/synthetic-fit';

const at = (value: number) => [{ name: 'ampereTurns', unit: 'A' as const, value, stderr: 1 }];
const loop = syntheticFit('loop', at(300), { aicc: -10 });
const rectangle = syntheticFit('rectangle', at(310), { aicc: -20 });
const powerLaw = syntheticFit('power-law', [{ name: 'amplitude', unit: 'T·m^n', value: 1, stderr: 0.1 }], { aicc: -99 });
const fits = [loop, rectangle, powerLaw];
const spec = (model: 'loop' | 'rectangle' | null, applied = true) => ({ applied, source: 'specs.json', coils: null, model, reason: null });

describe('summaryFit(): the one model a summary, a verdict and a history read a coil with', () => {
  // AICc ranks models (Burnham & Anderson 2002, §2.4); a power law describes a distance range, not a coil (DOMAIN.md §1.11)
  it('takes the best coil model by AICc, never a power law, when nothing else says which', () => {
    const summary = summaryFit({ fits, spec: null }, getModel);
    expect(summary?.fit.model).toBe('rectangle');
    expect(summary?.basis).toBe('best-physical');
    expect(summaryModelWords(summary!)).toBe('rectangle (best coil model by AICc)');
  });

  // ringfall's own rule, as docs/CONTRACT.md states it for summaryModel: a verdict is made with the spec's model
  it("prefers the applied spec's model, then the coil history's model", () => {
    expect(summaryFit({ fits, spec: spec('loop') }, getModel, 'rectangle')?.basis).toBe('spec');
    expect(summaryFit({ fits, spec: spec('loop') }, getModel, 'rectangle')?.fit.model).toBe('loop');
    const fromHistory = summaryFit({ fits, spec: null }, getModel, 'loop');
    expect(fromHistory?.fit.model).toBe('loop');
    expect(summaryModelWords(fromHistory!)).toBe("loop (the coil history's model)");
  });

  // the same rule: only a converged coil model can describe the coil (DOMAIN.md §1.11)
  it('ignores a spec that did not apply, a history model that is a power law, and models that did not converge', () => {
    expect(summaryFit({ fits, spec: spec('loop', false) }, getModel)?.fit.model).toBe('rectangle');
    expect(summaryFit({ fits, spec: null }, getModel, 'power-law')?.fit.model).toBe('rectangle');
    const stalled = { ...loop, converged: false };
    expect(summaryFit({ fits: [stalled, rectangle], spec: spec('loop') }, getModel, 'loop')?.basis).toBe('best-physical');
    expect(summaryFit({ fits: [powerLaw], spec: null }, getModel)).toBeNull();
  });
});
