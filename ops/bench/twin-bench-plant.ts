import type { Knex } from 'knex';
import { seededUniform } from '@shadowloop/simulator/seeded-random';

/** Seeded uniform generator (mulberry32), so every run benchmarks the same models. */
const seededRandom = seededUniform;

export interface BenchPlantShape {
  loops: number;
  states: number;
  inputs: number;
  outputs: number;
  samplePeriodS: number;
}

export const BENCH_AREA = 'bench';

/**
 * The loops of the stepping benchmark, written straight to the tables: stable random models
 * (‖A‖∞ < 1), half of them free running and half with a Kalman gain, all active.
 */
export async function createBenchLoops(db: Knex, shape: BenchPlantShape): Promise<void> {
  const random = seededRandom(2000);
  const rows = (r: number, c: number, scale: number) =>
    Array.from({ length: r }, () => Array.from({ length: c }, () => scale * (2 * random() - 1)));
  const signals = (name: string, count: number) =>
    JSON.stringify(Array.from({ length: count }, (_, i) => ({ name: `${name} ${i + 1}`, unit: '-' })));
  await db('areas').insert({ id: BENCH_AREA, name: 'Benchmark' }).onConflict('id').ignore();
  for (let start = 0; start < shape.loops; start += 500) {
    const count = Math.min(500, shape.loops - start);
    const loops = await db('loops')
      .insert(
        Array.from({ length: count }, (_, i) => ({
          tag: `BENCH-${String(start + i).padStart(5, '0')}`,
          name: 'Benchmark loop',
          area_id: BENCH_AREA,
          sample_period_s: shape.samplePeriodS,
          inputs: signals('u', shape.inputs),
          states: signals('x', shape.states),
          outputs: signals('y', shape.outputs),
          operating_point: JSON.stringify({ x0: new Array(shape.states).fill(1), u0: new Array(shape.inputs).fill(1) }),
        })),
      )
      .returning<{ id: string }[]>('id');
    await db('model_versions').insert(
      loops.map(({ id }, i) => ({
        loop_id: id,
        number: 1,
        status: 'active',
        sample_period_s: shape.samplePeriodS,
        a: JSON.stringify(rows(shape.states, shape.states, 0.9 / shape.states)),
        b: JSON.stringify(rows(shape.states, shape.inputs, 1)),
        c: JSON.stringify(rows(shape.outputs, shape.states, 1)),
        correction: JSON.stringify(
          i % 2 ? { mode: 'kalman', K: rows(shape.states, shape.outputs, 0.05) } : { mode: 'free_run', K: null },
        ),
        change_note: 'benchmark',
        analysis: '{}',
      })),
    );
  }
}

/** Every bench loop's reading of slot k, made on the server (the plant's cost is not the twin's). */
export async function insertBenchReadings(db: Knex, shape: BenchPlantShape, k: number): Promise<void> {
  const at = k * shape.samplePeriodS;
  const vector = (count: number) => `ARRAY[${Array.from({ length: count }, () => '1 + 0.1 * random()').join(', ')}]`;
  await db.raw(
    `INSERT INTO readings (loop_id, slot_at, k, t, u, y)
     SELECT id, to_timestamp(?), ?, to_timestamp(?), ${vector(shape.inputs)}, ${vector(shape.outputs)}
     FROM loops WHERE area_id = ? ON CONFLICT DO NOTHING`,
    [at, k, at, BENCH_AREA],
  );
}
