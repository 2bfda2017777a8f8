export type ApiErrorBody = { error: { code: string; message: string; details?: unknown } };

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

function hasErrorShape(body: unknown): body is ApiErrorBody {
  if (typeof body !== 'object' || body === null || !('error' in body)) return false;
  const inner = (body as { error: unknown }).error;
  return (
    typeof inner === 'object' &&
    inner !== null &&
    typeof (inner as { code?: unknown }).code === 'string' &&
    typeof (inner as { message?: unknown }).message === 'string'
  );
}

export async function readJsonSafely(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

export async function toApiError(response: Response): Promise<ApiError> {
  const body = await readJsonSafely(response);
  if (hasErrorShape(body)) {
    const { code, message, details } = body.error;
    return new ApiError(response.status, code, message, details);
  }
  return new ApiError(
    response.status,
    'http_error',
    `The server answered with status ${response.status} and no explanation.`,
  );
}

export function networkError(cause: unknown): ApiError {
  return new ApiError(
    0,
    'network_error',
    'Shadowloop could not reach its server. Check the network connection and try again.',
    cause instanceof Error ? cause.message : undefined,
  );
}
