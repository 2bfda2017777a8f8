import { describe, expect, it } from 'vitest';
import { applyPastedBlock, emptyGrid, readGrid } from './matrix-cells';
import { parseCellNumber } from '../../../lib/parse-number';
import { detectSeparator, parsePastedText } from './parse-paste';

describe('parseCellNumber', () => {
  it.each([
    ['0.982', 0.982],
    [' -1.5e-3 ', -0.0015],
    ['−0.2', -0.2],
    ['1 234.5', 1234.5],
    ['1\u00a0234,5', 1234.5],
    ['0,982', 0.982],
    ['1.234,5', 1234.5],
    ['1,234.5', 1234.5],
    ['1,234,567', 1234567],
    ['"0,5"', 0.5],
    ['.5', 0.5],
  ])('reads %j as %d', (text, expected) => {
    expect(parseCellNumber(text)).toBeCloseTo(expected, 12);
  });

  it('returns null for an empty cell and undefined for text', () => {
    expect(parseCellNumber('  ')).toBeNull();
    for (const text of ['abc', '1.2.3x', 'NaN', 'Infinity', '0x10', '1e', '--1', '1, 2', '1 2', '1,2,3', '12 34']) {
      expect(parseCellNumber(text)).toBeUndefined();
    }
  });

  it('refuses a decimal comma where the comma separates cells', () => {
    expect(parseCellNumber('0,5', false)).toBeUndefined();
  });
});

describe('parsePastedText', () => {
  it('reads a block copied from a spreadsheet, with its trailing line break', () => {
    const block = parsePastedText('0.9\t0.1\t0\r\n0\t0.8\t0.05\r\n0\t0\t0.95\r\n');
    expect(block.separator).toBe('tab');
    expect(block.values).toEqual([
      [0.9, 0.1, 0],
      [0, 0.8, 0.05],
      [0, 0, 0.95],
    ]);
    expect(block.problems).toEqual([]);
  });

  it('reads decimal commas in tab- and semicolon-separated text', () => {
    expect(parsePastedText('0,9\t0,1\n0\t0,8').values).toEqual([
      [0.9, 0.1],
      [0, 0.8],
    ]);
    expect(parsePastedText('0,9;0,1\n0;0,8').values).toEqual([
      [0.9, 0.1],
      [0, 0.8],
    ]);
  });

  it('splits comma-separated and space-separated text', () => {
    expect(detectSeparator('1, 2\n3, 4')).toBe('comma');
    expect(parsePastedText('1, 2\n3, 4').values).toEqual([
      [1, 2],
      [3, 4],
    ]);
    expect(parsePastedText('  0.9   0.1\n 0  0.8 ').values).toEqual([
      [0.9, 0.1],
      [0, 0.8],
    ]);
  });

  it('keeps ragged rows and empty cells as gaps, and reports every cell that is not a number', () => {
    const block = parsePastedText('1\t\t3\n4\n7\tx\t9\ty');
    expect(block.values).toEqual([[1, null, 3], [4], [7, null, 9, null]]);
    expect(block.width).toBe(4);
    expect(block.problems.map((p) => p.message)).toEqual([
      'row 3, column 2: “x” is not a number',
      'row 3, column 4: “y” is not a number',
    ]);
  });
});

describe('applyPastedBlock', () => {
  it('writes from the focused cell, leaves gaps alone and counts what falls outside', () => {
    const grid = [
      ['1', '2', '3'],
      ['4', '5', '6'],
    ];
    const result = applyPastedBlock(grid, parsePastedText('7\t\t9\n10\t11'), { row: 0, column: 1 });
    expect(result.grid).toEqual([
      ['1', '7', '3'],
      ['4', '10', '11'],
    ]);
    expect(result.written).toBe(3);
    expect(result.clipped).toBe(1);
  });

  it('reads a filled grid back as numbers and names the empty and wrong cells', () => {
    expect(readGrid([['0,5', '1e-3']])).toEqual({ matrix: [[0.5, 0.001]] });
    expect(readGrid(emptyGrid(1, 2).map(() => ['', 'abc']))).toEqual({
      problems: [
        { row: 0, column: 0, message: 'empty' },
        { row: 0, column: 1, message: '“abc” is not a number' },
      ],
    });
  });
});
