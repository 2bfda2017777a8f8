import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Loop, UploadedModel, UploadProblem } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { createLoop, ENGINEER, OPERATOR, signedIn, upload, type ErrorResponse } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;
let loop: Loop;
let path: string;

beforeAll(async () => {
  api = await startApi(stack);
  engineer = await signedIn(api.url, ENGINEER);
  loop = await createLoop(engineer);
  path = `/api/v1/loops/${loop.id}/model-uploads`;
});
afterAll(async () => {
  await api.close();
});

type Files = { name: string; content: string }[];
const send = (files: Files) => upload<UploadedModel & ErrorResponse<UploadProblem[]>>(engineer, path, files);
const problemsOf = async (files: Files) => {
  const response = await send(files);
  expect(response.status).toBe(400);
  expect(response.body.error.code).toBe('invalid_upload');
  return response.body.error.details;
};

describe('reading an upload for the editor (nothing stored)', () => {
  it('reads one JSON document', async () => {
    const model = {
      A: [
        [0.9, 0.1],
        [0, 0.8],
      ],
      B: [[0], [1]],
      C: [[1, 0]],
    };
    const response = await send([{ name: 'model.json', content: JSON.stringify(model) }]);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ source: 'discrete', ...model });
  });

  it('reads one CSV per matrix, comma- or tab-separated, with a byte-order mark and blank trailing lines', async () => {
    const response = await send([
      { name: 'A.csv', content: '\uFEFF0.9,0.1\r\n0,0.8\r\n\r\n' },
      { name: 'B.csv', content: '0\n1.5e-1\n' },
      { name: 'C.csv', content: '1\t0\n' },
      { name: 'D.csv', content: '0' },
    ]);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      source: 'discrete',
      A: [
        [0.9, 0.1],
        [0, 0.8],
      ],
      B: [[0], [0.15]],
      C: [[1, 0]],
      D: [[0]],
    });
  });

  it('reads a continuous model from Ac.csv and Bc.csv', async () => {
    const response = await send([
      { name: 'Ac.csv', content: '-0.1,0\n0,-0.5' },
      { name: 'bc.CSV', content: '1\n0' },
      { name: 'C.csv', content: '1,0' },
    ]);
    expect(response.body).toEqual({
      source: 'continuous',
      Ac: [
        [-0.1, 0],
        [0, -0.5],
      ],
      Bc: [[1], [0]],
      C: [[1, 0]],
    });
  });
});

describe('upload problems: every one with its file, row and column', () => {
  it('non-number cells, ragged rows, unknown file names and a missing matrix', async () => {
    const details = await problemsOf([
      { name: 'A.csv', content: '0.9,0.1\nabc,0.8\n1,2,3' },
      { name: 'E.csv', content: '1' },
      { name: 'C.csv', content: '1,NaN' },
    ]);
    expect(details).toEqual(
      expect.arrayContaining([
        { file: 'A.csv', row: 2, column: 1, message: 'A: "abc" in row 2, column 1 is not a number' },
        { file: 'A.csv', row: 3, column: null, message: 'A: row 3 has 3 values, expected 2 as in the first row' },
        { file: 'C.csv', row: 1, column: 2, message: 'C: "NaN" in row 1, column 2 is not a number' },
        {
          file: 'E.csv',
          row: null,
          column: null,
          message: expect.stringMatching(/^unknown file name: name each CSV after its matrix/),
        },
        { file: null, row: null, column: null, message: expect.stringMatching(/^B is missing/) },
      ]),
    );
    expect(details).toHaveLength(5);
  });

  it('JSON cells that are strings or null, and unknown keys', async () => {
    const details = await problemsOf([
      {
        name: 'model.json',
        content: JSON.stringify({
          A: [
            [1, '2'],
            [null, 1],
          ],
          B: [[0], [1]],
          E: [[1]],
        }),
      },
    ]);
    expect(details.map(({ row, column }) => [row, column])).toEqual(
      expect.arrayContaining([
        [1, 2],
        [2, 1],
        [null, null],
      ]),
    );
    expect(details).toHaveLength(3);
  });

  it('JSON that does not parse, or JSON mixed with CSV', async () => {
    expect((await problemsOf([{ name: 'model.json', content: '{"A": [[1,' }]))[0].message).toMatch(/^not valid JSON/);
    expect(await problemsOf([{ name: 'model.json', content: '{"A": [[1, 2],\n  [3 4]]}' }])).toEqual([
      { file: 'model.json', row: 2, column: 6, message: expect.stringMatching(/^not valid JSON/) },
    ]);
    expect(
      (
        await problemsOf([
          { name: 'model.json', content: '{}' },
          { name: 'A.csv', content: '1' },
        ])
      )[0].message,
    ).toMatch(/either one JSON file/);
  });

  it('sizes against each other and against the loop, placed at the file', async () => {
    const details = await problemsOf([
      { name: 'A.csv', content: '0.5' },
      { name: 'B.csv', content: '1\n2' },
    ]);
    expect(details).toEqual(
      expect.arrayContaining([
        { file: 'B.csv', row: null, column: null, message: 'B has 2 rows, expected 1 (one per state)' },
        {
          file: 'A.csv',
          row: null,
          column: null,
          message: expect.stringMatching(new RegExp(`^A has 1 row, expected 2: loop ${loop.tag} has 2 states`)),
        },
      ]),
    );
  });

  it('refuses a file over 1 MB with 413, more than 6 files and a request without files with 400', async () => {
    const big = await send([{ name: 'A.csv', content: '0.5,'.repeat(300_000) }]);
    expect(big.status).toBe(413);
    const many = Array.from({ length: 7 }, (_, i) => ({ name: `A${i}.csv`, content: '1' }));
    expect((await send(many)).status).toBe(400);
    expect((await engineer.request('POST', path, {}, { csrf: true })).status).toBe(400);
  });

  it('is for engineers only, and 404 for an unknown loop', async () => {
    const operator = await signedIn(api.url, OPERATOR);
    expect((await upload(operator, path, [{ name: 'A.csv', content: '1' }])).status).toBe(403);
    expect(
      (
        await upload(engineer, '/api/v1/loops/00000000-0000-4000-8000-000000000000/model-uploads', [
          { name: 'A.csv', content: '1' },
        ])
      ).status,
    ).toBe(404);
  });
});
