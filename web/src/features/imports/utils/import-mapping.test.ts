import { describe, expect, it } from 'vitest';
import { estimateRows } from './import-estimate';
import { initialMapping, toImportMapping, validateMapping } from './import-mapping';

const LOOP = {
  inputs: [{ name: 'Inlet pump flow', unit: 'm³/h' }],
  outputs: [
    { name: 'Tank 1 level', unit: 'm' },
    { name: 'Tank 2 level', unit: 'm' },
  ],
};
const HEADER = ['time', 'Inlet pump flow', 'Tank 1 level', 'Tank 2 level'];

describe('the column mapping form', () => {
  it('starts from the server’s suggestion, by name or position', () => {
    const preview = {
      header: HEADER,
      rows: [],
      suggestedMapping: { t: 'time', u: [1], y: ['Tank 1 level', 'Tank 2 level'] },
    };
    expect(initialMapping(preview, LOOP)).toEqual({ t: '0', u: ['1'], y: ['2', '3'] });
    expect(initialMapping({ ...preview, suggestedMapping: null }, LOOP)).toEqual({ t: '', u: [''], y: ['', ''] });
  });

  it('asks for every column and refuses one column for two fields, naming both', () => {
    const problems = validateMapping({ t: '0', u: [''], y: ['2', '2'] }, HEADER, LOOP);
    expect(problems).toEqual({
      'u.0': 'Choose the column that holds Inlet pump flow.',
      'y.1': 'Column “Tank 1 level” is already used for Tank 1 level; choose another.',
    });
    expect(validateMapping({ t: '0', u: ['1'], y: ['2', '3'] }, HEADER, LOOP)).toEqual({});
  });

  it('sends zero-based positions to the import', () => {
    expect(toImportMapping({ t: '0', u: ['1'], y: ['3', '2'] })).toEqual({ t: 0, u: [1], y: [3, 2] });
  });

  it('estimates the rows of a file from the preview’s row length', () => {
    const rows = [['2025-03-01T08:00:00Z', '10', '1.5', '2.5']];
    const line = rows[0].join(',').length + 1;
    expect(estimateRows(HEADER.join(',').length + 1 + 1000 * line, HEADER, rows)).toBe(1000);
    expect(estimateRows(10, HEADER, rows, 50)).toBe(50);
  });
});
