/**
 * Round tick values covering [min, max]: steps of 1, 2 or 5 × 10ⁿ chosen so that about
 * `count` ticks fall in the range (the classic "nice numbers" rule; Heckbert, "Nice
 * numbers for graph labels", Graphics Gems, 1990).
 * @example niceTicks(0, 100, 5) // [0, 20, 40, 60, 80, 100]
 */
export function niceTicks(min: number, max: number, count: number): number[] {
  if (!(max > min) || !Number.isFinite(min) || !Number.isFinite(max) || count < 1) return [];
  const rough = (max - min) / count;
  const power = 10 ** Math.floor(Math.log10(rough));
  const fraction = rough / power;
  const step = (fraction < 1.5 ? 1 : fraction < 3.5 ? 2 : fraction < 7.5 ? 5 : 10) * power;
  const ticks: number[] = [];
  for (let i = Math.ceil(min / step - 1e-9); i * step <= max + step * 1e-9; i++) ticks.push(Math.abs(i * step) < step * 1e-9 ? 0 : i * step);
  return ticks;
}
