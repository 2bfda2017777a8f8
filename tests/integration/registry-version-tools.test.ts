import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { transitionMatrix } from '@shadowloop/simulator/engine';
import type { ExploreResult, Loop, ModelVersion, UploadedModel } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  createDraft,
  createLoop,
  ENGINEER,
  OPERATOR,
  signedIn,
  STABLE_MODEL,
  upload,
  type ErrorResponse,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;
let operator: SessionClient;
let loop: Loop;
let version: ModelVersion;

beforeAll(async () => {
  api = await startApi(stack);
  [engineer, operator] = await Promise.all([ENGINEER, OPERATOR].map((email) => signedIn(api.url, email)));
  loop = await createLoop(engineer);
  version = await createDraft(engineer, loop.id, {
    A: [
      [0.9, 0.2],
      [-0.2, 0.9],
    ],
  });
});
afterAll(async () => {
  await api.close();
});

const explore = (id: string, body: Record<string, unknown>) =>
  operator.request<ExploreResult & ErrorResponse>('POST', `/api/v1/model-versions/${id}/explore`, body, { csrf: true });

describe('state transition explorer (anyone signed in)', () => {
  it('returns A^k, the free response from x0 and its modes, which add up to the free response', async () => {
    const response = await explore(version.id, { k: 7, x0: [1, -0.5], steps: 30 });
    expect(response.status).toBe(200);
    const { Ak, trajectory, modal, modalError } = response.body;
    transitionMatrix(version.A, 7).forEach((row, i) => row.forEach((v, j) => expect(Ak[i][j]).toBeCloseTo(v, 12)));
    expect(trajectory).toHaveLength(31);
    expect(trajectory[0]).toEqual([1, -0.5]);
    const x7 = transitionMatrix(version.A, 7).map((row) => row[0] * 1 + row[1] * -0.5);
    x7.forEach((v, i) => expect(trajectory[7][i]).toBeCloseTo(v, 12));
    expect(modalError).toBeNull();
    expect(modal).toHaveLength(1);
    expect(modal?.[0]).toMatchObject({
      conjugatePair: true,
      eigenvalue: { re: expect.closeTo(0.9, 12), im: expect.closeTo(0.2, 12) },
    });
    const summed = (k: number) =>
      [0, 1].map((i) => (modal ?? []).reduce((sum, mode) => sum + mode.contribution[k][i], 0));
    for (const k of [0, 7, 30]) summed(k).forEach((v, i) => expect(v).toBeCloseTo(trajectory[k][i], 12));
  });

  it("gives no mode split for a defective A, with the engine's reason", async () => {
    const defective = await createDraft(engineer, loop.id, {
      A: [
        [0.5, 1],
        [0, 0.5],
      ],
    });
    const response = await explore(defective.id, { k: 2, x0: [0, 1], steps: 5 });
    expect(response.status).toBe(200);
    expect(response.body.modal).toBeNull();
    expect(response.body.modalError).toMatch(/defective/);
    expect(response.body.trajectory[2]).toEqual([0.5 * 1 + 1 * 0.5, 0.25]);
  });

  it('leaves out a mode split too large to send and says how many steps would fit', async () => {
    const wideLoop = await createLoop(engineer, {
      states: Array.from({ length: 30 }, (_, i) => ({ name: `x${i + 1}`, unit: '' })),
    });
    const A = Array.from({ length: 30 }, (_, i) => Array.from({ length: 30 }, (_, j) => (i === j ? 0.5 + i / 100 : 0)));
    const wide = await createDraft(engineer, wideLoop.id, { A, B: A.map(() => [1]), C: [A[0]] });
    const response = await explore(wide.id, { k: 1, x0: A[0], steps: 2000 });
    expect(response.body).toMatchObject({
      modal: null,
      modalError: 'the split into modes of 30 states over 2000 steps is too large to send; choose at most 554 steps',
    });
    expect((await explore(wide.id, { k: 1, x0: A[0], steps: 554 })).body.modal).toHaveLength(30);
  });

  it('refuses an x0 of the wrong length and k or steps out of range', async () => {
    expect((await explore(version.id, { k: 1, x0: [1], steps: 5 })).status).toBe(400);
    expect((await explore(version.id, { k: 100_001, x0: [1, 0], steps: 5 })).status).toBe(400);
    expect((await explore(version.id, { k: 1, x0: [1, 0], steps: 2001 })).status).toBe(400);
  });
});

describe('export', () => {
  it('downloads JSON as an attachment that uploads again unchanged', async () => {
    const response = await operator.raw(`${api.url}/api/v1/model-versions/${version.id}/export?format=json`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-disposition')).toMatch(
      new RegExp(`^attachment; filename="?${loop.tag}-v${version.number}\\.json"?$`),
    );
    const text = await response.text();
    expect(JSON.parse(text)).toMatchObject({
      A: version.A,
      B: version.B,
      C: version.C,
      about: { number: version.number, loop: { tag: loop.tag } },
    });
    const again = await upload<UploadedModel>(engineer, `/api/v1/loops/${loop.id}/model-uploads`, [
      { name: 'exported.json', content: text },
    ]);
    expect(again.status).toBe(200);
    expect(again.body).toEqual({ source: 'discrete', A: version.A, B: version.B, C: version.C });
  });

  it('downloads CSV with one labelled block per matrix', async () => {
    const response = await operator.raw(`${api.url}/api/v1/model-versions/${version.id}/export?format=csv`);
    expect(response.headers.get('content-type')).toMatch(/^text\/csv/);
    const blocks = (await response.text()).trim().split(/\r\n\r\n/);
    expect(blocks.map((block) => block.split('\r\n')[0])).toEqual([
      'A,Level [m],Flow [m³/h]',
      'B,Valve [%]',
      'C,Level [m],Flow [m³/h]',
    ]);
    expect(blocks[0].split('\r\n')[1]).toBe('Level [m],0.9,0.2');
  });

  it('refuses an unknown format and answers 404 for an unknown version', async () => {
    expect((await operator.request('GET', `/api/v1/model-versions/${version.id}/export?format=xlsx`)).status).toBe(400);
    expect(
      (await operator.request('GET', '/api/v1/model-versions/00000000-0000-4000-8000-000000000000/export')).status,
    ).toBe(404);
  });
});

describe('the stored model stays as it was', () => {
  it('offers no route that edits a version', async () => {
    for (const method of ['PUT', 'PATCH']) {
      const response = await engineer.request(
        method,
        `/api/v1/model-versions/${version.id}`,
        { ...STABLE_MODEL },
        { csrf: true },
      );
      expect(response.status).toBe(404);
    }
  });
});
