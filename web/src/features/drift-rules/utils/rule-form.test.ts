import { describe, expect, it } from 'vitest';
import { ruleForm, ruleParams } from './rule-form';

describe('the rule editor form', () => {
  it('reads a stored band rule back into the same params', () => {
    const params = {
      mode: 'absolute',
      limits: [0.4, null],
      sigma: [0.1, 0.2],
      raiseAfter: 3,
      clearAfter: 5,
      deadband: 0.15,
    };
    const form = ruleForm('band', { enabled: true, priority: 1, params }, 2);
    expect(form.deadbandPercent).toBe('15');
    expect(form.limits).toEqual(['0.4', '']);
    expect(ruleParams('band', form)).toEqual({ params, problems: {} });
  });

  it('names each field that is not a number, per output too', () => {
    const form = { ...ruleForm('cusum', undefined, 2), sigma: ['0.1', 'x'], h: '' };
    expect(ruleParams('cusum', form).problems).toEqual({ 'sigma.1': '“x” is not a number.', h: 'Enter a number.' });
  });

  it('leaves sigma out of a NIS rule when none is given, and starts new rules from defaults', () => {
    const form = ruleForm('nis', undefined, 1);
    expect(form.enabled).toBe(true);
    expect(ruleParams('nis', form).params).toEqual({ falseAlarmProbability: 0.001, raiseAfter: 3, clearAfter: 5 });
    expect(ruleParams('stale', ruleForm('stale', undefined, 1)).params).toEqual({ afterSamples: 10 });
  });
});
