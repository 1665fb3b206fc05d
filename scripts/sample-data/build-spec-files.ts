/**
 * Spec files for the sample coils (CONTRACT.md "Spec file"): what each coil's label or
 * datasheet claims. Claimed fields are the label's own model at the stated distance from
 * the device surface, as the label states it ("datum": "surface": measured like the bench
 * does, probe offset included), rounded to two digits as a datasheet prints them. QA-214 carries the QA applicator label although it was wound on
 * a larger former; that disagreement is the point of its sample.
 */
import { applicatorLabel, applicatorProbeOffset, calibrationPair } from './scenario';
import { catalogReading } from './catalog-reading';

/** A claim as a datasheet prints it: two significant digits, in mT. */
function claim(distanceMm: number, tesla: number, tolerance: string): { distance: string; datum: string; field: string; tolerance: string } {
  return { distance: `${distanceMm} mm`, datum: 'surface', field: `${Number((tesla * 1000).toPrecision(2))} mT`, tolerance };
}

export function buildSpecFiles(): Map<string, string> {
  const loopClaim = (ampereTurns: number, radius: number, mm: number) =>
    claim(mm, catalogReading('loop', { ampereTurns, radius, probeOffset: applicatorProbeOffset, background: 0 }, 'axial')(mm / 1000), '15%');
  const mat = catalogReading('rectangle', { ampereTurns: 150, width: 0.3, height: 0.2, probeOffset: 0.006, background: 0 }, 'axial');
  const thick = catalogReading('thick-coil', { ampereTurns: 1500, innerRadius: 0.02, outerRadius: 0.04, length: 0.03, probeOffset: 0.0015, background: 0 }, 'axial');
  const loopSpec = (coil: string, ampereTurns: number, radius: number, claimsMm: readonly number[]) => ({
    coil,
    model: 'loop',
    params: { ampereTurns: `${ampereTurns} A`, radius: `${radius * 1000} mm` },
    tolerance: '10%',
    claims: claimsMm.map((mm) => loopClaim(ampereTurns, radius, mm)),
    readingType: 'dc',
  });
  const specs = [
    loopSpec('QA-107', applicatorLabel.ampereTurns, applicatorLabel.radius, [0, 50]),
    loopSpec('QA-214', applicatorLabel.ampereTurns, applicatorLabel.radius, [0, 50]),
    loopSpec('QA-330', 400, 0.05, [0, 50]),
    loopSpec('QA-412', 420, 0.05, [0, 50]),
    {
      coil: 'QM-03', model: 'rectangle', params: { ampereTurns: '150 A', width: '300 mm', height: '200 mm' }, tolerance: '10%',
      claims: [0, 100].map((mm) => claim(mm, mat(mm / 1000), '20%')), readingType: 'rms',
    },
    {
      coil: 'QT-9', model: 'thick-coil',
      params: { ampereTurns: '1500 A', innerRadius: '20 mm', outerRadius: '40 mm', length: '30 mm' }, tolerance: '5%',
      claims: [0, 50].map((mm) => claim(mm, thick(mm / 1000), '10%')), readingType: 'dc',
    },
    {
      // the calibration pair's datasheet: its coils, no field claims (its scan is checked by its parameters)
      coil: 'QH-70', model: 'coil-pair',
      params: { ampereTurns: `${calibrationPair.ampereTurns} A`, radius: `${calibrationPair.radius * 1000} mm`, separation: `${calibrationPair.separation * 1000} mm` },
      tolerance: '3%', readingType: 'dc',
    },
    {
      // the tilted applicator QA-512 carries the QA label; mapped in 3-D, it is checked by its parameters (no claims on a datum the map does not have)
      coil: 'QA-512', model: 'loop', params: { ampereTurns: `${applicatorLabel.ampereTurns} A`, radius: `${applicatorLabel.radius * 1000} mm` }, tolerance: '10%', readingType: 'dc',
    },
  ];
  const files = new Map<string, string>();
  for (const spec of specs) files.set(`specs/${spec.coil.toLowerCase()}.spec.json`, `${JSON.stringify(spec, null, 2)}\n`);
  files.set('specs/all-coils.spec.json', `${JSON.stringify(specs, null, 2)}\n`);
  return files;
}
