import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { vacuumPermeability } from '../../physics/vacuum-permeability';
import { getModel } from '../../models';
import { compareModels } from './compare-models';
import { describePowerLaw, powerLawContext } from '../diagnostics/describe-power-law';
import type { FitResult } from '../fit-result';
import { fitSurvey } from './fit-survey';
import { evenlySpaced, simulatedSurvey } from '../testing/simulated-survey';

/** A converged fit with chosen AICc and nothing else of interest. */
function fitWithAicc(model: FitResult['model'], aicc: number, n = 10): FitResult {
  return {
    model, converged: true, stopReason: 'test', iterations: 0, params: {}, freeParameters: [], covariance: null, correlation: null,
    uncertaintyScale: 'estimated', points: [], warnings: [],
    stats: { n, k: 2, rss: 1, rmse: 1, chiSquare: 1, reducedChiSquare: null, aicc, bic: aicc, akaikeWeight: null },
  };
}

/** On-axis field of a loop, μ0·NI·R²/(2(R² + z²)^1.5) (DOMAIN.md §1.1). */
const loopAxis = (ampereTurns: number, radius: number, z: number) => (vacuumPermeability * ampereTurns * radius ** 2) / (2 * (radius ** 2 + z ** 2) ** 1.5);

describe('compareModels(fits)', () => {
  it('compareModels() gives Akaike weights exp(−Δ/2)/Σ from AICc: Δ = (0, 2, 10) → (0.727475, 0.267623, 0.004902), DOMAIN.md §7.2', () => {
    const result = compareModels([fitWithAicc('loop', -24.24304), fitWithAicc('dipole', -22.24304), fitWithAicc('power-law', -14.24304)]);
    // DOMAIN.md §7.2 check values [C]
    expectClose(result.fits[0]!.stats.akaikeWeight!, 0.727475, { abs: 5e-7 });
    expectClose(result.fits[1]!.stats.akaikeWeight!, 0.267623, { abs: 5e-7 });
    expectClose(result.fits[2]!.stats.akaikeWeight!, 0.004902, { abs: 5e-7 });
    expect(result.best).toBe('loop');
  });

  it('compareModels() names the lowest AICc among converged fits only, and gives a fit that did not converge weight 0', () => {
    const failed = { ...fitWithAicc('dipole', -100), converged: false };
    const result = compareModels([fitWithAicc('loop', -20), failed]);
    expect(result.best).toBe('loop');
    expect(result.fits[1]!.stats.akaikeWeight).toBe(0);
    expect(result.fits[0]!.stats.akaikeWeight).toBe(1);
  });

  it('compareModels() ranks an exact fit (RSS = 0, AICc = −∞) first with all the weight, instead of dropping it', () => {
    // AICc = n·ln(RSS/n) + … → −∞ as RSS → 0 (Burnham & Anderson 2002, §2.2): the likelihood is unbounded
    const result = compareModels([fitWithAicc('inverse-square', -20), fitWithAicc('loop', -Infinity), fitWithAicc('dipole', -30)]);
    expect(result.best).toBe('loop');
    expect(result.fits.map((f) => f.stats.akaikeWeight)).toEqual([0, 1, 0]);
  });

  it('compareModels() refuses fits to different readings (RangeError)', () => {
    expect(() => compareModels([fitWithAicc('loop', 1, 10), fitWithAicc('dipole', 1, 12)])).toThrow(RangeError);
  });

  it('compareModels() picks the loop for a loop survey spanning near and far field, and says what each power law gets wrong', () => {
    const truth = { ampereTurns: 400, radius: 0.05, probeOffset: 0.003, background: 2e-5 };
    const survey = simulatedSurvey({ model: 'loop', params: truth, distances: evenlySpaced(0, 0.3, 25), noise: { relative: 0.01, absolute: 5e-7 }, seed: 21 });
    const result = compareModels(fitSurvey(survey, { instrumentUncertainty: { relative: 0.01, absolute: 5e-7 } }));
    expect(result.best).toBe('loop');
    // regression pin, not truth: 25 readings across near and far field leave the other models almost no weight
    expect(result.fits.find((f) => f.model === 'loop')!.stats.akaikeWeight!).toBeGreaterThan(0.99);
    const total = result.fits.reduce((sum, f) => sum + (f.stats.akaikeWeight ?? 0), 0);
    expectClose(total, 1, { rel: 1e-12 });
    expect(result.comparison).toHaveLength(3);
    for (const [i, law] of ['power-law', 'inverse-square', 'inverse-cube'].entries()) {
      const sentence = result.comparison[i]!;
      expect(sentence.startsWith(`${law} (the readings' apparent exponent is `)).toBe(true);
      // the readings with d > 0: evenlySpaced(0, 0.3, 25) runs 12.5 mm to 300 mm
      expect(sentence).toContain('over 12.5–300 mm');
      expect(sentence).toContain('its residuals go systematic');
      expect(sentence).toMatch(/extrapolated to 600 mm \(twice the farthest reading\) it gives .* where loop gives/);
    }
  });

  // DOMAIN.md §1.9 [C]: OLS slopes of ln B on ln z, 15 equally spaced on-axis points of exact
  // loop data, R = 50 mm, N·I = 400 A.
  for (const [first, last, exponent] of [[0.01, 0.15, '1.38'], [0.05, 0.15, '2.24'], [0.2, 0.5, '2.92']] as const) {
    it(`compareModels() states the apparent exponent ${exponent} over ${first * 1e3}–${last * 1e3} mm for exact loop data (DOMAIN.md §1.9)`, () => {
      const survey = simulatedSurvey({ model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0, background: 0 }, distances: evenlySpaced(first, last, 15) });
      const result = compareModels(fitSurvey(survey, { models: ['loop', 'inverse-square'], fixed: { probeOffset: 0, background: 0 }, starts: 2 }));
      expect(result.comparison[0]).toContain(`apparent exponent is ${exponent} over ${first * 1e3}–${last * 1e3} mm; it assumes 2`);
    });
  }

  it('compareModels() compares the extrapolated field with the loop on axis, μ0·NI·R²/(2(R² + z²)^1.5) at twice the farthest distance', () => {
    const survey = simulatedSurvey({ model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0, background: 0 }, distances: evenlySpaced(0.01, 0.15, 15) });
    const result = compareModels(fitSurvey(survey, { models: ['loop', 'inverse-square'], fixed: { probeOffset: 0, background: 0 }, starts: 2 }));
    // DOMAIN.md §1.1 at z = 300 mm: 22.3 µT (3 significant digits as printed)
    const expected = loopAxis(400, 0.05, 0.3);
    expect(result.comparison[0]).toContain(`where loop gives ${(expected * 1e6).toPrecision(3)} µT`);
  });

  it('describePowerLaw() says the same with the survey\'s shared context as when it works everything out for one law', () => {
    // the readings, their log–log line and the physical model's far field do not depend on which law is described
    const survey = simulatedSurvey({ model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0.003, background: 2e-5 }, distances: evenlySpaced(0, 0.25, 16), noise: { relative: 0.01, absolute: 1e-6 }, seed: 12 });
    const fits = fitSurvey(survey);
    const loop = fits.find((f) => f.model === 'loop')!;
    const shared = powerLawContext(fits[0]!, loop, getModel);
    for (const law of fits.filter((f) => !getModel(f.model).physical)) {
      expect(describePowerLaw(law, loop, getModel, shared)).toBe(describePowerLaw(law, loop, getModel));
    }
    expect(shared.order).toEqual(survey.readings.map((_, i) => i));
  });
});
