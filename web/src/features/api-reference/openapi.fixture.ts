import type { JsonSchema, OpenApiDocument } from './api/get-openapi';

/**
 * A small document in the shape buildOpenApi (api/src/http/openapi.ts) writes: excerpts of the
 * real operations, with zod's long string patterns and "$schema" lines left out.
 */
const errorResponse = {
  description: 'Error',
  content: {
    'application/json': {
      schema: {
        type: 'object',
        properties: {
          error: {
            type: 'object',
            properties: { code: { type: 'string' }, message: { type: 'string' }, details: {} },
            required: ['code', 'message'],
          },
        },
        required: ['error'],
      },
    },
  },
};
const guarded = { 401: errorResponse, 403: errorResponse };
const signedIn: Record<string, string[]>[] = [{ session: [] }, { bearer: [] }];
const pathParameter = (name: string) => ({ name, in: 'path', required: true, schema: { type: 'string' } });
const dateTime = { type: 'string', format: 'date-time' };
/** A success answer with a JSON body, as the route table documents it. */
const jsonSuccess = (schema: JsonSchema) => ({ description: 'Success', content: { 'application/json': { schema } } });

export const OPENAPI_FIXTURE: OpenApiDocument = {
  openapi: '3.1.0',
  info: {
    title: 'Shadowloop API',
    version: '0.4.2',
    description: 'Live state-space twins beside plant control loops.',
  },
  paths: {
    '/api/health': {
      get: {
        summary: 'Database, mail server, identity provider and simulator heartbeat',
        tags: ['health'],
        'x-roles': 'public',
        security: [],
        parameters: [],
        responses: { 200: { description: 'Success' } },
      },
    },
    '/api/v1/users': {
      get: {
        summary: 'Everyone who has signed in, with their roles',
        tags: ['users'],
        'x-roles': ['admin'],
        security: signedIn,
        parameters: [],
        responses: {
          200: jsonSuccess({
            type: 'array',
            items: {
              type: 'object',
              properties: {
                id: { type: 'string', format: 'uuid' },
                email: { type: 'string', format: 'email' },
                roles: {
                  type: 'array',
                  items: { type: 'string', enum: ['operator', 'engineer', 'oncall', 'admin'] },
                },
                lastSignInAt: { anyOf: [dateTime, { type: 'null' }] },
              },
              required: ['id', 'email', 'roles', 'lastSignInAt'],
            },
          }),
          ...guarded,
        },
      },
    },
    '/api/v1/loops/{loopId}/series': {
      get: {
        summary: 'Measured, predicted and residual series of the loop, downsampled to maxPoints',
        tags: ['readings'],
        'x-roles': 'signed-in',
        security: signedIn,
        parameters: [
          pathParameter('loopId'),
          { name: 'from', in: 'query', required: false, schema: dateTime },
          { name: 'maxPoints', in: 'query', required: false, schema: { default: 2000, type: 'integer', minimum: 10 } },
        ],
        responses: {
          200: jsonSuccess({
            type: 'object',
            properties: {
              t: { type: 'array', items: { type: 'string' } },
              measured: { type: 'array', items: { type: 'array', items: { type: ['number', 'null'] } } },
              downsampled: { type: 'boolean' },
            },
            required: ['t', 'measured', 'downsampled'],
          }),
          ...guarded,
        },
      },
    },
    '/api/v1/loops/{loopId}/readings': {
      post: {
        summary: 'Post up to 5000 readings {t, u, y} (an ingest token scoped to the loop, or an engineer)',
        tags: ['readings'],
        'x-roles': ['engineer'],
        'x-ingest': true,
        security: signedIn,
        parameters: [pathParameter('loopId')],
        requestBody: {
          required: true,
          content: {
            'application/json': {
              schema: {
                type: 'object',
                properties: { readings: { minItems: 1, maxItems: 5000, type: 'array', items: {} } },
                required: ['readings'],
              },
            },
          },
        },
        responses: {
          200: jsonSuccess({
            type: 'object',
            properties: {
              accepted: { type: 'integer' },
              duplicates: { type: 'integer' },
              rejected: { type: 'array', items: { type: 'object', properties: { index: { type: 'integer' } } } },
            },
            required: ['accepted', 'duplicates', 'rejected'],
          }),
          ...guarded,
          400: errorResponse,
        },
      },
    },
    '/api/v1/loops/{loopId}/backtests': {
      post: {
        summary: 'Queue a backtest of 1–4 versions of the loop as a background job',
        tags: ['backtests'],
        'x-roles': ['engineer'],
        security: signedIn,
        parameters: [pathParameter('loopId')],
        requestBody: {
          required: true,
          content: {
            'application/json': {
              schema: {
                type: 'object',
                properties: {
                  versionIds: { minItems: 1, maxItems: 4, type: 'array', items: { type: 'string', format: 'uuid' } },
                  from: dateTime,
                  to: dateTime,
                },
                required: ['versionIds', 'from', 'to'],
              },
            },
            'multipart/form-data': {
              schema: {
                type: 'object',
                description: 'Send the text fields before the file part: the server reads the file as it streams.',
                properties: {
                  versionIds: { type: 'string' },
                  mapping: { type: 'string' },
                  file: { type: 'string', format: 'binary', description: 'the CSV file (UTF-8, header line first)' },
                },
                required: ['versionIds', 'mapping', 'file'],
              },
            },
          },
        },
        responses: {
          202: jsonSuccess({
            type: 'object',
            properties: {
              id: { type: 'string', format: 'uuid' },
              status: { type: 'string', enum: ['queued', 'running', 'succeeded', 'failed', 'cancelled'] },
            },
            required: ['id', 'status'],
          }),
          ...guarded,
          400: errorResponse,
        },
      },
    },
    '/api/v1/model-versions/{id}/evidence/{backtestId}': {
      delete: {
        summary: 'Remove a backtest from the version’s evidence (draft or in review only)',
        tags: ['model versions'],
        'x-roles': ['engineer'],
        security: signedIn,
        parameters: [pathParameter('id'), pathParameter('backtestId')],
        responses: { 204: { description: 'Success' }, ...guarded },
      },
    },
    '/api/v1/oncall/shifts/{id}': {
      put: {
        summary: 'Change a shift',
        tags: ['on-call rota'],
        'x-roles': ['admin', 'oncall'],
        security: signedIn,
        parameters: [pathParameter('id')],
        responses: { 200: { description: 'Success' }, ...guarded },
      },
    },
  },
};
