import { modelShape } from './model-shape.js';
import { assertVector } from './shape.js';
import { STEP_KERNEL_WASM_BASE64 } from './step-kernel-wasm.js';
import type { Matrix, StateSpaceModel } from './types.js';

/** One sample of a model: the next state and the output at the current sample. */
export interface StepResult {
  /** x(k+1) in engineering units. */
  x: number[];
  /** y(k) in engineering units. */
  y: number[];
}

/**
 * Writes `x(k+1)` into `xNext` and `y(k)` into `y` for the state `x(k)` and input `u(k)`, all in
 * engineering units. Allocates nothing; `xNext` may be the same array as `x`.
 */
export type Stepper = (x: Float64Array, u: Float64Array, xNext: Float64Array, y: Float64Array) => void;

/**
 * Advances a model one sample: `x(k+1) = x0 + A (x − x0) + B (u − u0)`,
 * `y(k) = y0 + C (x − x0) + D (u − u0)` (C = I, D = 0 and y0 = C x0 + D u0 when omitted).
 * Allocates its results; for the per-sample loop use {@link createStepper}.
 *
 * @param model - the model and its operating point
 * @param x - state x(k) (length n, engineering units)
 * @param u - input u(k) (length m, engineering units)
 */
export function step(model: StateSpaceModel, x: number[], u: number[]): StepResult {
  const { states, outputs } = modelShape('step', model);
  const run = createStepper(model);
  const xNext = new Float64Array(states);
  const y = new Float64Array(outputs);
  run(Float64Array.from(x), Float64Array.from(u), xNext, y);
  return { x: Array.from(xNext), y: Array.from(y) };
}

/**
 * Prepares the per-sample update of {@link step} for the simulator's hot path: `[A B]` and `[C D]`
 * are copied once into row-major arrays (rows zero-padded), the deviations `[x − x0; u − u0]` go
 * to one scratch array, and each call does about `(n + p)(n + m)` multiply-adds with no
 * allocation, in several partial sums per row so that the additions do not wait on each other.
 * Lengths are checked on every call.
 *
 * Models with 16 or more states plus inputs run in a WebAssembly kernel with two-lane SIMD
 * (step-kernel.wat), about 5× the JavaScript loops at 50 states (1.0–1.5 M against 0.24–0.30 M steps/s); each such stepper owns a small
 * WebAssembly memory (64 KiB for 50 states). Smaller models, and runtimes without WebAssembly SIMD,
 * use JavaScript loops compiled once per model shape (see {@link kernelFactory}): steppers of one
 * shape share their code, and steppers of other shapes never share type feedback with them.
 *
 * @param model - the model and its operating point (copied; later changes to it are not seen)
 * @returns a {@link Stepper}
 */
export function createStepper(model: StateSpaceModel): Stepper {
  const { states: n, inputs: m, outputs: p } = modelShape('createStepper', model);
  const x0 = Float64Array.from(model.x0 ?? new Array<number>(n).fill(0));
  const u0 = Float64Array.from(model.u0 ?? new Array<number>(m).fill(0));
  const y0 = Float64Array.from(model.y0 ?? operatingOutput(model, p));
  // with neither C nor D the output is the state itself: no product needed
  const output = model.C || model.D ? { C: model.C ?? identityRows(n), D: model.D ?? zeroRows(p, m) } : null;
  const module = wasmApi && n + m >= WASM_MIN_COLUMNS ? stepKernelModule() : null;
  const prepared: PreparedModel = { n, m, p, A: model.A, B: model.B, output, x0, u0, y0 };
  const kernel = wasmApi && module ? wasmKernel(wasmApi, module, prepared) : javascriptKernel(prepared);
  return (x, u, xNext, y) => {
    if (x.length !== n || u.length !== m || xNext.length !== n || y.length !== p) {
      assertVector('stepper', 'x', x, n);
      assertVector('stepper', 'u', u, m);
      assertVector('stepper', 'xNext', xNext, n);
      assertVector('stepper', 'y', y, p);
    }
    kernel(x, u, xNext, y);
  };
}

