import Papa from 'papaparse';
import type { AlertLoad } from '../../contracts/alerts.js';

type Cell = string | number | null;
type Section = { name: string; columns: string[]; rows: Cell[][] };

function sections(load: AlertLoad): Section[] {
  return [
    {
      name: 'summary',
      columns: ['figure', 'value'],
      rows: [
        ['from', load.from],
        ['to', load.to],
        ['activations', load.total],
        ['target per day', load.targets.perDay],
        ['target per 10 min', load.targets.per10Min],
        ['flood above per 10 min', load.targets.floodPer10Min],
        ['10-minute windows', load.windowCount],
        ['windows over target (%)', load.windowsOverTargetPercent],
        ['mean time to acknowledge (s)', load.meanTimeToAcknowledgeS],
        ['acknowledged alerts', load.acknowledgedAlerts],
        ['stale as of', load.staleAsOf],
      ],
    },
    { name: 'per day', columns: ['day (UTC)', 'activations'], rows: load.perDay.map((d) => [d.day, d.count]) },
    {
      name: 'per 10 min',
      columns: ['window start', 'activations'],
      rows: load.per10Min.map((w) => [w.start, w.count]),
    },
    {
      name: 'floods',
      columns: ['start', 'end', 'activations'],
      rows: load.floods.map((f) => [f.start, f.end, f.count]),
    },
    {
      name: 'chattering',
      columns: ['alert id', 'loop tag', 'rule', 'repeats'],
      rows: load.chattering.map((c) => [c.alertId, c.loopTag, c.rule, c.repeats]),
    },
    {
      name: 'stale',
      columns: ['alert id', 'loop tag', 'rule', 'active since', 'hours'],
      rows: load.stale.map((s) => [s.alertId, s.loopTag, s.rule, s.raisedAt, s.hours]),
    },
    {
      name: 'top loops',
      columns: ['loop id', 'loop tag', 'loop name', 'activations'],
      rows: load.topLoops.map((l) => [l.loopId, l.loopTag, l.loopName, l.count]),
    },
  ];
}

/**
 * The report as CSV: one block per table, blank line between blocks. Every block has its own
 * header row whose first column is "section", and every row repeats the section's name, so a
 * spreadsheet can filter the blocks apart. Cells that start like a formula are escaped.
 */
export function alertLoadCsv(load: AlertLoad): string {
  const blocks = sections(load).map((s) =>
    Papa.unparse([['section', ...s.columns], ...s.rows.map((row) => [s.name, ...row])], { escapeFormulae: true }),
  );
  return `${blocks.join('\r\n\r\n')}\r\n`;
}

/** e.g. alert-load-20250301T0000Z-20250303T0000Z.csv */
export function alertLoadFilename(load: AlertLoad): string {
  const stamp = (iso: string) => `${iso.slice(0, 16).replace(/[-:]/g, '')}Z`;
  return `alert-load-${stamp(load.from)}-${stamp(load.to)}.csv`;
}
