import { describe, expect, it } from 'vitest';
import type { RuleTransition } from '../../drift-rules/rule-runtime.js';
import { detailOf, summaryOf, unstableModelSentence } from '../alert-summary.js';
import { duration, quantity } from '../plain-words.js';

const DO = [{ name: 'DO', unit: 'mg/L' }];
const TANKS = [
  { name: 'Level 1', unit: 'm' },
  { name: 'Level 2', unit: 'm' },
];
const SLOT = Date.parse('2026-12-02T08:00:00Z');

function transition(overrides: Partial<RuleTransition>): RuleTransition {
  return {
    ruleId: '00000000-0000-4000-8000-00000000000a',
    kind: 'band',
    ruleVersion: 2,
    priority: 2,
    event: 'raise',
    slotMs: SLOT,
    k: SLOT / 1000,
    statistic: { name: 'largest |residual| / limit', value: 2.1, limit: 1 },
    measured: [1.42],
    predicted: [2.05],
    residual: [-0.63],
    limits: [0.3],
    ...overrides,
  };
}

describe('summaryOf', () => {
  it('band: measured against predicted with the persistence and the band in the output unit', () => {
    const ctx = { loopTag: 'AER-DO-101', outputs: DO, raiseAfter: 3 };
    expect(summaryOf(transition({}), ctx)).toBe(
      'DO measured 1.42 mg/L against 2.05 mg/L predicted for 3 samples (band 0.30 mg/L).',
    );
  });

  it('band: names the worst output and counts the others outside their band', () => {
    const t = transition({
      measured: [2.4, 1.1],
      predicted: [2.0, 1.0],
      residual: [0.4, 0.1],
      limits: [0.2, 0.05],
    });
    expect(summaryOf(t, { loopTag: 'STO-LV-201', outputs: TANKS, raiseAfter: 1 })).toBe(
      'Level 1 measured 2.40 m against 2.00 m predicted for 1 sample (band 0.20 m), and 1 other output is outside its band.',
    );
  });

  it('cusum: the output that moved most in sigma units, with the sums against h', () => {
    const t = transition({
      kind: 'cusum',
      statistic: { name: 'largest CUSUM sum (σ)', value: 5.26, limit: 5 },
      measured: [2.4, 1.3],
      predicted: [2.0, 1.0],
      residual: [0.4, 0.3],
      limits: null,
    });
    expect(summaryOf(t, { loopTag: 'STO-LV-201', outputs: TANKS, sigma: [1, 0.1] })).toBe(
      'Level 2 has shifted from its prediction: the CUSUM sum reached 5.3 σ against the decision interval 5.0 σ ' +
        '(Level 2 measured 1.30 m against 1.00 m predicted).',
    );
  });

  it('nis: the outputs together against the chi-square limit', () => {
    const t = transition({ kind: 'nis', statistic: { name: 'NIS', value: 14.234, limit: 9.21 }, limits: null });
    expect(summaryOf(t, { loopTag: 'STO-LV-201', outputs: TANKS, raiseAfter: 2 })).toBe(
      'The residuals of the 2 outputs together are larger than the model allows: NIS 14.23 above the chi-square limit 9.21 for 2 samples.',
    );
  });

  it('stale: samples and time without a reading', () => {
    const t = transition({
      kind: 'stale',
      statistic: { name: 'samples without a reading', value: 12, limit: 10 },
      measured: null,
      predicted: null,
      residual: null,
      limits: null,
    });
    expect(summaryOf(t, { loopTag: 'AER-DO-101', outputs: DO, samplePeriodS: 10 })).toBe(
      'No reading from AER-DO-101 for 12 samples (2.0 min); the rule allows 10 samples.',
    );
  });

  it('model: the growth per sample from the spectral radius', () => {
    expect(unstableModelSentence(3, 1.0421)).toBe(
      'The active model itself diverges: version 3 has spectral radius 1.0421, so its free response grows by about 4.21 % per sample ' +
        'and its predictions run away from the plant.',
    );
    expect(unstableModelSentence(4, 1)).toMatch(/grows without bound \(a repeated mode on the unit circle\)/);
  });
});

describe('detailOf', () => {
  it('lists every output with units, values and limits at the slot', () => {
    expect(detailOf(transition({}), DO)).toEqual({
      statistic: 'largest |residual| / limit',
      value: 2.1,
      limit: 1,
      signals: [{ name: 'DO', unit: 'mg/L', measured: 1.42, predicted: 2.05, residual: -0.63, limit: 0.3 }],
      slotAt: '2026-12-02T08:00:00.000Z',
    });
    const stale = detailOf(transition({ measured: null, predicted: null, residual: null, limits: null }), DO);
    expect(stale.signals).toEqual([
      { name: 'DO', unit: 'mg/L', measured: null, predicted: null, residual: null, limit: null },
    ]);
  });
});

describe('plain words', () => {
  it('formats quantities and durations', () => {
    expect(quantity(1234.5, 'kPa')).toBe('1235 kPa');
    expect(quantity(0.01234, '')).toBe('0.0123');
    expect(duration(45)).toBe('45 s');
    expect(duration(220)).toBe('3.7 min');
    expect(duration(7560)).toBe('2.1 h');
    expect(duration(3 * 86_400)).toBe('3.0 days');
  });
});
