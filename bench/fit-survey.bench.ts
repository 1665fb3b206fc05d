/**
 * Survey-level fit benchmark (issue 4): whole surveys per second through fitSurvey with
 * the default five models (loop, dipole, power-law, inverse-square, inverse-cube), each a
 * data-driven start plus a seeded multi-start — the cost of one `ringfall fit` survey.
 * Variants: the default adaptive starts (at most 8 extra) without stated σ; with --uncertainty and
 * --position-uncertainty (effective variance rounds); and 1 extra start. Also the loop
 * alone for scale against bench/fit.bench.ts (single LM fits). Rates per CPU second of
 * this process (one core) and per wall second. No target: prints figures only.
 */
import { fitSurvey } from '../src/core/fit/strategy/fit-survey';
import type { FitSurveyOptions } from '../src/core/fit/fit-survey-options';
import { simulatedSurvey } from '../src/core/fit/testing/simulated-survey';
import type { Survey } from '../src/core/survey/survey';

const SURVEYS = 64;
const meter = { relative: 0.01, absolute: 5e-7 };
// 30 log-spaced distances 2–250 mm from a 45 mm applicator, 1 % + 0.5 µT noise, 0.2 mm placement.
const distances = Array.from({ length: 30 }, (_, i) => 0.002 * 125 ** (i / 29));
const surveys: Survey[] = Array.from({ length: SURVEYS }, (_, s) =>
  simulatedSurvey({
    model: 'loop', params: { ampereTurns: 360, radius: 0.045, probeOffset: 0.004, background: 2.5e-5 },
    distances, noise: meter, positionNoise: 0.0002, seed: 100 + s,
  }),
);

function measure(label: string, options: FitSurveyOptions, minimumMs = 1500): number {
  let done = 0;
  const cpuStart = process.cpuUsage();
  const started = performance.now();
  while (performance.now() - started < minimumMs) {
    for (const survey of surveys) fitSurvey(survey, options);
    done += SURVEYS;
  }
  const wall = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage(cpuStart);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  const perCpu = done / cpuSeconds;
  console.log(`${label.padEnd(62)} ${perCpu.toFixed(1).padStart(8)} surveys/CPU-s ${(done / wall).toFixed(1).padStart(8)} surveys/s wall`);
  return perCpu;
}

fitSurvey(surveys[0]!, {}); // warm-up
const defaults = measure('5 models, adaptive starts, no stated σ (ringfall fit FILE)', {});
const stated = measure('5 models, adaptive starts, --uncertainty, --position-uncertainty', { instrumentUncertainty: meter, positionUncertainty: 0.0002 });
const quick = measure('5 models, 1 extra start, no stated σ', { starts: 1 });
const loopOnly = measure('loop only, adaptive starts, no stated σ', { models: ['loop'] });
console.log(`ratios: stated σ + position / default ${(stated / defaults).toFixed(2)}; 1 start / 8 starts ${(quick / defaults).toFixed(2)}; loop alone / 5 models ${(loopOnly / defaults).toFixed(2)}`);
