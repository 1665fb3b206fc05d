import { bulkParameterLimit, loopField, loopFieldBulk, paraxialLimit } from './loop-field';
import { loopFieldKernelHex } from './loop-field-kernel';
import { vacuumPermeability } from './vacuum-permeability';

/** Which code loopFieldBatch runs: the WebAssembly SIMD kernel, or plain TypeScript. */
export type LoopFieldBatchEngine = 'wasm-simd' | 'typescript';

/** Points per call into the kernel (its memory holds 2048 z, ρ, B_z, B_ρ each). */
const chunk = 2048;

/** The slice of the WebAssembly API used here (core is typed without DOM or Node globals). */
interface WebAssemblyApi {
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: Record<string, unknown> };
}

interface Kernel {
  field: (count: number, radius: number, scale: number, limit: number, bulk: number) => number;
  heap: Float64Array;
}

let kernel: Kernel | null | undefined;
let preferTypeScript = false;
const single = new Float64Array(2);

function decodeHex(hex: string): Uint8Array {
  const bytes = new Uint8Array(hex.length / 2);
  for (let i = 0; i < bytes.length; i++) bytes[i] = parseInt(hex.slice(2 * i, 2 * i + 2), 16);
  return bytes;
}

/**
 * The kernel, compiled once on first use; null where WebAssembly or its SIMD instructions
 * are missing, or a Content-Security-Policy forbids compiling (loopFieldBatch then runs the
 * TypeScript loop, which gives the same values).
 */
function loadKernel(): Kernel | null {
  if (kernel !== undefined) return kernel;
  kernel = null;
  try {
    const wasm = (globalThis as { WebAssembly?: WebAssemblyApi }).WebAssembly;
    if (wasm !== undefined) {
      const { exports } = new wasm.Instance(new wasm.Module(decodeHex(loopFieldKernelHex)), {});
      const memory = exports['memory'] as { buffer: ArrayBuffer };
      kernel = { field: exports['field'] as Kernel['field'], heap: new Float64Array(memory.buffer, 0, 4 * chunk) };
    }
  } catch {
    kernel = null;
  }
  return kernel;
}

/**
 * The engine loopFieldBatch uses here. `select('typescript')` forces the plain loop
 * (tests compare the two; the benchmark times both); `select('wasm-simd')` restores the
 * kernel where it is available.
 */
export const loopFieldBatchEngine = {
  current(): LoopFieldBatchEngine {
    return !preferTypeScript && loadKernel() !== null ? 'wasm-simd' : 'typescript';
  },
  select(engine: LoopFieldBatchEngine): void {
    preferTypeScript = engine === 'typescript';
  },
};

/** True where loopField would not take loopFieldBulk (its own tests, in its order). */
function outsideBulk(a: number, z: number, rho: number): boolean {
  const r = rho < 0 ? -rho : rho;
  const sum = a + r;
  const z2 = z * z;
  return 4 * a * r > bulkParameterLimit * (sum * sum + z2) || r * r < paraxialLimit * (a * a + z2);
}

/**
 * loopField over many points of one loop: axial[i], radial[i] = B_z, B_ρ at (z[i], rho[i]).
 * The same values as loopField to the last bit, faster: points in the bulk of space
 * (m ≤ 0.999 off the paraxial zone; loopFieldBulk) run two at a time through a WebAssembly
 * SIMD kernel with exactly loopFieldBulk's arithmetic (loop-field-kernel.wat), the rest
 * through loopField. Without WebAssembly it is a plain loop over the same functions.
 * Nothing is allocated per call. SI: A, m, T.
 *
 * @param count number of points (default z.length)
 * @throws RangeError when count is negative or longer than any of the arrays
 * @example loopFieldBatch(1, 0.1, zs, rhos, axial, radial) // axial[i] = loopField(…)[0]
 */
export function loopFieldBatch(
  ampereTurns: number, radius: number, z: Float64Array, rho: Float64Array,
  axial: Float64Array, radial: Float64Array, count = z.length,
): void {
  if (!(count >= 0 && count <= Math.min(z.length, rho.length, axial.length, radial.length))) {
    throw new RangeError(`loopFieldBatch: count ${count} must be 0 or more and at most the length of every array (z ${z.length}, rho ${rho.length}, axial ${axial.length}, radial ${radial.length})`);
  }
  const wasm = preferTypeScript ? null : loadKernel();
  if (wasm === null) {
    loopFieldBatchTypeScript(ampereTurns, radius, z, rho, axial, radial, count);
    return;
  }
  const { field, heap } = wasm;
  const scale = vacuumPermeability * ampereTurns;
  for (let start = 0; start < count; start += chunk) {
    const n = Math.min(chunk, count - start);
    heap.set(z.subarray(start, start + n), 0);
    heap.set(rho.subarray(start, start + n), chunk);
    // an odd count runs one stale lane too; its output is never read
    const anyOutside = field(n + (n & 1), radius, scale, paraxialLimit, bulkParameterLimit);
    axial.set(heap.subarray(2 * chunk, 2 * chunk + n), start);
    radial.set(heap.subarray(3 * chunk, 3 * chunk + n), start);
    if (anyOutside !== 0) {
      for (let i = start; i < start + n; i++) {
        if (outsideBulk(radius, z[i]!, rho[i]!)) {
          loopField(ampereTurns, radius, z[i]!, rho[i]!, single);
          axial[i] = single[0]!;
          radial[i] = single[1]!;
        }
      }
    }
  }
}

function loopFieldBatchTypeScript(
  ampereTurns: number, radius: number, z: Float64Array, rho: Float64Array,
  axial: Float64Array, radial: Float64Array, count: number,
): void {
  for (let i = 0; i < count; i++) {
    const zi = z[i]!;
    const rhoi = rho[i]!;
    if (outsideBulk(radius, zi, rhoi)) {
      loopField(ampereTurns, radius, zi, rhoi, single);
      axial[i] = single[0]!;
      radial[i] = single[1]!;
    } else {
      loopFieldBulk(ampereTurns, radius, zi, rhoi, axial, i, radial, i);
    }
  }
}
