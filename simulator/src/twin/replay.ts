import { Matrix as MlMatrix, SingularValueDecomposition } from 'ml-matrix';
import { RANK_RELATIVE_TOLERANCE, type Matrix, type StateSpaceModel } from '../engine/index.js';
import type { ActiveModel } from '../registry/hot-swap.js';
import type { CorrectionMode } from './correction.js';
import { createLoopTwin, hasFiniteState, type LoopTwin } from './loop-twin.js';
import { coast, stepSlot, type SlotReading } from './twin-step.js';

export {
  outputFigures,
  NEGLIGIBLE_RESIDUAL,
  type OutputFigures,
  type ReplayAutocorrelation,
} from './replay-figures.js';

/**
 * Replays one model version over a recording with the live twin's own code (createLoopTwin,
 * stepSlot, coast and the version's corrector), so that a backtest predicts exactly what the twin
 * would have predicted, slot by slot: the prior prediction ŷ(k | k−1) the twin stores for slot k.
 */

/**
 * Recorded readings, N slots: `k` the slot numbers (strictly increasing integers; a skipped number
 * is a slot without a reading), `u` N×inputs and `y` N×outputs row-major, in engineering units.
 * A slot with a non-finite value is treated as a slot without a reading.
 */
export interface Recording {
  k: Float64Array;
  u: Float64Array;
  y: Float64Array;
  inputs: number;
  outputs: number;
}

/** The model version replayed: its model with the operating point, and its correction settings. */
export interface ReplayVersion {
  model: StateSpaceModel;
  correction: { mode: CorrectionMode; K: Matrix | null };
}

export interface ReplayOptions {
  /**
   * L, the measured slots the initial state is fitted to (integer ≥ 0; 0 starts at the operating
   * point); min(N, max(10 n, 50)) when absent.
   */
  initialSamples?: number;
}

export interface ReplayResult {
  /** The correction applied in the one-step run, after fallbacks (free_run when the gain is unusable). */
  correction: CorrectionMode;
  /** Why the applied correction differs from the version's; null when it does not. */
  note: string | null;
  /** N×p prior predictions ŷ(k | k−1) with the version's correction (NaN after a divergence). */
  oneStep: Float64Array;
  /** N×p predictions from the inputs only (NaN after a divergence). */
  freeRun: Float64Array;
  /** The state both runs start from at slot k(0), engineering units. */
  initialState: number[];
  /** A run's state or prediction left the finite numbers; its predictions are NaN from that slot on. */
  diverged: boolean;
}

export interface Replay {
  readonly done: boolean;
  /** Share of the recording's slots replayed, 0 … 1. */
  readonly fraction: number;
  /** Replays up to `maxSlots` more slots of the recording (both runs); allocates nothing per slot. */
  advance(maxSlots: number): void;
  /** The predictions; only once `done`. */
  result(): ReplayResult;
}

/** One of the two runs: a twin and where its predictions go. */
interface Run {
  twin: LoopTwin;
  out: Float64Array;
  diverged: boolean;
}

/**
 * Starts the replay of a version over a recording. Both runs, one-step (the version's correction
 * applied with every reading) and free run (inputs only), start at slot k(0) from the state fitted
 * by {@link fitInitialState}, with the inputs of the first reading held (the twin's prediction of
 * a slot uses the inputs of the reading before it). Slots missing from the recording are coasted
 * on held inputs as the live twin does, and get no prediction in the output (they are not rows of
 * it). Work happens in {@link Replay.advance}, so a caller can yield between chunks.
 *
 * @param version - model (with C, D and the operating point x0, u0, y0) and correction settings
 * @param recording - the readings, N ≥ 1 slots, with as many inputs and outputs as the model
 * @param options - {@link ReplayOptions}
 */
