/**
 * Engine benchmark: stepping throughput against a naive mathjs reference, the cost of a 50-state
 * analysis and of one CUSUM run-length design. Prints target and measured side by side when run
 * directly (`node --import tsx ops/bench/engine-bench.ts`); `runEngineBench()` returns the rows so
 * another script can combine them. Timings are medians after a warm-up, on one core.
 */
import { pathToFileURL } from 'node:url';
import { add, matrix, multiply, subtract, type Matrix as MathMatrix } from 'mathjs';
import {
  analyzeModel,
  analyzeModes,
  createStepper,
  cusumArl,
  stepResponse,
  type StateSpaceModel,
} from '@shadowloop/simulator/engine';
import { seededUniform } from '@shadowloop/simulator/seeded-random';

export interface BenchRow {
  name: string;
  target: string;
  measured: string;
  /** true / false against the target; null for rows printed for information only. */
  met: boolean | null;
}

/** Seeded uniform generator (mulberry32), so every run benchmarks the same models. */
const seededRandom = seededUniform;

/** A stable model with n states, m inputs, p outputs and a nonzero operating point. */
function benchModel(n: number, m: number, p: number, seed: number): Required<StateSpaceModel> {
  const random = seededRandom(seed);
  const rows = (r: number, c: number, scale: number) =>
    Array.from({ length: r }, () => Array.from({ length: c }, () => scale * (2 * random() - 1)));
  return {
    A: rows(n, n, 0.9 / n),
    B: rows(n, m, 1),
    C: rows(p, n, 1),
    D: rows(p, m, 0.1),
    x0: rows(1, n, 10)[0],
    u0: rows(1, m, 10)[0],
    y0: rows(1, p, 10)[0],
  };
}

/** Calls `body(count)` with growing counts until one call takes at least `minMs`; returns calls per second. */
function throughput(body: (count: number) => void, minMs = 400): number {
  let count = 1000;
  for (;;) {
    const start = performance.now();
    body(count);
    const elapsed = performance.now() - start;
    if (elapsed >= minMs) return (count / elapsed) * 1000;
    count = Math.ceil(count * Math.min(10, Math.max(2, (1.2 * minMs) / Math.max(elapsed, 1))));
  }
}

function preallocatedSteps(model: Required<StateSpaceModel>): number {
  const run = createStepper(model);
  const x = Float64Array.from(model.x0);
  const u = Float64Array.from(model.u0, (v) => v + 1);
  const y = new Float64Array(model.C.length);
  run(x, u, x, y);
  return throughput((count) => {
    for (let i = 0; i < count; i++) run(x, u, x, y);
  });
}

/** The same update written the obvious way with mathjs matrices: what the stepper must beat. */
function naiveSteps(model: Required<StateSpaceModel>): number {
  const [A, B, C, D] = [model.A, model.B, model.C, model.D].map((M) => matrix(M));
  const [x0, u0, y0] = [model.x0, model.u0, model.y0].map((v) => matrix(v));
  let x: MathMatrix = x0;
  const u = matrix(model.u0.map((v) => v + 1));
  return throughput((count) => {
    for (let i = 0; i < count; i++) {
      const dx = subtract(x, x0);
      const du = subtract(u, u0);
      const y = add(y0, add(multiply(C, dx), multiply(D, du)));
      x = add(x0, add(multiply(A, dx), multiply(B, du)));
      if (y.size()[0] < 0) throw new Error('unreachable');
    }
  }, 300);
}

function medianMs(body: () => void, runs: number): { median: number; first: number } {
  const start = performance.now();
  body();
  const first = performance.now() - start;
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    body();
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  return { median: times[Math.floor(runs / 2)], first };
}

const format = (value: number) =>
  value >= 1e6 ? `${(value / 1e6).toFixed(2)} M` : value >= 1e3 ? `${(value / 1e3).toFixed(1)} k` : value.toFixed(0);

/** Runs every engine measurement and returns one row per target. */
export function runEngineBench(): BenchRow[] {
  const rows: BenchRow[] = [];
  for (const [n, m, p] of [
    [2, 1, 1],
    [10, 2, 2],
    [50, 5, 5],
  ]) {
    const model = benchModel(n, m, p, 400 + n);
    // interleaved rounds, the best of each: a round that shares the cores with the garbage
    // collector's cleaning up after mathjs (or with anything else) does not decide the ratio
    let fast = 0;
    let naive = 0;
    for (let round = 0; round < 3; round++) {
      fast = Math.max(fast, preallocatedSteps(model));
      naive = Math.max(naive, naiveSteps(model));
    }
    const ratio = fast / naive;
    rows.push({
      name: `step, ${n} states (${m} in, ${p} out): preallocated vs mathjs`,
      target: '≥ 20× naive',
      measured: `${format(fast)} vs ${format(naive)} steps/s = ${ratio.toFixed(0)}×`,
      met: ratio >= 20,
    });
    if (n === 10) {
      rows.push({
        name: 'step, 10 states: throughput',
        target: '≥ 2 M steps/s',
        measured: `${format(fast)} steps/s`,
        met: fast >= 2e6,
      });
    }
  }
  const model = benchModel(50, 5, 5, 450);
  const analysis = medianMs(() => {
    analyzeModes(model.A, 1);
    stepResponse(model.A, model.B, 200);
  }, 15);
  rows.push({
    name: 'analyzeModes + stepResponse(…, 200), 50 states, 5 inputs',
    target: '< 20 ms',
    measured: `${analysis.median.toFixed(1)} ms (first call ${analysis.first.toFixed(1)} ms)`,
    met: analysis.median < 20,
  });
  const whole = medianMs(() => analyzeModel({ ...model, samplePeriodS: 1 }), 9);
  rows.push({
    name: 'analyzeModel (all of the above, ranks, gain, 201-sample chart), 50 states',
    target: 'information',
    measured: `${whole.median.toFixed(1)} ms (first call ${whole.first.toFixed(1)} ms)`,
    met: null,
  });
  const arl = medianMs(() => cusumArl({ k: 0.5, h: 4, shift: 0, twoSided: true }), 9);
  rows.push({
    name: 'cusumArl, k = 0.5, h = 4, two-sided',
    target: '< 50 ms',
    measured: `${arl.median.toFixed(1)} ms (first call ${arl.first.toFixed(1)} ms)`,
    met: arl.median < 50,
  });
  return rows;
}

/** Prints rows as an aligned text table. */
export function printBenchTable(rows: BenchRow[]): void {
  const cells = rows.map((r) => [r.name, r.target, r.measured, r.met === null ? '' : r.met ? 'met' : 'missed']);
  const header = ['measurement', 'target', 'measured', 'result'];
  const widths = header.map((h, i) => Math.max(h.length, ...cells.map((c) => c[i].length)));
  const line = (c: string[]) => c.map((v, i) => v.padEnd(widths[i])).join('  ');
  console.log([line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...cells.map(line)].join('\n'));
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printBenchTable(runEngineBench());
}
