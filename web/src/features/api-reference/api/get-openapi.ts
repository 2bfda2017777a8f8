import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

/** The part of JSON Schema (2020-12) that zod's toJSONSchema writes and this page reads. */
export type JsonSchema = {
  type?: string | string[];
  format?: string;
  description?: string;
  enum?: unknown[];
  const?: unknown;
  default?: unknown;
  items?: JsonSchema;
  properties?: Record<string, JsonSchema>;
  required?: string[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  /** Keywords the page does not show (minimum, pattern, minItems…). */
  [keyword: string]: unknown;
};

export type OpenApiParameter = { name: string; in: string; required?: boolean; schema?: JsonSchema };

type MediaContent = Record<string, { schema?: JsonSchema }>;

/** One operation as api/src/http/openapi.ts writes it, with Shadowloop's x-roles and x-ingest. */
export type OpenApiOperation = {
  summary?: string;
  tags?: string[];
  'x-roles'?: string | string[];
  'x-ingest'?: boolean;
  security?: Record<string, string[]>[];
  parameters?: OpenApiParameter[];
  requestBody?: { required?: boolean; content?: MediaContent };
  responses?: Record<string, { description?: string; content?: MediaContent }>;
};

export type OpenApiDocument = {
  openapi: string;
  info?: { title?: string; version?: string; description?: string };
  paths?: Record<string, Record<string, OpenApiOperation>>;
};

/** Where the api serves its generated description; anyone may read it. */
export const OPENAPI_PATH = '/api/v1/openapi.json';

export const openApiKeys = { document: ['openapi'] as const };

export function getOpenApi(signal?: AbortSignal): Promise<OpenApiDocument> {
  return apiFetch<OpenApiDocument>(OPENAPI_PATH, { signal });
}

/** The document changes only when the api is deployed, so it stays fresh for the session. */
export function openApiQueryOptions() {
  return queryOptions({
    queryKey: openApiKeys.document,
    queryFn: ({ signal }) => getOpenApi(signal),
    staleTime: Infinity,
  });
}
