import { describe, expect, it } from 'vitest';
import { composeAlertMail, plantTime, withUnit, type AlertForMail, type AlertMailInput } from '../alert-mail-text.js';

const alert: AlertForMail = {
  id: '0b6d1f0e-3c1a-4d2e-8f9a-123456789abc',
  number: 42,
  loopTag: 'AER-DO-101',
  loopName: 'Basin 1 dissolved oxygen',
  areaName: 'Aeration',
  timeZone: 'Europe/London',
  ruleKind: 'band',
  ruleVersion: 3,
  priority: 2,
  raisedAt: new Date('2026-07-01T10:15:30Z'),
  activations: 1,
  summary: 'DO residual stayed above its band for 5 samples.',
  detail: {
    statistic: '|residual| / limit',
    value: 2.1234,
    limit: 1,
    signals: [{ name: 'DO', unit: 'mg/L', measured: 1.2, predicted: 2.05, residual: -0.85, limit: 0.4 }],
  },
  hint: 'DO drifts alone: look at its transmitter first.',
};

const input = (over: Partial<AlertMailInput> = {}): AlertMailInput => ({
  reason: 'raised',
  alert,
  audienceNote: null,
  alertUrl: `https://shadowloop.example/alerts/${alert.id}`,
  ack: { url: 'https://shadowloop.example/a/abc.def', expiresAt: new Date('2026-07-01T14:15:30Z') },
  now: new Date('2026-07-01T10:16:00Z'),
  ...over,
});

describe('alert e-mail text', () => {
  it('names priority, loop, what happened and the rule in the subject', () => {
    expect(composeAlertMail(input()).subject).toBe('[Shadowloop P2] AER-DO-101 diverged — band rule');
    expect(composeAlertMail(input({ reason: 'escalated_secondary' })).subject).toBe(
      '[Shadowloop P2] Escalated: AER-DO-101 diverged — band rule',
    );
    const stale = { ...alert, ruleKind: 'stale' as const, priority: 1 };
    expect(composeAlertMail(input({ alert: stale })).subject).toBe(
      '[Shadowloop P1] AER-DO-101 has no fresh readings — stale rule',
    );
  });

  it('gives loop, area, rule, time in UTC and plant time, values with units, the hint and both links', () => {
    const { text } = composeAlertMail(input());
    expect(text).toContain('AER-DO-101 — Basin 1 dissolved oxygen');
    expect(text).toContain('Area:     Aeration');
    expect(text).toContain('band rule (version 3), priority 2');
    // 10:15 UTC on 1 July is 11:15 British Summer Time (UTC+1).
    expect(text).toContain('2026-07-01 10:15 UTC (2026-07-01 11:15 Europe/London, plant time)');
    expect(text).toContain('DO: measured 1.2 mg/L, predicted 2.05 mg/L, residual -0.85 mg/L, limit 0.4 mg/L');
    expect(text).toContain('|residual| / limit: 2.123 (limit 1)');
    expect(text).toContain('DO drifts alone: look at its transmitter first.');
    expect(text).toContain(`https://shadowloop.example/alerts/${alert.id}`);
    expect(text).toContain('https://shadowloop.example/a/abc.def');
    expect(text).toContain('The link expires at 2026-07-01 14:15 UTC.');
  });

  it('carries the cautions in every message', () => {
    for (const reason of [
      'raised',
      'reactivated',
      'shelve_expired',
      'escalated_secondary',
      'escalated_area',
    ] as const) {
      const { text } = composeAlertMail(input({ reason }));
      expect(text).toContain('advisory monitoring tool');
      expect(text).toContain('not a safety instrumented system');
      expect(text).toContain("only within the site's procedures");
    }
  });

  it('says why a person gets it and how long it waited when escalated', () => {
    const note = 'Nobody is on call for Aeration right now, so this goes to everyone who holds the on-call role.';
    expect(composeAlertMail(input({ audienceNote: note })).text).toContain(note);
    const late = input({ reason: 'escalated_area', now: new Date('2026-07-01T10:46:00Z') });
    expect(composeAlertMail(late).text).toContain('in 31 min; it comes to you as an engineer of Aeration');
  });

  it('offers no acknowledge link to people without the on-call role', () => {
    const { text } = composeAlertMail(input({ ack: null }));
    expect(text).not.toContain('/a/');
    expect(text).toContain('Acknowledging needs the on-call role');
  });

  it('leaves out signals and hint it does not have', () => {
    const bare = { ...alert, detail: {}, hint: null };
    const { text } = composeAlertMail(input({ alert: bare }));
    expect(text).not.toContain('Signals at the raise');
    expect(text).not.toContain('Where the residual points');
  });
});

describe('mail number and time helpers', () => {
  it('shows four significant figures with the unit, and a dash for nothing', () => {
    expect(withUnit(0.123456, 'mg/L')).toBe('0.1235 mg/L');
    expect(withUnit(12345.6, 'm³/h')).toBe('12350 m³/h');
    expect(withUnit(null, 'K')).toBe('—');
    expect(withUnit(Number.NaN, 'K')).toBe('—');
  });

  it('gives plant time in winter without summer time and refuses an unknown zone', () => {
    expect(plantTime(new Date('2026-12-02T10:15:00Z'), 'Europe/London')).toBe('2026-12-02 10:15 Europe/London');
    expect(plantTime(new Date('2026-12-02T10:15:00Z'), 'Nowhere/Special')).toBeNull();
  });
});
