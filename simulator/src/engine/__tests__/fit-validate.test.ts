import { describe, expect, it } from 'vitest';
import { fitPercent, residualAutocorrelation } from '../fit.js';
import { validateModel } from '../validate.js';
import { seededRandom } from './seeded-random.js';

describe('fitPercent', () => {
  it('is 100 for a perfect prediction, 0 for the mean, null for a constant signal', () => {
    const y = [1, 3, 2, 5, 4];
    expect(fitPercent(y, y)).toBe(100);
    expect(
      fitPercent(
        y,
        y.map(() => 3),
      ),
    ).toBeCloseTo(0, 14);
    expect(fitPercent([2, 2, 2], [1, 2, 3])).toBeNull();
    expect(() => fitPercent([1, 2], [1])).toThrow(/equally long/);
  });
});

describe('residualAutocorrelation', () => {
  it('passes seeded white noise and fails a strongly correlated residual', () => {
    const random = seededRandom(81);
    const white = Array.from({ length: 2000 }, () => random() - 0.5);
    const result = residualAutocorrelation(white, 10);
    expect(result.correlation[0]).toBe(1);
    expect(result.band).toBeCloseTo(1.96 / Math.sqrt(2000), 15);
    expect(result.lagsOutside.length).toBeLessThanOrEqual(2);
    const correlated = [0];
    for (let t = 1; t < 2000; t++) correlated.push(0.8 * correlated[t - 1] + random() - 0.5);
    const verdict = residualAutocorrelation(correlated, 5);
    expect(verdict.white).toBe(false);
    expect(verdict.correlation[1]).toBeGreaterThan(0.7);
  });
});

describe('validateModel', () => {
  const good = {
    A: [
      [0.5, 0.1],
      [0, 0.9],
    ],
    B: [
      [1, 0],
      [0, 1],
    ],
    samplePeriodS: 1,
  };

  it('accepts a well-formed model', () => {
    expect(validateModel(good)).toEqual([]);
    expect(validateModel({ ...good, C: [[1, 0]], D: [[0, 0]], x0: [1, 2], u0: [0, 0], y0: [3] })).toEqual([]);
  });

  it('names every problem with its place', () => {
    const problems = validateModel({
      A: [
        [0.5, 0.1],
        [0, NaN],
      ],
      B: [[1, 0], [0, 1], [1]],
      C: [[1, 0, 0]],
      D: [[0]],
      samplePeriodS: 0,
      x0: [1],
    });
    expect(problems.map((p) => p.message)).toEqual([
      'A[2][2] is not a finite number',
      'B has 3 rows, expected 2 (one per state)',
      'B row 3 has 1 column, expected 2',
      'C row 1 has 3 columns, expected 2',
      'D row 1 has 1 column, expected 2',
      'samplePeriodS must be a positive number of seconds',
      'x0 has 1 entry, expected 2 (one per state)',
    ]);
    expect(problems[0].path).toEqual(['A', 1, 1]);
  });

  it('reports a non-square A, missing parts and strings', () => {
    expect(validateModel({ A: [[1, 2]], B: [[1]] }).map((p) => p.message)).toEqual(['A must be square, got 1×2']);
    expect(validateModel({ A: [['1']] }).map((p) => p.message)).toEqual([
      'A[1][1] is not a finite number',
      'B is missing',
    ]);
    expect(validateModel({ A: [], B: 3 }).map((p) => p.message)).toEqual([
      'A must have at least one row',
      'B must be an array of rows',
    ]);
  });

  it('reports sizes beyond 200 states and 50 inputs or outputs', () => {
    const n = 201;
    const A = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    const B = Array.from({ length: n }, () => new Array<number>(51).fill(0));
    const messages = validateModel({ A, B }).map((p) => p.message);
    expect(messages).toEqual(['A has 201 states; at most 200 are allowed', 'B has 51 inputs; at most 50 are allowed']);
  });

  it('never throws on odd input and caps the list', () => {
    for (const input of [null, undefined, 3, 'A', [], { A: null }, { A: [null] }, { A: [[1]], B: [[1]], C: 'x' }]) {
      expect(() => validateModel(input)).not.toThrow();
      expect(validateModel(input).length).toBeGreaterThan(0);
    }
    const A = Array.from({ length: 20 }, () => new Array<number>(20).fill(Infinity));
    const problems = validateModel({ A, B: A.map(() => [1]) });
    expect(problems).toHaveLength(101);
    expect(problems[100].message).toBe('… and 300 more problems');
  });
});
