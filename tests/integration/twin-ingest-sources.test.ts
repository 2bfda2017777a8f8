import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { CreatedIngestSourceSchema, IngestSource } from '../../api/src/contracts/ingest.js';
import type { Loop } from '../../api/src/contracts/registry.js';
import type { z } from 'zod';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { createLoop, ENGINEER, signedIn } from '../helpers/registry-fixtures.js';
import { tokenRequest, type SessionClient } from '../helpers/session-client.js';
import { openDb, postReadings, reading, slotMsAgo } from '../helpers/twin-fixtures.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let admin: SessionClient;
let engineer: SessionClient;
let scoped: Loop;
let other: Loop;
let source: z.infer<typeof CreatedIngestSourceSchema>;
const PLACEHOLDER = '00000000-0000-4000-8000-000000000000';

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  [admin, engineer] = await Promise.all(['admin@quillmere.example', ENGINEER].map((email) => signedIn(api.url, email)));
  [scoped, other] = [await createLoop(engineer), await createLoop(engineer)];
  const created = await admin.request<typeof source>(
    'POST',
    '/api/v1/ingest-sources',
    { name: `bridge ${scoped.tag}`, description: 'historian bridge', loopIds: [scoped.id] },
    { csrf: true },
  );
  expect(created.status).toBe(201);
  source = created.body;
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

const one = () => [reading(slotMsAgo(10), [1], [2])];

describe('ingest sources', () => {
  it('shows the token once, stores its hash, lists the source without it, and audits the creation', async () => {
    expect(source.token).toMatch(/^sli_/);
    expect(source.token.startsWith(source.prefix)).toBe(true);
    expect(source.loops).toEqual([{ id: scoped.id, tag: scoped.tag }]);
    const row = await db('ingest_sources').where({ id: source.id }).first();
    expect(row.token_hash).toBe(createHash('sha256').update(source.token).digest('hex'));
    const listed = await admin.request<IngestSource[]>('GET', '/api/v1/ingest-sources');
    const mine = listed.body.find((s) => s.id === source.id);
    expect(mine).toMatchObject({ name: source.name, lastUsedAt: null, revokedAt: null });
    expect(mine).not.toHaveProperty('token');
    expect(await db('audit_log').where({ action: 'ingest_source.created', target_id: source.id }).first()).toBeTruthy();
    expect((await engineer.request('GET', '/api/v1/ingest-sources')).status).toBe(403);
  });

  it('refuses unknown loops and a taken name', async () => {
    const unknown = await admin.request(
      'POST',
      '/api/v1/ingest-sources',
      { name: 'another', loopIds: [PLACEHOLDER] },
      { csrf: true },
    );
    expect(unknown.status).toBe(400);
    expect(
      (await admin.request('POST', '/api/v1/ingest-sources', { name: source.name, loopIds: [] }, { csrf: true }))
        .status,
    ).toBe(409);
  });

  it('lets the token post readings for its loops only, and records its use', async () => {
    const accepted = await postReadings(api.url, source.token, scoped.id, one());
    expect(accepted.status).toBe(200);
    expect(accepted.body.accepted).toBe(1);
    expect((await db('readings').where({ loop_id: scoped.id }).first()).source_id).toBe(source.id);
    const elsewhere = await postReadings(api.url, source.token, other.id, one());
    expect(elsewhere.status).toBe(403);
    expect((elsewhere.body as unknown as { error: { message: string } }).error.message).toContain(
      'not allowed to post readings for this loop',
    );
    expect((await db('ingest_sources').where({ id: source.id }).first()).last_used_at).not.toBeNull();
  });

  it('reads and records a fresh token once for a burst of posts that all present it', async () => {
    const burst = await admin.request<typeof source>(
      'POST',
      '/api/v1/ingest-sources',
      { name: `burst bridge ${scoped.tag}`, description: 'many posts at once', loopIds: [scoped.id] },
      { csrf: true },
    );
    const lookups: string[] = [];
    const listen = (query: { sql: string }) => {
      if (/from "ingest_sources" where "token_hash"/.test(query.sql)) lookups.push(query.sql);
    };
    api.db.on('query', listen);
    try {
      const posts = Array.from({ length: 8 }, (_, i) =>
        postReadings(api.url, burst.body.token, scoped.id, [reading(slotMsAgo(200 + i), [1], [2])]),
      );
      expect((await Promise.all(posts)).map((r) => r.status)).toEqual(new Array(8).fill(200));
    } finally {
      api.db.off('query', listen);
    }
    expect(lookups).toHaveLength(1);
  });

  it('refuses an ingest token on every other route (403), whatever its method', async () => {
    const doc = (await (await fetch(`${api.url}/api/v1/openapi.json`)).json()) as {
      paths: Record<string, Record<string, { 'x-roles': unknown; 'x-ingest'?: boolean }>>;
    };
    let checked = 0;
    for (const [path, operations] of Object.entries(doc.paths)) {
      for (const [method, op] of Object.entries(operations)) {
        if (op['x-roles'] === 'public') continue;
        const concrete = path.replace('{loopId}', scoped.id).replace(/\{[^}]+\}/g, PLACEHOLDER);
        const response = await tokenRequest(
          api.url,
          source.token,
          method.toUpperCase(),
          concrete,
          method === 'get' ? undefined : {},
        );
        const label = `${method.toUpperCase()} ${path} → ${response.status}`;
        if (op['x-ingest']) expect([401, 403], label).not.toContain(response.status);
        else expect(response.status, label).toBe(403);
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(20);
  });

  it('queues two edits of the same source instead of failing one', async () => {
    const edit = (loopIds: string[]) =>
      admin.request('PUT', `/api/v1/ingest-sources/${source.id}/loops`, { loopIds }, { csrf: true });
    const statuses = (await Promise.all([edit([scoped.id, other.id]), edit([scoped.id])])).map((r) => r.status);
    expect(statuses).toEqual([200, 200]);
    const rows = await db('ingest_source_loops').where({ source_id: source.id }).pluck('loop_id');
    expect([[scoped.id], [scoped.id, other.id].sort()]).toContainEqual(rows.sort());
  });

  it('follows a change of loops and stops working once revoked', async () => {
    const changed = await admin.request<IngestSource>(
      'PUT',
      `/api/v1/ingest-sources/${source.id}/loops`,
      { loopIds: [scoped.id, other.id] },
      { csrf: true },
    );
    expect(changed.body.loops.map((l) => l.id).sort()).toEqual([scoped.id, other.id].sort());
    expect((await postReadings(api.url, source.token, other.id, one())).status).toBe(200);
    expect(
      (await admin.request('DELETE', `/api/v1/ingest-sources/${source.id}`, undefined, { csrf: true })).status,
    ).toBe(204);
    const revoked = await postReadings(api.url, source.token, scoped.id, one());
    expect(revoked.status).toBe(401);
    const afterRevoke = await admin.request<{ error: { code: string } }>(
      'PUT',
      `/api/v1/ingest-sources/${source.id}/loops`,
      { loopIds: [scoped.id] },
      { csrf: true },
    );
    expect(afterRevoke.status).toBe(409);
    const actions = await db('audit_log').where({ target_id: source.id }).pluck('action');
    expect(actions).toEqual(
      expect.arrayContaining(['ingest_source.created', 'ingest_source.loops_changed', 'ingest_source.revoked']),
    );
  });
});