export function startReplay(version: ReplayVersion, recording: Recording, options: ReplayOptions = {}): Replay {
  const { model } = version;
  const { slots, outputs } = checkRecording(model, recording);
  const states = model.A.length;
  const L = options.initialSamples ?? Math.min(slots, Math.max(10 * states, 50));
  if (!Number.isInteger(L) || L < 0) {
    throw new RangeError(`startReplay: initialSamples must be an integer ≥ 0, got ${options.initialSamples}`);
  }
  const held = firstInputs(recording);
  const initialState = fitInitialState(model, recording, L, held);
  const start = { next: recording.k[0], x: initialState, u: held, staleAfterSamples: Number.POSITIVE_INFINITY };
  const run = (correction: ReplayVersion['correction']): Run => ({
    twin: createLoopTwin(replayed(model, correction), start),
    out: new Float64Array(slots * outputs).fill(NaN),
    diverged: false,
  });
  const oneStep = run(version.correction);
  const freeRun = run({ mode: 'free_run', K: null });
  const reading = emptyReading(recording);
  let next = 0;
  return {
    get done() {
      return next >= slots;
    },
    get fraction() {
      return next / slots;
    },
    advance(maxSlots: number) {
      if (!(maxSlots >= 0)) throw new RangeError(`advance: maxSlots must be a number ≥ 0, got ${maxSlots}`);
      const end = Math.min(slots, next + Math.floor(maxSlots));
      for (; next < end; next++) {
        const measured = readSlot(recording, next, reading) ? reading : undefined;
        replaySlot(oneStep, next, recording.k[next], measured);
        replaySlot(freeRun, next, recording.k[next], measured);
      }
    },
    result() {
      if (next < slots)
        throw new Error(`replay: result() asked for after ${next} of ${slots} slots; advance to the end first`);
      return {
        correction: oneStep.twin.corrector.mode,
        note: oneStep.twin.corrector.note,
        oneStep: oneStep.out,
        freeRun: freeRun.out,
        initialState: initialState.slice(),
        diverged: oneStep.diverged || freeRun.diverged,
      };
    },
  };
}

/**
 * Slot i of one run: coast over the slots missing before it, store the prior prediction ŷ(k | k−1)
 * (the twin's `predicted`), then apply the reading and advance (stepSlot). Allocates nothing.
 */
function replaySlot(run: Run, i: number, k: number, reading: SlotReading | undefined): void {
  if (run.diverged) return;
  const { twin } = run;
  const gap = k - twin.next;
  if (gap > 0) coast(twin, gap);
  if (!hasFiniteState(twin) || !allFinite(twin.predicted)) {
    run.diverged = true;
    return;
  }
  run.out.set(twin.predicted, i * twin.predicted.length);
  stepSlot(twin, reading);
}

/**
 * The state at slot k(0) that explains the first L measured slots best, in the least-squares
 * sense, when the model runs free from it. Common practice when a simulated model is compared with
 * recorded data: the initial state is estimated rather than assumed, so that a start away from the
 * operating point does not count against the model.
 *
 * The model is linear, so starting at x0 + δx instead of the operating point x0 shifts the free-run
 * prediction of slot k(i) by exactly C A^j δx with j = k(i) − k(0) (gaps included; D acts on the
 * inputs, which do not depend on the start). With r(i) = y(k(i)) − ŷ_x0(k(i)), the residual of a
 * free run from x0 (the twin's own code), δx minimises Σ_i ‖C A^{j_i} δx − r(i)‖² over the stacked
 * rows [C A^{j_i} | r(i)]. Each row is folded into an upper triangular [R z] by Givens rotations as
 * it comes (memory n², not L·p·n); then ‖Φ δx − r‖² = ‖R δx − z‖² + const, and the minimum-norm
 * solution δx = R⁺ z, computed from the SVD of R with singular values below
 * RANK_RELATIVE_TOLERANCE × the largest taken as 0, equals Φ⁺ r: a state the first L slots do not
 * show (rank-deficient C, an unobservable mode) stays at its operating point. G. H. Golub, C. F. Van
 * Loan, Matrix Computations, 4th ed., 2013, §5.1 (Givens rotations), §5.5 (rank-deficient least
 * squares) and §6.5 (updating a QR factorisation by a row).
 *
 * Rows stop at the first non-finite one (an unstable model whose powers overflow).
 *
 * @param L - measured slots to use (0: the operating point)
 * @param held - the inputs held before the first reading (the operating point when undefined)
 * @returns x0 + δx, engineering units
 */
