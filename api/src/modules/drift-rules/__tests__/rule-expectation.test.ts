import { cusumArl, normalCdf, persistenceArl } from '@shadowloop/simulator/engine';
import { describe, expect, it } from 'vitest';
import { plainDuration } from '../plain-duration.js';
import { expectationOf } from '../rule-expectation.js';
import { band, cusum, nisParams } from './rule-fixtures.js';

describe('expectationOf', () => {
  it('cusum: the two-sided in-control ARL per output, divided among the outputs, and the delay at the shift', () => {
    const params = cusum({ k: 0.5, h: 5, sigma: [1, 1], shift: 1 });
    const e = expectationOf('cusum', params, 10, 2);
    const arl = cusumArl({ k: 0.5, h: 5, shift: 0, twoSided: true });
    expect(e.falseAlertIntervalSamples).toBeCloseTo(arl / 2, 9);
    expect(e.falseAlertIntervalHours).toBeCloseTo((arl / 2) * (10 / 3600), 9);
    expect(e.detectionDelaySamples).toBeCloseTo(cusumArl({ k: 0.5, h: 5, shift: 1 }), 9);
    expect(e.shiftSigma).toBe(1);
    expect(e.sentence).toMatch(
      /^About one false alert every 39 minutes at this sample period \(1 in 230 samples\)\. A shift of 1σ raises it after about 10 samples \(1\.7 minutes\)\.$/,
    );
  });

  it('band in sigma mode: p = 2Φ(−k) per output, combined over outputs, persistence after Feller', () => {
    const e = expectationOf('band', band({ mode: 'sigma', k: 3, sigma: [1, 2], raiseAfter: 2 }), 1, 2);
    const p = 1 - (1 - 2 * normalCdf(-3)) ** 2;
    expect(e.falseAlertIntervalSamples).toBeCloseTo(persistenceArl(p, 2), 6);
    expect(e.detectionDelaySamples).toBeNull();
  });

  it('band in absolute mode uses limit/sigma when sigma is given, and is unknown without it', () => {
    const withSigma = expectationOf('band', band({ limits: [0.3, null], sigma: [0.1, 5], raiseAfter: 1 }), 1, 2);
    expect(withSigma.falseAlertIntervalSamples).toBeCloseTo(1 / (2 * normalCdf(-3)), 6);
    const without = expectationOf('band', band({ limits: [0.3] }), 1, 1);
    expect(without.falseAlertIntervalSamples).toBeNull();
    expect(without.sentence).toContain('add sigma');
  });

  it('nis: persistence of the chosen false-alarm probability', () => {
    const e = expectationOf('nis', nisParams({ falseAlarmProbability: 0.001, raiseAfter: 3 }), 60, 3);
    expect(e.falseAlertIntervalSamples).toBeCloseTo(persistenceArl(0.001, 3), 3);
    expect(e.sentence).toContain('if the model and its innovation covariance are right');
  });

  it('stale: no interval, a sentence saying what it does', () => {
    const e = expectationOf('stale', { afterSamples: 5 }, 10, 1);
    expect(e.falseAlertIntervalSamples).toBeNull();
    expect(e.sentence).toContain('no reading has arrived for 5 samples (50 seconds at this sample period)');
  });

  it('says "practically no false alerts" when the interval is beyond any number', () => {
    const e = expectationOf('band', band({ mode: 'sigma', k: 40, sigma: [1], raiseAfter: 50 }), 1, 1);
    expect(e.falseAlertIntervalSamples).toBeNull();
    expect(e.sentence).toMatch(/^Practically no false alerts/);
  });
});

describe('plainDuration', () => {
  it('picks a unit and rounds to two significant figures', () => {
    expect(plainDuration(45)).toBe('45 seconds');
    expect(plainDuration(60)).toBe('60 seconds');
    expect(plainDuration(100)).toBe('1.7 minutes');
    expect(plainDuration(3600)).toBe('60 minutes');
    expect(plainDuration(2 * 3600)).toBe('2 hours');
    expect(plainDuration(9.3 * 86_400)).toBe('9.3 days');
    expect(plainDuration(86_400)).toBe('24 hours');
    expect(plainDuration(123.4 * 86_400)).toBe('120 days');
    expect(plainDuration(1234 * 365.25 * 86_400)).toBe('1,200 years');
    expect(plainDuration(1)).toBe('1 second');
    expect(plainDuration(1e15)).toBe('more than a million years');
  });
});