/**
 * States plus inputs from which the WebAssembly kernel is used. It is already a little faster at
 * 10 states (4.8 against 4.1 M steps/s), but each such stepper owns at least 64 KiB of WebAssembly
 * memory, which thousands of small loops should not pay for so small a gain.
 */
const WASM_MIN_COLUMNS = 16;

/** A model's matrices and operating point as both kernels take them (output null: y = x). */
interface PreparedModel {
  n: number;
  m: number;
  p: number;
  A: Matrix;
  B: Matrix;
  output: { C: Matrix; D: Matrix } | null;
  x0: Float64Array;
  u0: Float64Array;
  y0: Float64Array;
}

function javascriptKernel({ n, m, p, A, B, output, x0, u0, y0 }: PreparedModel): Stepper {
  // rows padded with zeros to a multiple of the partial sums: no tail loop
  const lanes = n + m >= 16 ? 8 : 4;
  const width = lanes * Math.ceil((n + m) / lanes);
  const AB = joinRows(A, B, width);
  const CD = output ? joinRows(output.C, output.D, width) : null;
  return kernelFactory(n, m, p, width, lanes, CD !== null)(AB, CD, x0, u0, y0, new Float64Array(width));
}

/**
 * The part of the WebAssembly JavaScript API the stepper uses, typed here because the engine's
 * compiler settings (ES2023 with Node's types, no DOM) do not declare the global.
 */
interface WasmApi {
  validate(bytes: Uint8Array): boolean;
  Module: new (bytes: Uint8Array) => WasmModule;
  Memory: new (size: { initial: number; maximum: number }) => { buffer: ArrayBuffer };
  Instance: new (module: WasmModule, imports: object) => { exports: Record<string, unknown> };
}
type WasmModule = { readonly compiledStepKernel?: never };

const wasmApi = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;
let compiledKernel: WasmModule | null | undefined;

/** The SIMD kernel compiled once per process, or null where WebAssembly SIMD is not available. */
function stepKernelModule(): WasmModule | null {
  if (compiledKernel === undefined) {
    try {
      const bytes = Uint8Array.from(atob(STEP_KERNEL_WASM_BASE64), (c) => c.charCodeAt(0));
      compiledKernel = wasmApi?.validate(bytes) ? new wasmApi.Module(bytes) : null;
    } catch {
      compiledKernel = null;
    }
  }
  return compiledKernel;
}

/**
 * A stepper on the WebAssembly kernel. Its memory holds, in doubles: `M = [A B; C D]` (rows W
 * wide, W a multiple of 8), then `raw = [x; u]`, `op = [x0; u0]` and the deviations (W each), then
 * `base = [x0; y0]` and `out = [x(k+1); y(k)]`. A call copies x and u in, runs the kernel and
 * copies the results out through views made once.
 */
function wasmKernel(wasm: WasmApi, module: WasmModule, prepared: PreparedModel): Stepper {
  const { n, m, p, output, x0, u0, y0 } = prepared;
  const W = 8 * Math.ceil((n + m) / 8);
  const rows = n + (output ? p : 0);
  const even = (count: number) => count + (count % 2);
  const M = 0;
  const raw = M + rows * W;
  const op = raw + W;
  const dev = op + W;
  const base = dev + W;
  const out = base + even(rows);
  const pages = Math.ceil(((out + even(rows)) * 8) / 65536);
  const memory = new wasm.Memory({ initial: pages, maximum: pages });
  const instance = new wasm.Instance(module, { env: { memory } });
  const run = instance.exports.step as (...offsets: number[]) => void;
  const heap = new Float64Array(memory.buffer);
  heap.set(joinRows(prepared.A, prepared.B, W), M);
  if (output) heap.set(joinRows(output.C, output.D, W), M + n * W);
  heap.set(x0, op);
  heap.set(u0, op + n);
  heap.set(x0, base);
  if (output) heap.set(y0, base + n);
  const rawX = heap.subarray(raw, raw + n);
  const rawU = heap.subarray(raw + n, raw + n + m);
  const outX = heap.subarray(out, out + n);
  const outY = heap.subarray(out + n, out + n + p);
  const bytes = [M, raw, op, dev, base, out].map((offset) => offset * 8);
  const [mAt, rawAt, opAt, devAt, baseAt, outAt] = bytes;
  return (x, u, xNext, y) => {
    // y = y0 + (x − x0) when there is no output product; read x before xNext (maybe x) is written
    if (!output) for (let i = 0; i < p; i++) y[i] = y0[i] + (x[i] - x0[i]);
    rawX.set(x);
    rawU.set(u);
    run(mAt, rows, W, rawAt, opAt, devAt, baseAt, outAt);
    xNext.set(outX);
    if (output) y.set(outY);
  };
}

