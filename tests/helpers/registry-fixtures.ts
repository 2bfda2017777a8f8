import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { inject } from 'vitest';
import type { CreateLoopBody, Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import { SessionClient, type ApiResponse } from './session-client.js';

/** The demo accounts the registry suites act as. */
export const ENGINEER = 'engineer@quillmere.example';
export const REVIEWER = 'reviewer@quillmere.example';
export const OPERATOR = 'operator@quillmere.example';
export const ONCALL = 'oncall@quillmere.example';

export type ErrorResponse<D = unknown> = { error: { code: string; message: string; details: D } };

/**
 * A client signed in as this demo account. The session lives in PostgreSQL, so one sign-in per
 * account serves every api the run starts: the cookie is kept beside the run's output and reused
 * while it is still valid. (The local identity provider admits 30 logins a minute per address.)
 */
export async function signedIn(baseUrl: string, email: string): Promise<SessionClient> {
  const stored = path.join(inject('stack').outputDir, `session-${email}.cookie`);
  const client = new SessionClient(baseUrl);
  if (fs.existsSync(stored)) {
    await client.jar.setCookie(fs.readFileSync(stored, 'utf8'), baseUrl);
    if ((await client.request('GET', '/api/v1/me')).status === 200) return client;
  }
  const fresh = new SessionClient(baseUrl);
  await fresh.signIn(email);
  fs.mkdirSync(path.dirname(stored), { recursive: true });
  fs.writeFileSync(stored, await fresh.jar.getCookieString(baseUrl));
  return fresh;
}

/** A tag no other test uses, e.g. IT-4F2A9C. */
export const uniqueTag = (prefix = 'IT') => `${prefix}-${randomBytes(3).toString('hex').toUpperCase()}`;

/** A two-state, one-input, one-output loop body. */
export function loopBody(overrides: Partial<CreateLoopBody> = {}): CreateLoopBody {
  return {
    tag: uniqueTag(),
    name: 'Test loop',
    area: 'storage',
    samplePeriodS: 1,
    inputs: [{ name: 'Valve', unit: '%' }],
    states: [
      { name: 'Level', unit: 'm' },
      { name: 'Flow', unit: 'm³/h' },
    ],
    outputs: [{ name: 'Level', unit: 'm' }],
    ...overrides,
  };
}

/** A stable model for loopBody's signals. */
export const STABLE_MODEL = {
  A: [
    [0.9, 0.05],
    [0, 0.7],
  ],
  B: [[0], [0.3]],
  C: [[1, 0]],
};

export async function createLoop(engineer: SessionClient, overrides: Partial<CreateLoopBody> = {}): Promise<Loop> {
  const response = await engineer.request<Loop>('POST', '/api/v1/loops', loopBody(overrides), { csrf: true });
  if (response.status !== 201)
    throw new Error(`creating a loop failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body;
}

export async function createDraft(
  engineer: SessionClient,
  loopId: string,
  body: Record<string, unknown> = {},
): Promise<ModelVersion> {
  const response = await engineer.request<ModelVersion>(
    'POST',
    `/api/v1/loops/${loopId}/model-versions`,
    { ...STABLE_MODEL, changeNote: 'test model', ...body },
    { csrf: true },
  );
  if (response.status !== 201)
    throw new Error(`creating a draft failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body;
}

export function act<T = ModelVersion>(
  client: SessionClient,
  versionId: string,
  action: string,
  body: Record<string, unknown> = {},
): Promise<ApiResponse<T>> {
  return client.request<T>('POST', `/api/v1/model-versions/${versionId}/${action}`, body, { csrf: true });
}

/** A draft by the engineer, submitted and approved by the reviewer. */
export async function approvedVersion(
  engineer: SessionClient,
  reviewer: SessionClient,
  loopId: string,
  body: Record<string, unknown> = {},
): Promise<ModelVersion> {
  const draft = await createDraft(engineer, loopId, body);
  for (const [client, action] of [
    [engineer, 'submit'],
    [reviewer, 'approve'],
  ] as const) {
    const response = await act(client, draft.id, action, { justification: 'test' });
    if (response.status !== 200)
      throw new Error(`${action} failed: ${response.status} ${JSON.stringify(response.body)}`);
  }
  return draft;
}

/** A multipart upload of named text files, as a browser form would send it. */
export async function upload<T = unknown>(
  client: SessionClient,
  path: string,
  files: { name: string; content: string }[],
): Promise<ApiResponse<T>> {
  const form = new FormData();
  for (const file of files) form.append('files', new Blob([file.content]), file.name);
  return client.postForm<T>(path, form);
}
