import { ROLE_LABELS, ROLES, type Role } from '@shadowloop/api/contracts/role-names';
import type { JsonSchema, OpenApiDocument, OpenApiOperation } from '../api/get-openapi';

/** One field of a body, or one parameter, in words. */
export type FieldRow = { name: string; type: string; required: boolean; note?: string };

export type BodyView = {
  /** "JSON" or "Multipart form" (or the media type itself when it is neither). */
  label: string;
  /** One sentence on the body's shape, e.g. "A list of objects, each with 5 fields". */
  shape: string;
  fields: FieldRow[];
  /** The multipart file part's name, when there is one. */
  filePart?: string;
  note?: string;
};

export type OperationView = {
  /** "get /api/v1/loops/{loopId}", unique in a document. */
  id: string;
  method: string;
  path: string;
  tag: string;
  summary: string;
  /** Who may call it, in words. */
  access: string;
  parameters: (FieldRow & { in: string })[];
  requestBodies: BodyView[];
  /** The success status (the lowest 2xx) and its JSON body, null when it sends none. */
  response: { status: string; body: BodyView | null };
};

const HTTP_METHODS = new Set(['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace']);

function typesOf(schema: JsonSchema): string[] {
  if (Array.isArray(schema.type)) return schema.type;
  return schema.type ? [schema.type] : [];
}

/** A list's element type, bracketed when it is itself a choice: "list of (number or null)". */
function elementWords(items: JsonSchema | undefined): string {
  const words = describeType(items);
  const isChoice = items && !items.enum && (items.anyOf ?? items.oneOf ?? typesOf(items)).length > 1;
  return isChoice && words.includes(' or ') ? `(${words})` : words;
}

/** A JSON Schema type in words: "string (date-time)", "list of (number or null)", "one of "a", "b"". */
export function describeType(schema: JsonSchema | undefined): string {
  if (!schema) return 'any JSON value';
  const alternatives = schema.anyOf ?? schema.oneOf;
  if (alternatives) {
    // literals only (z.union of z.literal, an enum widened by a literal): one list of values
    const literals = alternatives.flatMap((part) => (part.const !== undefined ? [part.const] : (part.enum ?? [null])));
    if (alternatives.every((part) => part.const !== undefined || part.enum)) return describeType({ enum: literals });
    const parts = [...new Set(alternatives.map(describeType))];
    return parts
      .map((part) => (parts.length > 1 && /^(list of|object with|one of) /.test(part) ? `(${part})` : part))
      .join(' or ');
  }
  if (schema.const !== undefined) return JSON.stringify(schema.const);
  if (schema.enum) return `one of ${schema.enum.map((value) => JSON.stringify(value)).join(', ')}`;
  const types = typesOf(schema);
  if (types.length === 0) return 'any JSON value';
  return types
    .map((type) => {
      if (type === 'array') return `list of ${elementWords(schema.items)}`;
      if (type === 'object') {
        const names = Object.keys(schema.properties ?? {});
        return names.length > 0 ? `object with ${names.join(', ')}` : 'object';
      }
      if (type === 'string' && schema.format === 'binary') return 'file';
      if (type === 'string' && schema.format) return `string (${schema.format})`;
      return type;
    })
    .join(' or ');
}

function noteOf(schema: JsonSchema | undefined): string | undefined {
  if (!schema) return undefined;
  const parts = [schema.description, schema.default !== undefined ? `default ${JSON.stringify(schema.default)}` : ''];
  return parts.filter(Boolean).join('; ') || undefined;
}

function fieldRows(schema: JsonSchema): FieldRow[] {
  const required = new Set(schema.required ?? []);
  return Object.entries(schema.properties ?? {}).map(([name, field]) => ({
    name,
    type: describeType(field),
    required: required.has(name),
    note: noteOf(field),
  }));
}

const countFields = (count: number) => (count === 1 ? '1 field' : `${count} fields`);

