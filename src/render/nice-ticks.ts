/**
 * Round tick values covering [min, max]: steps of 1, 2 or 5 × 10ⁿ chosen so that about
 * `count` ticks fall in the range (the classic "nice numbers" rule; Heckbert, "Nice
 * numbers for graph labels", Graphics Gems, 1990). Not d3-array's `ticks`: d3 moves to
 * the next step at √2, √10 and √50 rather than 1.5, 3.5 and 7.5, so the field map of a
 * 0–254 mm survey would get a tick every 50 mm instead of every 20 mm (issue #14 keeps
 * every output as it was).
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

/**
 * The largest of 1, 2, 5 × 10ⁿ at or below `value` (`direction` −1) or the smallest at or
 * above it (+1): round ends for a log axis. `value` > 0.
 * @example niceLogBound(0.0017, -1) // 0.001; niceLogBound(172, 1) // 200
 */
export function niceLogBound(value: number, direction: -1 | 1): number {
  const power = 10 ** Math.floor(Math.log10(value));
  const steps = direction < 0 ? [5, 2, 1] : [1, 2, 5, 10];
  for (const step of steps) {
    const candidate = step * power;
    if (direction < 0 ? candidate <= value * (1 + 1e-12) : candidate >= value * (1 - 1e-12)) return candidate;
  }
  return direction < 0 ? power : 10 * power;
}

/**
 * The smallest multiple of a 1-2-5 step at or above `value`, the step chosen for about
 * eight ticks from 0: a round end for a linear axis.
 * @example niceCeiling(203) // 250
 */
export function niceCeiling(value: number): number {
  if (!(value > 0)) return value;
  const ticks = niceTicks(0, value, 8);
  const step = ticks.length > 1 ? ticks[1]! - ticks[0]! : value;
  return Math.ceil(value / step - 1e-9) * step;
}
