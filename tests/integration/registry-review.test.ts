import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  act,
  approvedVersion,
  createDraft,
  createLoop,
  ENGINEER,
  OPERATOR,
  REVIEWER,
  signedIn,
  type ErrorResponse,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let engineer: SessionClient;
let reviewer: SessionClient;
let operator: SessionClient;

beforeAll(async () => {
  api = await startApi(stack);
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 2 } });
  [engineer, reviewer, operator] = await Promise.all(
    [ENGINEER, REVIEWER, OPERATOR].map((email) => signedIn(api.url, email)),
  );
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

type Answer = ModelVersion & ErrorResponse;
const loopOf = async (id: string) => (await operator.request<Loop>('GET', `/api/v1/loops/${id}`)).body;

describe('the review flow', () => {
  it('draft → in review → approved by a second engineer → active, and the loop shows it', async () => {
    const loop = await createLoop(engineer);
    const draft = await createDraft(engineer, loop.id);
    expect((await act(engineer, draft.id, 'submit')).body.status).toBe('in_review');
    const own = await act<Answer>(engineer, draft.id, 'approve');
    expect(own.status).toBe(403);
    expect(own.body.error.message).toMatch(
      /^Four-eyes rule: a model change is reviewed by a second engineer\. You wrote version 1 of/,
    );
    const approved = await act(reviewer, draft.id, 'approve', { note: 'Looks right' });
    expect(approved.body).toMatchObject({
      status: 'approved',
      reviewer: { email: REVIEWER },
      reviewNote: 'Looks right',
    });
    expect((await act<Answer>(reviewer, draft.id, 'activate', {})).status).toBe(400);
    const active = await act(engineer, draft.id, 'activate', { acknowledgeCautions: true });
    expect(active.body).toMatchObject({ status: 'active', activatedBy: { email: ENGINEER } });
    expect(await loopOf(loop.id)).toMatchObject({ activeVersionId: draft.id, activeVersionNumber: 1 });
  });

  it('retires the previous active version when the next one is activated', async () => {
    const loop = await createLoop(engineer);
    const first = await approvedVersion(engineer, reviewer, loop.id);
    await act(reviewer, first.id, 'activate', { acknowledgeCautions: true });
    const second = await approvedVersion(engineer, reviewer, loop.id);
    expect((await act(reviewer, second.id, 'activate', { acknowledgeCautions: true })).status).toBe(200);
    const versions = (await operator.request<ModelVersion[]>('GET', `/api/v1/loops/${loop.id}/model-versions`)).body;
    expect(versions.map((v) => [v.number, v.status])).toEqual([
      [2, 'active'],
      [1, 'retired'],
    ]);
    expect(versions[1].retiredAt).not.toBeNull();
  });

  it('rejects with a reason from a second engineer only', async () => {
    const loop = await createLoop(engineer);
    const draft = await createDraft(engineer, loop.id);
    await act(engineer, draft.id, 'submit');
    expect((await act(engineer, draft.id, 'reject', { reason: 'mine' })).status).toBe(403);
    expect((await act(reviewer, draft.id, 'reject', { reason: '  ' })).status).toBe(400);
    const rejected = await act(reviewer, draft.id, 'reject', { reason: 'The gain disagrees with the step test.' });
    expect(rejected.body).toMatchObject({
      status: 'rejected',
      rejectReason: 'The gain disagrees with the step test.',
      reviewer: { email: REVIEWER },
    });
    expect((await act(reviewer, draft.id, 'approve')).status).toBe(409);
  });

  it('needs a justification to submit an unstable or marginal model', async () => {
    const loop = await createLoop(engineer);
    for (const [A, stability] of [
      [
        [
          [1.05, 0],
          [0, 0.5],
        ],
        'unstable',
      ],
      [
        [
          [1, 0],
          [0, 0.5],
        ],
        'marginal',
      ],
    ] as const) {
      const draft = await createDraft(engineer, loop.id, { A });
      const refused = await act<Answer>(engineer, draft.id, 'submit');
      expect(refused.status).toBe(422);
      expect(refused.body.error).toMatchObject({
        code: 'justification_required',
        message: expect.stringContaining(stability),
      });
      const submitted = await act(engineer, draft.id, 'submit', {
        justification: 'The integrating tank level is real.',
      });
      expect(submitted.body).toMatchObject({
        status: 'in_review',
        justification: 'The integrating tank level is real.',
      });
    }
  });

  it('lets only the author submit, once; other steps answer 409 outside their status', async () => {
    const loop = await createLoop(engineer);
    const draft = await createDraft(engineer, loop.id);
    expect((await act(reviewer, draft.id, 'submit')).status).toBe(403);
    expect((await act(engineer, draft.id, 'approve')).status).toBe(409);
    expect((await act(engineer, draft.id, 'activate', { acknowledgeCautions: true })).status).toBe(409);
    expect((await act(engineer, draft.id, 'retire')).status).toBe(409);
    await act(engineer, draft.id, 'submit');
    const again = await act<Answer>(engineer, draft.id, 'submit');
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/is in review; only a version that is draft can be submitted/);
  });

  it('keeps submitted matrices as they were, down to the database', async () => {
    const loop = await createLoop(engineer);
    const version = await approvedVersion(engineer, reviewer, loop.id);
    await expect(
      db('model_versions')
        .where({ id: version.id })
        .update({
          a: JSON.stringify([
            [0, 0],
            [0, 0],
          ]),
        }),
    ).rejects.toThrow(/never change/);
    expect((await operator.request<ModelVersion>('GET', `/api/v1/model-versions/${version.id}`)).body.A).toEqual(
      version.A,
    );
  });

  it('retires an approved or the active version; the loop is then without a twin', async () => {
    const loop = await createLoop(engineer);
    const version = await approvedVersion(engineer, reviewer, loop.id);
    await act(reviewer, version.id, 'activate', { acknowledgeCautions: true });
    expect((await act(engineer, version.id, 'retire', { note: 'Valve replaced' })).body.status).toBe('retired');
    expect((await loopOf(loop.id)).activeVersionId).toBeNull();
  });

  it('is for engineers: operators are refused every step', async () => {
    for (const action of ['submit', 'approve', 'reject', 'activate', 'retire']) {
      expect(
        (
          await act(operator, '00000000-0000-4000-8000-000000000000', action, {
            reason: 'x',
            acknowledgeCautions: true,
          })
        ).status,
      ).toBe(403);
    }
  });
});

