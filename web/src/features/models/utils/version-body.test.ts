import { describe, expect, it } from 'vitest';
import { editorReducer, initialEditorState, type EditorState } from './editor-state';
import { buildVersionBody, previewRequest } from './version-body';

const dims = { states: 2, inputs: 1, outputs: 1 };

function filled(): EditorState {
  let state = initialEditorState(dims);
  state = editorReducer(state, {
    type: 'grid',
    name: 'A',
    grid: [
      ['0.9', '0.1'],
      ['0', '0,8'],
    ],
  });
  state = editorReducer(state, { type: 'grid', name: 'B', grid: [['0.5'], ['1']] });
  state = editorReducer(state, { type: 'grid', name: 'C', grid: [['1', '0']] });
  return editorReducer(state, { type: 'note', text: ' Refit after diffuser cleaning ' });
}

describe('the new-version editor', () => {
  it('requires C when the loop has fewer outputs than states', () => {
    expect(initialEditorState(dims).useC).toBe(true);
    expect(initialEditorState({ states: 2, inputs: 1, outputs: 2 }).useC).toBe(false);
  });

  it('builds the body of a sampled model with the correction it uses', () => {
    const state = editorReducer(filled(), { type: 'correction', mode: 'kalman' });
    expect(buildVersionBody(state, dims)).toEqual({
      body: {
        source: 'discrete',
        A: [
          [0.9, 0.1],
          [0, 0.8],
        ],
        B: [[0.5], [1]],
        C: [[1, 0]],
        correction: {
          mode: 'kalman',
          Q: [
            [0.01, 0],
            [0, 0.01],
          ],
          R: [[0.1]],
        },
        changeNote: 'Refit after diffuser cleaning',
      },
    });
  });

  it('sends Ac and Bc for a continuous model', () => {
    let state = editorReducer(filled(), { type: 'way', way: 'continuous' });
    state = editorReducer(state, {
      type: 'grid',
      name: 'Ac',
      grid: [
        ['-0.1', '0'],
        ['0', '-0.2'],
      ],
    });
    state = editorReducer(state, { type: 'grid', name: 'Bc', grid: [['1'], ['0']] });
    const result = buildVersionBody(state, dims);
    expect('body' in result && Object.keys(result.body)).toEqual([
      'source',
      'Ac',
      'Bc',
      'C',
      'correction',
      'changeNote',
    ]);
    expect(previewRequest(state, dims, 5)).toBeNull();
  });

  it('lists empty and unreadable cells per matrix and a missing change note', () => {
    let state = initialEditorState(dims);
    state = editorReducer(state, {
      type: 'grid',
      name: 'A',
      grid: [
        ['0.9', 'x'],
        ['', ''],
      ],
    });
    expect(buildVersionBody(state, dims)).toEqual({
      problems: [
        { grid: 'A', message: 'A: 2 cells empty; row 1, column 2: “x” is not a number.' },
        { grid: 'B', message: 'B: 2 cells empty.' },
        { grid: 'C', message: 'C: 2 cells empty.' },
        { grid: 'changeNote', message: 'Say what changed and why in the change note.' },
      ],
    });
  });

  it('fills the editor from an upload and switches to the way it came in', () => {
    const state = editorReducer(initialEditorState(dims), {
      type: 'uploaded',
      model: {
        source: 'continuous',
        Ac: [
          [-1, 0],
          [0, -2],
        ],
        Bc: [[1], [0]],
        D: [[0]],
      },
    });
    expect(state.way).toBe('continuous');
    expect(state.grids.Ac).toEqual([
      ['-1', '0'],
      ['0', '-2'],
    ]);
    expect(state.useD).toBe(true);
  });

  it('previews only complete sampled matrices', () => {
    expect(previewRequest(initialEditorState(dims), dims, 5)).toBeNull();
    expect(previewRequest(filled(), dims, 5)).toEqual({
      A: [
        [0.9, 0.1],
        [0, 0.8],
      ],
      B: [[0.5], [1]],
      C: [[1, 0]],
      D: undefined,
      samplePeriodS: 5,
      stepSamples: 100,
    });
  });
});