function fitInitialState(
  model: StateSpaceModel,
  recording: Recording,
  L: number,
  held: Float64Array | undefined,
): number[] {
  const n = model.A.length;
  const x0 = model.x0 ?? new Array<number>(n).fill(0);
  if (L === 0) return x0.slice();
  const p = recording.outputs;
  const probe = createLoopTwin(replayed(model, { mode: 'free_run', K: null }), {
    next: recording.k[0],
    u: held,
    staleAfterSamples: Number.POSITIVE_INFINITY,
  });
  const A = Float64Array.from(model.A.flat());
  let M = Float64Array.from((model.C ?? identity(n)).flat()); // C A^j, p×n
  let spare = new Float64Array(p * n);
  /** M ← M A^steps; a long gap by repeated squaring (ml-matrix mpow). */
  const times = (steps: number) => {
    const power = steps > 4 ? Float64Array.from(new MlMatrix(model.A).mpow(steps).to1DArray()) : A;
    for (let s = 0; s < (power === A ? steps : 1); s++) {
      multiplyInto(spare, M, power, p, n);
      [M, spare] = [spare, M];
    }
  };
  const w = n + 1;
  const Rz = new Float64Array(n * w); // [R z], n×(n+1), R upper triangular
  const row = new Float64Array(w);
  const reading = emptyReading(recording);
  let used = 0;
  fit: for (let i = 0; i < recording.k.length && used < L; i++) {
    const gap = recording.k[i] - probe.next;
    if (gap > 0) {
      coast(probe, gap);
      times(gap);
    }
    const measured = readSlot(recording, i, reading);
    if (measured) {
      for (let j = 0; j < p; j++) {
        row.set(M.subarray(j * n, j * n + n));
        row[n] = reading.y[j] - probe.predicted[j];
        if (!allFinite(row)) break fit;
        foldRow(Rz, row, n);
      }
      used++;
    }
    stepSlot(probe, measured ? reading : undefined);
    times(1);
  }
  const delta = minimumNormSolution(Rz, n);
  return x0.map((v, i) => v + delta[i]);
}

/** Folds [a | b] into the upper triangular [R z] (n×(n+1)) by Givens rotations; `row` is consumed. */
function foldRow(Rz: Float64Array, row: Float64Array, n: number): void {
  const w = n + 1;
  for (let c = 0; c < n; c++) {
    const b = row[c];
    if (b === 0) continue;
    const a = Rz[c * w + c];
    const r = Math.hypot(a, b);
    const cos = a / r;
    const sin = b / r;
    Rz[c * w + c] = r;
    row[c] = 0;
    for (let j = c + 1; j < w; j++) {
      const top = Rz[c * w + j];
      Rz[c * w + j] = cos * top + sin * row[j];
      row[j] = cos * row[j] - sin * top;
    }
  }
}

/** R⁺ z from the SVD of R, singular values ≤ RANK_RELATIVE_TOLERANCE × the largest taken as 0. */
function minimumNormSolution(Rz: Float64Array, n: number): number[] {
  const w = n + 1;
  const R = Array.from({ length: n }, (_, i) => Array.from(Rz.subarray(i * w, i * w + n)));
  const z = Array.from({ length: n }, (_, i) => Rz[i * w + n]);
  const svd = new SingularValueDecomposition(new MlMatrix(R));
  const s = svd.diagonal;
  const U = svd.leftSingularVectors;
  const V = svd.rightSingularVectors;
  const largest = Math.max(0, ...s);
  const delta = new Array<number>(n).fill(0);
  s.forEach((sigma, c) => {
    if (!(sigma > RANK_RELATIVE_TOLERANCE * largest)) return;
    let projection = 0;
    for (let i = 0; i < n; i++) projection += U.get(i, c) * z[i];
    for (let i = 0; i < n; i++) delta[i] += (V.get(i, c) * projection) / sigma;
  });
  return delta;
}