/** The top-level fields of a body: an object's properties, or those of a list's items. */
export function describeBody(mediaType: string, schema: JsonSchema | undefined): BodyView {
  const label =
    mediaType === 'application/json' ? 'JSON' : mediaType === 'multipart/form-data' ? 'Multipart form' : mediaType;
  const base = { label, note: schema?.description };
  if (schema && typesOf(schema).includes('object') && schema.properties) {
    const fields = fieldRows(schema);
    if (mediaType === 'multipart/form-data') {
      const filePart = fields.find((field) => field.type === 'file')?.name;
      const texts = fields.filter((field) => field.name !== filePart).map((field) => field.name);
      const textWords = texts.length > 0 ? `the text fields ${texts.join(', ')}` : 'no text fields';
      const fileWords = filePart ? `, then the file part "${filePart}"` : ', and no file part';
      return { ...base, shape: `A form with ${textWords}${fileWords}`, fields, filePart };
    }
    return { ...base, shape: `An object with ${countFields(fields.length)}`, fields };
  }
  const items = schema?.items;
  if (schema && typesOf(schema).includes('array') && items && typesOf(items).includes('object') && items.properties) {
    const fields = fieldRows(items);
    return { ...base, shape: `A list of objects, each with ${countFields(fields.length)}`, fields };
  }
  return { ...base, shape: `A value of type ${describeType(schema)}`, fields: [] };
}

const isRole = (name: string): name is Role => (ROLES as readonly string[]).includes(name);

/** Who may call an operation, from x-roles ('public', 'signed-in' or role names) and x-ingest. */
export function describeAccess(roles: OpenApiOperation['x-roles'], ingest = false): string {
  let words: string;
  if (roles === 'public') words = 'Anyone, without signing in';
  else if (roles === 'signed-in' || roles === 'signed_in') words = 'Any signed-in user';
  else if (Array.isArray(roles) && roles.length > 0)
    words = `Needs the ${roles.map((role) => (isRole(role) ? ROLE_LABELS[role] : role)).join(' or ')} role`;
  else words = roles ? String(roles) : 'Not stated in the document';
  return ingest ? `${words}; also an ingest source's token, for the loops it may post to` : words;
}

function successResponse(operation: OpenApiOperation): OperationView['response'] {
  const statuses = Object.keys(operation.responses ?? {})
    .filter((status) => /^2\d\d$/.test(status))
    .sort();
  const status = statuses[0] ?? '200';
  const schema = operation.responses?.[status]?.content?.['application/json']?.schema;
  return { status, body: schema ? describeBody('application/json', schema) : null };
}

/** Every operation of the document, in its order, in the words the API page shows. */
export function describeOperations(document: OpenApiDocument): OperationView[] {
  return Object.entries(document.paths ?? {}).flatMap(([path, operations]) =>
    Object.entries(operations)
      .filter(([method]) => HTTP_METHODS.has(method))
      .map(([method, operation]) => ({
        id: `${method} ${path}`,
        method: method.toUpperCase(),
        path,
        tag: operation.tags?.[0] ?? 'other',
        summary: operation.summary ?? '',
        access: describeAccess(operation['x-roles'], operation['x-ingest'] === true),
        parameters: (operation.parameters ?? []).map((parameter) => ({
          name: parameter.name,
          in: parameter.in,
          type: describeType(parameter.schema),
          required: parameter.required === true,
          note: noteOf(parameter.schema),
        })),
        requestBodies: Object.entries(operation.requestBody?.content ?? {}).map(([mediaType, content]) =>
          describeBody(mediaType, content.schema),
        ),
        response: successResponse(operation),
      })),
  );
}

/**
 * Whether an operation matches the filter box: every word (case aside) must occur in its method,
 * path, summary, tag or access words. ":id" is read as "{id}", so Express-style paths match too.
 */
export function matchesFilter(operation: OperationView, filter: string): boolean {
  const words = filter
    .trim()
    .toLowerCase()
    .replace(/:(\w+)/g, '{$1}')
    .split(/\s+/)
    .filter(Boolean);
  const text = [operation.method, operation.path, operation.summary, operation.tag, operation.access]
    .join(' ')
    .toLowerCase();
  return words.every((word) => text.includes(word));
}

/** Operations grouped by tag, the groups in the order their first operation appears. */
export function groupByTag(operations: OperationView[]): { tag: string; operations: OperationView[] }[] {
  const groups = new Map<string, OperationView[]>();
  for (const operation of operations) {
    const group = groups.get(operation.tag) ?? [];
    group.push(operation);
    groups.set(operation.tag, group);
  }
  return [...groups].map(([tag, grouped]) => ({ tag, operations: grouped }));
}