type KernelFactory = (
  AB: Float64Array,
  CD: Float64Array | null,
  x0: Float64Array,
  u0: Float64Array,
  y0: Float64Array,
  deviation: Float64Array,
) => Stepper;

const factories = new Map<string, KernelFactory>();

/**
 * Row i's product Σ_j M[i·width + j] deviation[j] as source text, in `lanes` independent partial
 * sums (4, or 8 for wider rows, where the longer chains pay) so that the additions do not wait on
 * each other; the sum ends in `s`.
 */
function dotSource(M: string, width: number, lanes: number): string {
  const sums = Array.from({ length: lanes }, (_, l) => `s${l}`);
  const terms = sums.map((sum, l) => `${sum} += ${M}[o + j + ${l}] * deviation[j + ${l}];`).join(' ');
  const total = lanes === 8 ? '(s0 + s4 + (s1 + s5)) + (s2 + s6 + (s3 + s7))' : 's0 + s1 + (s2 + s3)';
  return `
      const o = i * ${width};
      let ${sums.map((sum) => `${sum} = 0`).join(', ')};
      for (let j = 0; j < ${width}; j += ${lanes}) { ${terms} }
      const s = ${total};`;
}

/**
 * The kernel of one model shape (n states, m inputs, p outputs, padded row width, with or without
 * an output product), compiled once from source in which the sizes are constants. Only these
 * integers go into the source; the matrices stay data.
 */
function kernelFactory(
  n: number,
  m: number,
  p: number,
  width: number,
  lanes: number,
  withOutput: boolean,
): KernelFactory {
  const key = `${n}:${m}:${p}:${width}:${lanes}:${withOutput}`;
  let factory = factories.get(key);
  if (!factory) {
    const output = withOutput
      ? `for (let i = 0; i < ${p}; i++) {${dotSource('CD', width, lanes)}
      y[i] = y0[i] + s;
    }`
      : `for (let i = 0; i < ${p}; i++) y[i] = y0[i] + deviation[i];`;
    const source = `'use strict';
  return function stepper_${n}_${m}_${p}(x, u, xNext, y) {
    for (let i = 0; i < ${n}; i++) deviation[i] = x[i] - x0[i];
    for (let j = 0; j < ${m}; j++) deviation[${n} + j] = u[j] - u0[j];
    ${output}
    for (let i = 0; i < ${n}; i++) {${dotSource('AB', width, lanes)}
      xNext[i] = x0[i] + s;
    }
  };`;
    factory = new Function('AB', 'CD', 'x0', 'u0', 'y0', 'deviation', source) as KernelFactory;
    factories.set(key, factory);
  }
  return factory;
}

/** Row-major `[L R 0]` with rows `width` long (L and R have the same number of rows). */
function joinRows(L: Matrix, R: Matrix, width: number): Float64Array {
  const out = new Float64Array(L.length * width);
  L.forEach((row, i) => {
    out.set(row, i * width);
    out.set(R[i], i * width + row.length);
  });
  return out;
}

function identityRows(n: number): Matrix {
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
}

function zeroRows(rows: number, columns: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(columns).fill(0));
}

/** Default output operating point `C x0 + D u0`, so that with no y0 the output is `C x + D u`. */
function operatingOutput(model: StateSpaceModel, p: number): number[] {
  const x0 = model.x0;
  const u0 = model.u0;
  return Array.from({ length: p }, (_, i) => {
    let s = 0;
    if (x0) s += model.C ? model.C[i].reduce((sum, c, j) => sum + c * x0[j], 0) : x0[i];
    if (u0 && model.D) s += model.D[i].reduce((sum, d, j) => sum + d * u0[j], 0);
    return s;
  });
}