describe('one active version per loop', () => {
  it('lets exactly one of two concurrent activations win; the other gets 409 and the database stays consistent', async () => {
    const loop = await createLoop(engineer);
    const [first, second] = [
      await approvedVersion(engineer, reviewer, loop.id),
      await approvedVersion(engineer, reviewer, loop.id),
    ];
    const answers = await Promise.all(
      [first, second].map((v) => act<Answer>(reviewer, v.id, 'activate', { acknowledgeCautions: true })),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    expect(answers.find((a) => a.status === 409)?.body.error.message).toMatch(
      /was approved while no version was active, but version \d is active now/,
    );
    const active = await db('model_versions').where({ loop_id: loop.id, status: 'active' }).select('id');
    expect(active).toHaveLength(1);
    expect(active[0].id).toBe(answers.find((a) => a.status === 200)?.body.id);
  });

  it('refuses a second active row even when written directly', async () => {
    const loop = await createLoop(engineer);
    const [first, second] = [
      await approvedVersion(engineer, reviewer, loop.id),
      await approvedVersion(engineer, reviewer, loop.id),
    ];
    await db('model_versions').where({ id: first.id }).update({ status: 'active' });
    await expect(db('model_versions').where({ id: second.id }).update({ status: 'active' })).rejects.toThrow(
      /model_versions_one_active/,
    );
  });
});
