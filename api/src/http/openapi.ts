import { z } from 'zod';
import type { RouteTable } from './route.js';
import { ErrorBodySchema } from '../contracts/errors.js';

const toOpenApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');
const jsonSchema = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' });

/** JSON and/or multipart: the text fields (as the form sends them) in their order, then the file part. */
function requestBodyOf(body: z.ZodType | undefined, multipart: { fields: z.ZodType; file: string } | undefined) {
  const content: Record<string, { schema: unknown; encoding?: unknown }> = {};
  if (body) content['application/json'] = { schema: jsonSchema(body) };
  if (multipart) {
    const fields = jsonSchema(multipart.fields) as { properties?: Record<string, unknown>; required?: string[] };
    content['multipart/form-data'] = {
      schema: {
        type: 'object',
        description: 'Send the text fields before the file part: the server reads the file as it streams.',
        properties: {
          ...fields.properties,
          [multipart.file]: {
            type: 'string',
            format: 'binary',
            description: 'the CSV file (UTF-8, header line first)',
          },
        },
        required: [...(fields.required ?? []), multipart.file],
      },
    };
  }
  return { required: true, content };
}

/** The OpenAPI 3.1 document, generated from the same declarations the router enforces. */
export function buildOpenApi(routes: RouteTable, version: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  const errorResponse = {
    description: 'Error',
    content: { 'application/json': { schema: jsonSchema(ErrorBodySchema) } },
  };
  for (const spec of routes.specs()) {
    const path = toOpenApiPath(spec.path);
    const parameters = [...spec.path.matchAll(/:(\w+)/g)].map((m) => ({
      name: m[1],
      in: 'path',
      required: true,
      schema: { type: 'string' },
    }));
    if (spec.query) {
      const props = (jsonSchema(spec.query) as { properties?: Record<string, unknown> }).properties ?? {};
      for (const [name, schema] of Object.entries(props))
        parameters.push({ name, in: 'query', required: false, schema: schema as { type: string } });
    }
    paths[path] ??= {};
    paths[path][spec.method] = {
      summary: spec.summary,
      tags: [spec.tag],
      'x-roles': spec.access,
      ...(spec.ingest ? { 'x-ingest': true } : {}),
      security: spec.access === 'public' ? [] : [{ session: [] }, { bearer: [] }],
      parameters,
      ...(spec.body || spec.multipart ? { requestBody: requestBodyOf(spec.body, spec.multipart) } : {}),
      responses: {
        [String(spec.status ?? 200)]: {
          description: 'Success',
          ...(spec.response ? { content: { 'application/json': { schema: jsonSchema(spec.response) } } } : {}),
        },
        ...(spec.access === 'public' ? {} : { 401: errorResponse, 403: errorResponse }),
        ...(spec.body || spec.multipart ? { 400: errorResponse } : {}),
      },
    };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Shadowloop API',
      version,
      description: 'Live state-space twins beside plant control loops. Advisory monitoring only.',
    },
    components: {
      securitySchemes: {
        session: {
          type: 'apiKey',
          in: 'cookie',
          name: 'shadowloop.sid',
          description: 'Browser session; state-changing requests also need the x-csrf-token header.',
        },
        bearer: {
          type: 'http',
          scheme: 'bearer',
          description: 'An access token created in the app or with npm run admin -- issue-token.',
        },
      },
    },
    paths,
  };
}
