import { ApiError, networkError, readJsonSafely, toApiError } from './api-error';

export { ApiError, isApiError } from './api-error';

const STATE_CHANGING_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const CSRF_TOKEN_PATH = '/api/v1/csrf-token';

let csrfTokenPromise: Promise<string> | null = null;

export function forgetCsrfToken(): void {
  csrfTokenPromise = null;
}

async function send(path: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(path, { ...init, credentials: 'include' });
  } catch (cause) {
    throw networkError(cause);
  }
}

async function fetchCsrfToken(): Promise<string> {
  const response = await send(CSRF_TOKEN_PATH, { headers: { accept: 'application/json' } });
  if (!response.ok) throw await toApiError(response);
  const body = (await readJsonSafely(response)) as { token?: unknown } | undefined;
  if (typeof body?.token !== 'string') {
    throw new ApiError(response.status, 'csrf_unavailable', 'The server did not hand out a form token.');
  }
  return body.token;
}

function csrfToken(): Promise<string> {
  csrfTokenPromise ??= fetchCsrfToken().catch((error: unknown) => {
    csrfTokenPromise = null;
    throw error;
  });
  return csrfTokenPromise;
}

export type ApiRequest = {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** JSON-encoded, except FormData, which goes as multipart with the browser's boundary. */
  body?: unknown;
  signal?: AbortSignal;
};

async function buildInit(request: ApiRequest): Promise<RequestInit> {
  const method = request.method ?? 'GET';
  const headers: Record<string, string> = { accept: 'application/json' };
  const isForm = request.body instanceof FormData;
  if (request.body !== undefined && !isForm) headers['content-type'] = 'application/json';
  if (STATE_CHANGING_METHODS.has(method)) headers['x-csrf-token'] = await csrfToken();
  return {
    method,
    headers,
    signal: request.signal,
    body: request.body === undefined ? undefined : isForm ? (request.body as FormData) : JSON.stringify(request.body),
  };
}

/** Sends the session cookie, adds the CSRF header to state-changing requests, and throws ApiError. */
export async function apiFetch<T>(path: string, request: ApiRequest = {}): Promise<T> {
  let response = await send(path, await buildInit(request));
  if (response.status === 403 && STATE_CHANGING_METHODS.has(request.method ?? 'GET')) {
    const error = await toApiError(response.clone());
    if (error.code === 'csrf_invalid') {
      forgetCsrfToken();
      response = await send(path, await buildInit(request));
    }
  }
  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined as T;
  return (await readJsonSafely(response)) as T;
}
