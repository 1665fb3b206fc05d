/**
 * Independent numerical field integrators for tests. They share nothing with
 * src/core/physics except the value of μ0, so agreement is evidence, not tautology.
 */

/** CODATA 2018 μ0, N A⁻², repeated here on purpose (DOMAIN.md §6). */
const mu0 = 1.25663706212e-6;

/**
 * Field of a circular filament loop by direct Biot–Savart integration,
 * B = μ0I/4π ∮ dl × (r − r')/|r − r'|³, with r' = (a cos φ, a sin φ, 0) and the field point
 * at (ρ, 0, z): B_ρ = μ0 I a z/4π ∫ cos φ / R³ dφ, B_z = μ0 I a/4π ∫ (a − ρ cos φ)/R³ dφ,
 * R² = ρ² + a² + z² − 2aρ cos φ. The integrand is smooth and periodic, so the trapezoid
 * rule converges geometrically (Trefethen & Weideman, SIAM Rev. 56 (2014)); the node count
 * doubles until two successive sums agree to 1e-14 of |B| (it throws if 2²² nodes do not).
 * Returns [B_z, B_ρ] in tesla.
 */
export function loopByBiotSavart(current: number, a: number, z: number, rho: number): [number, number] {
  const sums = (n: number): [number, number] => {
    // Neumaier (compensated) summation, so 10⁵ terms do not add 10⁻¹¹ of rounding
    let axial = 0;
    let axialCarry = 0;
    let radial = 0;
    let radialCarry = 0;
    const add = (sum: number, carry: number, term: number): [number, number] => {
      const next = sum + term;
      const lost = Math.abs(sum) >= Math.abs(term) ? sum - next + term : term - next + sum;
      return [next, carry + lost];
    };
    for (let i = 0; i < n; i++) {
      const phi = (2 * Math.PI * (i + 0.5)) / n;
      const c = Math.cos(phi);
      const distance2 = rho * rho + a * a + z * z - 2 * a * rho * c;
      const inverseCube = 1 / (distance2 * Math.sqrt(distance2));
      [axial, axialCarry] = add(axial, axialCarry, (a - rho * c) * inverseCube);
      [radial, radialCarry] = add(radial, radialCarry, c * inverseCube);
    }
    const scale = ((mu0 * current * a) / (4 * Math.PI)) * ((2 * Math.PI) / n);
    return [scale * (axial + axialCarry), scale * z * (radial + radialCarry)];
  };
  let previous = sums(64);
  for (let n = 128; n <= 1 << 22; n *= 2) {
    const next = sums(n);
    const size = Math.hypot(next[0], next[1]);
    if (Math.abs(next[0] - previous[0]) <= 1e-14 * size && Math.abs(next[1] - previous[1]) <= 1e-14 * size) return next;
    previous = next;
  }
  // a reference that has not converged would make the comparison meaningless
  throw new Error(`loopByBiotSavart: no convergence to 1e-14 with 2²² nodes at a = ${a}, z = ${z}, ρ = ${rho} (too close to the wire)`);
}

