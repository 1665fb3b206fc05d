import { readFileSync } from 'node:fs';
import { analyseSurvey, formatQuantity, importSurveys, parseThresholdLevel } from 'ringfall';

const text = readFileSync('sample-data/qa-107-2025-03-11-healthy.csv', 'utf8');
const { surveys } = importSurveys(text, { source: 'qa-107-2025-03-11-healthy.csv' });
const report = analyseSurvey(surveys[0]!, {
  fit: { models: ['loop', 'inverse-square'], instrumentUncertainty: { relative: 0.015, absolute: 2e-6 } },
  specs: [],
  thresholds: [parseThresholdLevel('0.5mT')],
});
const ampereTurns = report.fits.find((fit) => fit.model === 'loop')!.params['ampereTurns']!;
const [low, high] = ampereTurns.ci95!;
console.log(`best model: ${report.best}`);
console.log(`ampere-turns: ${ampereTurns.value.toFixed(1)} A (95 %: ${low.toFixed(1)} to ${high.toFixed(1)} A)`);
const threshold = report.thresholds[0]!;
console.log(`below 0.5 mT beyond ${formatQuantity(threshold.distance!.value, 'length')} on axis;`
  + ` inverse-square says ${formatQuantity(threshold.naive!.distance!.value, 'length')}`);