/** out = M A for row-major M (rows×n) and A (n×n). */
function multiplyInto(out: Float64Array, M: Float64Array, A: Float64Array, rows: number, n: number): void {
  out.fill(0);
  for (let i = 0; i < rows; i++) {
    for (let l = 0; l < n; l++) {
      const m = M[i * n + l];
      if (m === 0) continue;
      for (let j = 0; j < n; j++) out[i * n + j] += m * A[l * n + j];
    }
  }
}

/** Checks the recording against the model; throws a RangeError naming what does not fit. */
function checkRecording(model: StateSpaceModel, recording: Recording): { slots: number; outputs: number } {
  const n = model.A.length;
  const m = model.B[0]?.length ?? 0;
  const p = model.C ? model.C.length : n;
  const { k, u, y, inputs, outputs } = recording;
  if (inputs !== m || outputs !== p) {
    throw new RangeError(
      `startReplay: the recording has ${inputs} inputs and ${outputs} outputs, the model ${m} and ${p}`,
    );
  }
  const slots = k.length;
  if (slots === 0) throw new RangeError('startReplay: the recording has no slots');
  if (u.length !== slots * m || y.length !== slots * p) {
    throw new RangeError(
      `startReplay: ${slots} slots need ${slots * m} input values and ${slots * p} output values, got ${u.length} and ${y.length}`,
    );
  }
  for (let i = 0; i < slots; i++) {
    if (!Number.isSafeInteger(k[i]) || (i > 0 && k[i] <= k[i - 1])) {
      throw new RangeError(
        `startReplay: slot numbers must be strictly increasing integers, but k[${i}] = ${k[i]}` +
          (i > 0 ? ` follows ${k[i - 1]}` : ''),
      );
    }
  }
  return { slots, outputs: p };
}

/** The inputs of the first complete reading; undefined (the operating point) when there is none. */
function firstInputs(recording: Recording): Float64Array | undefined {
  const reading = emptyReading(recording);
  for (let i = 0; i < recording.k.length; i++) if (readSlot(recording, i, reading)) return Float64Array.from(reading.u);
  return undefined;
}

const emptyReading = (recording: Recording): SlotReading => ({
  k: 0,
  u: new Array<number>(recording.inputs).fill(0),
  y: new Array<number>(recording.outputs).fill(0),
});

/** Copies slot i into `reading` in place; false when a value is not finite (no usable reading). */
function readSlot(recording: Recording, i: number, reading: SlotReading): boolean {
  const { inputs: m, outputs: p } = recording;
  reading.k = recording.k[i];
  for (let j = 0; j < m; j++) {
    const v = recording.u[i * m + j];
    if (!Number.isFinite(v)) return false;
    reading.u[j] = v;
  }
  for (let j = 0; j < p; j++) {
    const v = recording.y[i * p + j];
    if (!Number.isFinite(v)) return false;
    reading.y[j] = v;
  }
  return true;
}

function allFinite(values: Float64Array): boolean {
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) return false;
  return true;
}

const identity = (n: number): Matrix =>
  Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));

/**
 * The version as the twin's code takes it. The replay works on slot numbers only, so the loop's
 * identity and sample period are placeholders that nothing here reads.
 */
const replayed = (model: StateSpaceModel, correction: ReplayVersion['correction']): ActiveModel => ({
  loopId: 'replay',
  loopTag: 'replay',
  samplePeriodS: 1,
  version: { id: 'replay', number: 0 },
  model,
  correction,
});