const kronrodNodes = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
  0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
  0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const kronrodWeights = [
  0.022935322010529224963732008058970, 0.063092092629978553290700663189204,
  0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
  0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
const gaussWeights = [
  0.129484966168869693270611432679082, 0.279705391489276667901467771423780,
  0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
];

/**
 * Adaptive Gauss–Kronrod (7–15) quadrature of f on [a, b] to relative tolerance `tol`
 * (Piessens et al., QUADPACK, 1983, rule QK15; nodes and weights from there). Bisects the
 * panel with the largest |K15 − G7| until the sum of estimates is below tol·|integral|.
 * Throws when 5000 bisections do not get there.
 */
export function integrate(f: (x: number) => number, a: number, b: number, tol = 1e-13): number {
  const panel = (lo: number, hi: number): [number, number] => {
    const half = 0.5 * (hi - lo);
    const mid = 0.5 * (hi + lo);
    let kronrod = kronrodWeights[7]! * f(mid);
    let gauss = gaussWeights[3]! * f(mid);
    for (let i = 0; i < 7; i++) {
      const dx = half * kronrodNodes[i]!;
      const sum = f(mid - dx) + f(mid + dx);
      kronrod += kronrodWeights[i]! * sum;
      if (i % 2 === 1) gauss += gaussWeights[(i - 1) / 2]! * sum;
    }
    return [kronrod * half, Math.abs((kronrod - gauss) * half)];
  };
  const panels: [number, number, number, number][] = [];
  const [v0, e0] = panel(a, b);
  panels.push([a, b, v0, e0]);
  for (let step = 0; step < 5000; step++) {
    let total = 0;
    let error = 0;
    let worst = 0;
    for (let i = 0; i < panels.length; i++) {
      total += panels[i]![2];
      error += panels[i]![3];
      if (panels[i]![3] > panels[worst]![3]) worst = i;
    }
    if (error <= tol * Math.abs(total) || error === 0) return total;
    const [lo, hi] = panels[worst]!;
    const mid = 0.5 * (lo + hi);
    const [v1, e1] = panel(lo, mid);
    const [v2, e2] = panel(mid, hi);
    panels.splice(worst, 1, [lo, mid, v1, e1], [mid, hi, v2, e2]);
  }
  // a reference that has not converged would make the comparison meaningless
  throw new Error(`integrate: no convergence to ${tol} relative in 5000 bisections on [${a}, ${b}]`);
}

/**
 * Field of a closed polygonal filament in the plane z = 0 at (x, y, z) by adaptive
 * quadrature of the Biot–Savart integrand along each side (integrate() above), not by the
 * closed-form segment formula. Returns [B_x, B_y, B_z] in tesla.
 */
export function polygonByBiotSavart(
  current: number, vertices: readonly (readonly [number, number])[], x: number, y: number, z: number,
): [number, number, number] {
  const total = [0, 0, 0];
  for (let i = 0; i < vertices.length; i++) {
    const [ax, ay] = vertices[i]!;
    const [bx, by] = vertices[(i + 1) % vertices.length]!;
    const lx = bx - ax;
    const ly = by - ay;
    for (let component = 0; component < 3; component++) {
      const integrand = (t: number): number => {
        const rx = x - (ax + t * lx);
        const ry = y - (ay + t * ly);
        const rz = z;
        const inverseCube = (rx * rx + ry * ry + rz * rz) ** -1.5;
        // dl × r with dl = (lx, ly, 0) dt
        const cross = component === 0 ? ly * rz : component === 1 ? -lx * rz : lx * ry - ly * rx;
        return cross * inverseCube;
      };
      total[component] = total[component]! + ((mu0 * current) / (4 * Math.PI)) * integrate(integrand, 0, 1, 1e-14);
    }
  }
  return [total[0]!, total[1]!, total[2]!];
}

/**
 * Field vector of a circular filament loop placed anywhere in space — centre c, unit normal
 * n (the current circulates right-handed about n), radius a, current I — at point p, by
 * direct Biot–Savart integration in the map's own Cartesian frame,
 * B = μ0I/4π ∮ dl × (p − r')/|p − r'|³ with r'(φ) = c + a(cos φ e₁ + sin φ e₂),
 * dl = a(−sin φ e₁ + cos φ e₂)dφ and e₁, e₂ any right-handed pair perpendicular to n
 * (e₁ × e₂ = n). No cylinder coordinates and no rotation angles: the loop is integrated
 * where it lies, so it checks the models' pose conventions rather than sharing them.
 * Trapezoid rule (periodic integrand), nodes doubled from 64 until two sums agree to 1e-13
 * of |B|. Returns [Bx, By, Bz] in tesla.
 */
export function placedLoopByBiotSavart(
  current: number, a: number, centre: readonly [number, number, number], normal: readonly [number, number, number], p: readonly [number, number, number],
): [number, number, number] {
  const size = Math.hypot(...normal);
  const n = normal.map((v) => v / size) as [number, number, number];
  // e₁: the coordinate axis least aligned with n, made perpendicular (Gram–Schmidt); e₂ = n × e₁
  const least = [0, 1, 2].reduce((best, i) => (Math.abs(n[i]!) < Math.abs(n[best]!) ? i : best), 0);
  const seed = [0, 0, 0];
  seed[least] = 1;
  const dot = seed[0]! * n[0] + seed[1]! * n[1] + seed[2]! * n[2];
  let e1 = [seed[0]! - dot * n[0], seed[1]! - dot * n[1], seed[2]! - dot * n[2]];
  const e1Size = Math.hypot(e1[0]!, e1[1]!, e1[2]!);
  e1 = e1.map((v) => v / e1Size);
  const e2 = [n[1] * e1[2]! - n[2] * e1[1]!, n[2] * e1[0]! - n[0] * e1[2]!, n[0] * e1[1]! - n[1] * e1[0]!];
  const sums = (count: number): [number, number, number] => {
    const b: [number, number, number] = [0, 0, 0];
    for (let i = 0; i < count; i++) {
      const phi = (2 * Math.PI * i) / count;
      const c = Math.cos(phi);
      const s = Math.sin(phi);
      const r = [0, 1, 2].map((k) => p[k]! - centre[k]! - a * (c * e1[k]! + s * e2[k]!));
      const dl = [0, 1, 2].map((k) => a * (-s * e1[k]! + c * e2[k]!));
      const distance = Math.hypot(r[0]!, r[1]!, r[2]!);
      const inverseCube = 1 / (distance * distance * distance);
      b[0] += (dl[1]! * r[2]! - dl[2]! * r[1]!) * inverseCube;
      b[1] += (dl[2]! * r[0]! - dl[0]! * r[2]!) * inverseCube;
      b[2] += (dl[0]! * r[1]! - dl[1]! * r[0]!) * inverseCube;
    }
    const scale = ((mu0 * current) / (4 * Math.PI)) * ((2 * Math.PI) / count);
    return [b[0] * scale, b[1] * scale, b[2] * scale];
  };
  let previous = sums(64);
  for (let count = 128; count <= 1 << 20; count *= 2) {
    const next = sums(count);
    const magnitude = Math.hypot(...next);
    if (next.every((v, k) => Math.abs(v - previous[k]!) <= 1e-13 * magnitude)) return next;
    previous = next;
  }
  throw new Error(`placedLoopByBiotSavart: no convergence with 2²⁰ nodes at p = ${p.join(', ')} (too close to the wire)`);
}
