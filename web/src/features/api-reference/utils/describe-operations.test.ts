import { ROLE_LABELS } from '@shadowloop/api/contracts/role-names';
import { describe, expect, it } from 'vitest';
import { OPENAPI_FIXTURE } from '../openapi.fixture';
import {
  describeAccess,
  describeBody,
  describeOperations,
  describeType,
  groupByTag,
  matchesFilter,
} from './describe-operations';

const operations = describeOperations(OPENAPI_FIXTURE);
const byId = (id: string) => {
  const found = operations.find((operation) => operation.id === id);
  if (!found) throw new Error(`No operation ${id} in the fixture`);
  return found;
};

describe('describeType', () => {
  // JSON Schema 2020-12 Validation §6.1.1: an array "type" admits an instance of any listed type.
  it('reads a list of types as alternatives', () => {
    expect(describeType({ type: ['number', 'null'] })).toBe('number or null');
  });

  // Core §10.2.1.2: anyOf admits an instance valid against at least one subschema.
  it('reads anyOf as alternatives and keeps the string format', () => {
    expect(describeType({ anyOf: [{ type: 'string', format: 'date-time' }, { type: 'null' }] })).toBe(
      'string (date-time) or null',
    );
  });

  it('brackets a compound alternative so "or null" reads as the whole value', () => {
    expect(describeType({ anyOf: [{ type: 'object', properties: { email: {}, name: {} } }, { type: 'null' }] })).toBe(
      '(object with email, name) or null',
    );
  });

  // Validation §6.1.3: "const" is the same as an "enum" of one value, so a choice of literals is one list.
  it('reads a choice of literals as one list of values', () => {
    expect(describeType({ anyOf: [{ const: 1 }, { const: 2 }, { const: 3 }] })).toBe('one of 1, 2, 3');
    expect(describeType({ anyOf: [{ type: 'string', enum: ['open', 'closed'] }, { const: 'all' }] })).toBe(
      'one of "open", "closed", "all"',
    );
  });

  // Validation §6.4.1 "items" applies to every element; the inner alternatives keep together.
  it('names the element type of a list, bracketing alternatives', () => {
    expect(describeType({ type: 'array', items: { type: 'array', items: { type: ['number', 'null'] } } })).toBe(
      'list of list of (number or null)',
    );
  });

  // Validation §6.1.2: an instance validates against "enum" when equal to one of its values.
  it('lists enum values', () => {
    expect(describeType({ type: 'string', enum: ['queued', 'running'] })).toBe('one of "queued", "running"');
  });

  // Core §4.3.2: the empty schema {} accepts every instance.
  it('calls the empty schema any JSON value', () => {
    expect(describeType({})).toBe('any JSON value');
  });

  // OpenAPI 3.1.0 §4.8.14.3: file content in multipart is a string with format binary.
  it('calls a binary string a file', () => {
    expect(describeType({ type: 'string', format: 'binary' })).toBe('file');
  });
});

describe('describeBody', () => {
  it('names the multipart text fields in order, then the file part', () => {
    const multipart = byId('post /api/v1/loops/{loopId}/backtests').requestBodies[1];
    expect(multipart.label).toBe('Multipart form');
    expect(multipart.shape).toBe('A form with the text fields versionIds, mapping, then the file part "file"');
    expect(multipart.filePart).toBe('file');
    expect(multipart.fields.map((field) => [field.name, field.type, field.required])).toEqual([
      ['versionIds', 'string', true],
      ['mapping', 'string', true],
      ['file', 'file', true],
    ]);
  });

  it('reads the fields of a list of objects from its items, required or not', () => {
    const users = byId('get /api/v1/users').response.body;
    expect(users?.shape).toBe('A list of objects, each with 4 fields');
    expect(users?.fields.find((field) => field.name === 'lastSignInAt')).toEqual({
      name: 'lastSignInAt',
      type: 'string (date-time) or null',
      required: true,
      note: undefined,
    });
  });

  it('says a body that is not an object or list of objects by its type', () => {
    expect(describeBody('application/json', { type: 'string' })).toEqual({
      label: 'JSON',
      shape: 'A value of type string',
      fields: [],
      note: undefined,
    });
  });
});

describe('describeAccess', () => {
  it('puts roles in the words the api uses for them', () => {
    expect(describeAccess(['admin', 'oncall'])).toBe(`Needs the ${ROLE_LABELS.admin} or ${ROLE_LABELS.oncall} role`);
    expect(describeAccess('public')).toBe('Anyone, without signing in');
    expect(describeAccess('signed-in')).toBe('Any signed-in user');
  });

  it('adds the ingest token when x-ingest is set', () => {
    expect(byId('post /api/v1/loops/{loopId}/readings').access).toBe(
      `Needs the ${ROLE_LABELS.engineer} role; also an ingest source's token, for the loops it may post to`,
    );
  });
});

describe('describeOperations', () => {
  it('takes the lowest 2xx answer as the success, not the error answers beside it', () => {
    const backtest = byId('post /api/v1/loops/{loopId}/backtests');
    expect(backtest.response.status).toBe('202');
    expect(backtest.response.body?.fields.map((field) => field.name)).toEqual(['id', 'status']);
    expect(byId('delete /api/v1/model-versions/{id}/evidence/{backtestId}').response).toEqual({
      status: '204',
      body: null,
    });
  });

  it('lists path and query parameters with the schema default', () => {
    expect(byId('get /api/v1/loops/{loopId}/series').parameters).toEqual([
      { name: 'loopId', in: 'path', type: 'string', required: true, note: undefined },
      { name: 'from', in: 'query', type: 'string (date-time)', required: false, note: undefined },
      { name: 'maxPoints', in: 'query', type: 'integer', required: false, note: 'default 2000' },
    ]);
  });
});

describe('matchesFilter and groupByTag', () => {
  const shown = (filter: string) => operations.filter((operation) => matchesFilter(operation, filter)).map((o) => o.id);

  it('needs every word, in any case, and reads :name as {name}', () => {
    expect(shown('  ')).toHaveLength(operations.length);
    expect(shown('POST :loopId')).toEqual([
      'post /api/v1/loops/{loopId}/readings',
      'post /api/v1/loops/{loopId}/backtests',
    ]);
    expect(shown('queue BACKTEST')).toEqual(['post /api/v1/loops/{loopId}/backtests']);
    expect(shown('queue readings')).toEqual([]);
  });

  it('groups by tag in the order each tag first appears', () => {
    expect(groupByTag(operations).map((group) => [group.tag, group.operations.length])).toEqual([
      ['health', 1],
      ['users', 1],
      ['readings', 2],
      ['backtests', 1],
      ['model versions', 1],
      ['on-call rota', 1],
    ]);
  });
});
