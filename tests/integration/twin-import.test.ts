import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { ImportPreview, ImportProgress } from '../../api/src/contracts/ingest.js';
import type { Loop } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { createLoop, ENGINEER, OPERATOR, signedIn } from '../helpers/registry-fixtures.js';
import type { ApiResponse, SessionClient } from '../helpers/session-client.js';
import { openDb } from '../helpers/twin-fixtures.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let engineer: SessionClient;
let loop: Loop;

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  engineer = await signedIn(api.url, ENGINEER);
  loop = await createLoop(engineer, {
    samplePeriodS: 10,
    inputs: [{ name: 'Valve', unit: '%' }],
    outputs: [{ name: 'Level', unit: 'm' }],
  });
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

/** Multipart with the text fields first and the file last, as the import expects. */
async function send<T>(
  client: SessionClient,
  path: string,
  csv: string,
  fields: Record<string, string> = {},
): Promise<ApiResponse<T>> {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'history.csv');
  return client.postForm<T>(path, form);
}

/** A year-old history every 10 s: time, level, a comment column, valve. */
function history(rows: number, badLine?: number): string {
  const start = Date.UTC(2025, 5, 1, 0, 0, 0);
  const lines = ['time,level,comment,valve'];
  for (let i = 0; i < rows; i++) {
    const line = lines.length + 1;
    const level = line === badLine ? 'n/a' : (2 + 0.01 * i).toFixed(3);
    lines.push(`${new Date(start + i * 10_000 + (i % 3) * 1000).toISOString()},${level},ok,${40 + (i % 5)}`);
  }
  return `${lines.join('\n')}\n`;
}

const mapping = JSON.stringify({ t: 'time', u: ['valve'], y: ['level'] });
const importPath = () => `/api/v1/loops/${loop.id}/readings/import`;

describe('historical CSV import', () => {
  it('previews the header and first 20 rows with a suggested mapping, storing nothing', async () => {
    const preview = await send<ImportPreview>(engineer, `${importPath()}/preview`, history(100));
    expect(preview.status).toBe(200);
    expect(preview.body.header).toEqual(['time', 'level', 'comment', 'valve']);
    expect(preview.body.rows).toHaveLength(20);
    expect(preview.body.rows[0][1]).toBe('2.000');
    expect(preview.body.suggestedMapping).toEqual({ t: 'time', u: ['valve'], y: ['level'] });
    expect(await db('readings').where({ loop_id: loop.id }).first()).toBeUndefined();
  });

  it('imports the good rows, reports a bad row with its line, and follows progress by id', async () => {
    const importId = randomUUID();
    const response = await send<ImportProgress>(engineer, importPath(), history(25_000, 7), { mapping, importId });
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({
      id: importId,
      rowsRead: 25_000,
      accepted: 24_999,
      duplicates: 0,
      rejected: 1,
      done: true,
      error: null,
    });
    expect(response.body.badRows).toEqual([{ line: 7, reason: 'y[0] (column "level") is not a finite number' }]);
    const progress = await engineer.request<ImportProgress>('GET', `/api/v1/imports/${importId}`);
    expect(progress.body).toMatchObject({ accepted: 24_999, done: true, fileName: 'history.csv' });
    const first = await db('readings').where({ loop_id: loop.id }).orderBy('slot_at').first();
    expect(first).toMatchObject({ slot_at: new Date(Date.UTC(2025, 5, 1)), u: [40], y: [2] });
  });

  it('counts a second import of the same rows as duplicates, and refuses a reused import id', async () => {
    const again = await send<ImportProgress>(engineer, importPath(), history(50, 7), { mapping });
    expect(again.body).toMatchObject({ accepted: 0, duplicates: 49, rejected: 1 });
    const fixed = await send<ImportProgress>(engineer, importPath(), history(50), { mapping });
    expect(fixed.body).toMatchObject({ accepted: 1, duplicates: 49, rejected: 0 });
    const id = again.body.id;
    expect((await send(engineer, importPath(), history(5), { mapping, importId: id })).status).toBe(409);
  });

  it('names what does not fit in the mapping, and refuses operators', async () => {
    const wrong = await send<{ error: { message: string } }>(engineer, importPath(), history(5), {
      mapping: JSON.stringify({ t: 'when', u: ['valve', 'pump'], y: [9] }),
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.message).toContain('u maps 2 columns; the loop has 1 inputs');
    expect(wrong.body.error.message).toContain('there is no column "when"');
    expect(wrong.body.error.message).toContain('column 9 does not exist');
    expect((await send(engineer, importPath(), history(5), { mapping: '{not json' })).status).toBe(400);
    expect((await send(engineer, importPath(), history(5))).status).toBe(400);
    const operator = await signedIn(api.url, OPERATOR);
    expect((await send(operator, importPath(), history(5), { mapping })).status).toBe(403);
  });
});
