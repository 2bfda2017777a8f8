import { pipeline } from 'node:stream/promises';
import Papa from 'papaparse';
import { INGEST_LIMITS, type ImportMapping } from '../../contracts/ingest.js';
import { badRequest } from '../../http/errors.js';
import type { CheckedReading, ReadingRules } from '../readings/reading-checks.js';
import { checkRow, planColumns, type ColumnPlan } from './csv-rows.js';
import type { IncomingCsv } from './csv-upload.js';

/**
 * The checks of an uploaded file's rows: those of a posted reading, but any age is fine (history is
 * what a file brings) while the future is refused beyond the tolerance.
 */
export function importRules(
  loop: { inputs: number; outputs: number; samplePeriodS: number },
  futureToleranceS: number,
): ReadingRules {
  return {
    inputs: loop.inputs,
    outputs: loop.outputs,
    samplePeriodS: loop.samplePeriodS,
    latestMs: Date.now() + futureToleranceS * 1000,
    earliestMs: -Infinity,
    tooOldAdvice: '',
  };
}

/** What reading a CSV counts: rows read, rows rejected and the first rejected rows with their line. */
export interface RowTally {
  rowsRead: number;
  rejected: number;
  badRows: { line: number; reason: string }[];
}

/**
 * Reads an uploaded CSV row by row (papaparse on the upload stream): the header gives the column
 * plan, each data row is checked like a posted reading, the good ones go to `add` with their line
 * (the header is line 1) and the bad ones are counted in the tally. Blank lines are skipped.
 */
export async function readCheckedRows(
  csv: IncomingCsv,
  mapping: ImportMapping,
  rules: ReadingRules,
  tally: RowTally,
  add: (line: number, reading: CheckedReading) => Promise<void>,
): Promise<void> {
  let plan: ColumnPlan | undefined;
  let line = 0;
  await pipeline(csv.stream, Papa.parse(Papa.NODE_STREAM_INPUT, {}), async (rows: AsyncIterable<string[]>) => {
    for await (const row of rows) {
      line += 1;
      if (!plan)
        plan = planColumns(
          row.map((cell, i) => (i === 0 ? cell.replace(/^\uFEFF/, '') : cell)),
          mapping,
          rules,
        );
      else if (row.length > 1 || row[0].trim() !== '') {
        tally.rowsRead += 1;
        const check = checkRow(row, plan, rules);
        if (check.ok) await add(line, check.reading);
        else if (++tally.rejected <= INGEST_LIMITS.reportedBadRows) tally.badRows.push({ line, reason: check.reason });
      }
    }
  });
  if (!plan) throw badRequest('The file is empty: the first line must name the columns.');
}
