import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { AlertLoad } from '../../../contracts/alerts.js';
import { alertLoadCsv, alertLoadFilename } from '../alert-load-csv.js';

const load: AlertLoad = {
  from: '2025-03-01T00:00:00.000Z',
  to: '2025-03-02T00:00:00.000Z',
  targets: { perDay: 144, per10Min: 1, floodPer10Min: 10 },
  perDay: [{ day: '2025-03-01', count: 12 }],
  per10Min: [
    { start: '2025-03-01T01:00:00.000Z', count: 11 },
    { start: '2025-03-01T05:00:00.000Z', count: 1 },
  ],
  windowsOverTargetPercent: 100 / 144,
  floods: [{ start: '2025-03-01T01:00:00.000Z', end: '2025-03-01T01:10:00.000Z', count: 11 }],
  chattering: [
    { alertId: '00000000-0000-4000-8000-000000000001', loopTag: '=HYPERLINK("x")', rule: 'band', repeats: 2 },
  ],
  stale: [],
  topLoops: [{ loopId: '00000000-0000-4000-8000-000000000002', loopTag: 'AER-1', loopName: 'Basin, north', count: 12 }],
  meanTimeToAcknowledgeS: 90,
  acknowledgedAlerts: 2,
  windowCount: 144,
  staleAsOf: '2025-03-02T00:00:00.000Z',
  total: 12,
};

const blocks = (csv: string) =>
  csv
    .trimEnd()
    .split('\r\n\r\n')
    .map((b) => Papa.parse<string[]>(b).data);

describe('alertLoadCsv', () => {
  it('writes one block per table, each with a header row and the section name in its first column', () => {
    const parsed = blocks(alertLoadCsv(load));
    expect(parsed.map((b) => b[0][0])).toEqual(Array(7).fill('section'));
    const names = parsed.map((b) => [...new Set(b.slice(1).map((row) => row[0]))]);
    expect(names).toEqual([['summary'], ['per day'], ['per 10 min'], ['floods'], ['chattering'], [], ['top loops']]);
    expect(parsed[1]).toEqual([
      ['section', 'day (UTC)', 'activations'],
      ['per day', '2025-03-01', '12'],
    ]);
    expect(parsed[3]).toEqual([
      ['section', 'start', 'end', 'activations'],
      ['floods', '2025-03-01T01:00:00.000Z', '2025-03-01T01:10:00.000Z', '11'],
    ]);
    expect(parsed[5]).toEqual([['section', 'alert id', 'loop tag', 'rule', 'active since', 'hours']]);
    expect(parsed[6][1]).toEqual(['top loops', load.topLoops[0].loopId, 'AER-1', 'Basin, north', '12']);
    expect(parsed[0]).toContainEqual(['summary', 'mean time to acknowledge (s)', '90']);
  });

  it('escapes a cell that a spreadsheet would run as a formula', () => {
    expect(blocks(alertLoadCsv(load))[4][1][2]).toBe(`'=HYPERLINK("x")`);
  });

  it('names the file after the period', () => {
    expect(alertLoadFilename(load)).toBe('alert-load-20250301T0000Z-20250302T0000Z.csv');
  });
});
