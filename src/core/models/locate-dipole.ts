import { vacuumPermeability } from '../physics/vacuum-permeability';

/**
 * Where a vector map's source sits, roughly: the point dipole (position c, moment m) plus
 * uniform background b that best fits the readings B(pᵢ) ≈ G(pᵢ − c)·m + b, with
 * G(r) = μ0/(4π|r|³)·(3 r̂r̂ᵀ − I) the dipole's field tensor (Jackson, Classical
 * Electrodynamics, 3rd ed., eq. 5.56). For a fixed c the fit is linear in m and b (six
 * unknowns, normal equations solved by Gaussian elimination with partial pivoting), so c
 * is searched on grids: 7 × 7 × 7 points over the readings' bounding box widened by its
 * own size each way, then three finer grids (each a third of the last's extent) about the
 * best. Any coil looks like its dipole from a few sizes away, so c lands near the coil's
 * centre and m along its axis: a start for poseModel, not an estimate to report.
 *
 * @param positions x, y, z per reading (m); vectors Bx, By, Bz per reading (T)
 * @returns the centre (m) and moment (A·m²), or null with fewer than 3 readings
 */
export function locateDipole(positions: ArrayLike<number>, vectors: ArrayLike<number>): { centre: [number, number, number]; moment: [number, number, number] } | null {
  const count = Math.floor(positions.length / 3);
  if (count < 3) return null;
  const low = [Infinity, Infinity, Infinity];
  const high = [-Infinity, -Infinity, -Infinity];
  for (let r = 0; r < count; r++) {
    for (let k = 0; k < 3; k++) {
      low[k] = Math.min(low[k]!, positions[3 * r + k]!);
      high[k] = Math.max(high[k]!, positions[3 * r + k]!);
    }
  }
  const size = Math.max(high[0]! - low[0]!, high[1]! - low[1]!, high[2]! - low[2]!, 1e-3);
  let centre = [0, 1, 2].map((k) => 0.5 * (low[k]! + high[k]!));
  let extent = [0, 1, 2].map((k) => high[k]! - low[k]! + 2 * size);
  let best: { misfit: number; centre: number[]; moment: number[] } | null = null;
  for (let pass = 0; pass < 4; pass++) {
    const from: number[] = best?.centre ?? centre;
    for (let i = 0; i < 7; i++) {
      for (let j = 0; j < 7; j++) {
        for (let l = 0; l < 7; l++) {
          const c: number[] = [from[0]! + extent[0]! * (i / 6 - 0.5), from[1]! + extent[1]! * (j / 6 - 0.5), from[2]! + extent[2]! * (l / 6 - 0.5)];
          const fit = dipoleAt(c, positions, vectors, count);
          if (fit !== null && (best === null || fit.misfit < best.misfit)) best = { ...fit, centre: c };
        }
      }
    }
    centre = best?.centre ?? centre;
    extent = extent.map((e) => e / 3);
  }
  return best === null ? null : { centre: best.centre as [number, number, number], moment: best.moment as [number, number, number] };
}

const normal = new Float64Array(36);
const right = new Float64Array(6);

/** The linear least-squares moment and background for a dipole at c, and the misfit left; null when singular or c sits on a reading. */
function dipoleAt(c: readonly number[], positions: ArrayLike<number>, vectors: ArrayLike<number>, count: number): { misfit: number; moment: number[] } | null {
  normal.fill(0);
  right.fill(0);
  let total = 0;
  const row = new Float64Array(6);
  for (let r = 0; r < count; r++) {
    const dx = positions[3 * r]! - c[0]!;
    const dy = positions[3 * r + 1]! - c[1]!;
    const dz = positions[3 * r + 2]! - c[2]!;
    const d2 = dx * dx + dy * dy + dz * dz;
    if (!(d2 > 0)) return null;
    const scale = vacuumPermeability / (4 * Math.PI * d2 * Math.sqrt(d2));
    const d = [dx, dy, dz];
    for (let a = 0; a < 3; a++) {
      // row a of [G | I]
      for (let b = 0; b < 3; b++) row[b] = scale * ((3 * d[a]! * d[b]!) / d2 - (a === b ? 1 : 0));
      row[3] = a === 0 ? 1 : 0;
      row[4] = a === 1 ? 1 : 0;
      row[5] = a === 2 ? 1 : 0;
      const y = vectors[3 * r + a]!;
      total += y * y;
      for (let p = 0; p < 6; p++) {
        right[p] = right[p]! + row[p]! * y;
        for (let q = 0; q < 6; q++) normal[6 * p + q] = normal[6 * p + q]! + row[p]! * row[q]!;
      }
    }
  }
  const solution = solveSix(normal, right);
  if (solution === null) return null;
  let explained = 0;
  for (let p = 0; p < 6; p++) explained += solution[p]! * right[p]!;
  return { misfit: total - explained, moment: solution.slice(0, 3) };
}

/** Solve the 6 × 6 system A x = b in place by Gaussian elimination with partial pivoting; null when singular. */
function solveSix(a: Float64Array, b: Float64Array): number[] | null {
  const n = 6;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[6 * r + col]!) > Math.abs(a[6 * pivot + col]!)) pivot = r;
    if (!(Math.abs(a[6 * pivot + col]!) > 0)) return null;
    if (pivot !== col) {
      for (let q = 0; q < n; q++) [a[6 * col + q], a[6 * pivot + q]] = [a[6 * pivot + q]!, a[6 * col + q]!];
      [b[col], b[pivot]] = [b[pivot]!, b[col]!];
    }
    for (let r = col + 1; r < n; r++) {
      const factor = a[6 * r + col]! / a[6 * col + col]!;
      for (let q = col; q < n; q++) a[6 * r + q] = a[6 * r + q]! - factor * a[6 * col + q]!;
      b[r] = b[r]! - factor * b[col]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let sum = b[r]!;
    for (let q = r + 1; q < n; q++) sum -= a[6 * r + q]! * x[q]!;
    x[r] = sum / a[6 * r + r]!;
  }
  return x;
}
