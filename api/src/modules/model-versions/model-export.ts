import Papa from 'papaparse';
import type { Matrix } from '@shadowloop/simulator/engine';
import type { Loop, Signal } from '../../contracts/registry.js';
import { toPublicVersion, type VersionRecord } from './model-versions.repository.js';

export interface ExportFile {
  filename: string;
  contentType: string;
  content: string;
}

const label = (signal: Signal) => (signal.unit ? `${signal.name} [${signal.unit}]` : signal.name);

/**
 * JSON: the matrices at the top level, so the file can be uploaded again as a new draft, and the
 * rest of the version under "about" (which uploads ignore).
 */
function asJson(loop: Loop, version: VersionRecord): string {
  const { A, B, C, D, ...rest } = toPublicVersion(version);
  const about = {
    ...rest,
    analysis: undefined,
    loop: {
      id: loop.id,
      tag: loop.tag,
      name: loop.name,
      samplePeriodS: version.samplePeriodS,
      inputs: loop.inputs,
      states: loop.states,
      outputs: loop.outputs,
      operatingPoint: loop.operatingPoint,
    },
  };
  return `${JSON.stringify({ A, B, ...(C ? { C } : {}), ...(D ? { D } : {}), about }, null, 2)}\n`;
}

/** CSV: one block per matrix, its header line naming the matrix and the columns, each row named. */
function asCsv(loop: Loop, version: VersionRecord): string {
  const outputs = version.C ? loop.outputs : loop.states;
  const blocks: [string, Matrix | null | undefined, Signal[], Signal[]][] = [
    ['A', version.A, loop.states, loop.states],
    ['B', version.B, loop.states, loop.inputs],
    ['C', version.C, outputs, loop.states],
    ['D', version.D, outputs, loop.inputs],
    ['Ac', version.continuous?.Ac, loop.states, loop.states],
    ['Bc', version.continuous?.Bc, loop.states, loop.inputs],
    ['K', version.correction.K, loop.states, outputs],
  ];
  return (
    blocks
      .filter((block): block is [string, Matrix, Signal[], Signal[]] => Boolean(block[1]))
      .map(([name, M, rows, columns]) =>
        Papa.unparse([[name, ...columns.map(label)], ...M.map((row, i) => [label(rows[i]), ...row])]),
      )
      .join('\r\n\r\n') + '\r\n'
  );
}

export function exportVersion(loop: Loop, version: VersionRecord, format: 'json' | 'csv'): ExportFile {
  const base = `${loop.tag}-v${version.number}`;
  return format === 'json'
    ? { filename: `${base}.json`, contentType: 'application/json', content: asJson(loop, version) }
    : { filename: `${base}.csv`, contentType: 'text/csv', content: asCsv(loop, version) };
}
