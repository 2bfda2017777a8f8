import type { BodyView, FieldRow, OperationView } from '../utils/describe-operations';

const METHOD_CLASSES: Record<string, string> = {
  GET: 'border-ink/40 bg-panel text-ink',
  POST: 'border-ink bg-ink text-paper',
  PUT: 'border-ink bg-ink text-paper',
  PATCH: 'border-ink bg-ink text-paper',
  DELETE: 'border-diverged bg-panel text-diverged',
};

/** The HTTP method as a word: outlined for reading, filled for changing, red outline for removing. */
export function MethodBadge({ method }: { method: string }) {
  return (
    <span
      className={`inline-flex w-16 shrink-0 justify-center rounded-sm border px-1.5 py-0.5 text-xs font-bold tracking-wide ${
        METHOD_CLASSES[method] ?? METHOD_CLASSES.GET
      }`}
    >
      {method}
    </span>
  );
}

function FieldTable({
  caption,
  rows,
  where,
}: {
  caption: string;
  rows: (FieldRow & { in?: string })[];
  where?: boolean;
}) {
  const cell = 'border-b border-rule px-2 py-1 align-top';
  return (
    <table className="w-full border-collapse text-xs">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="text-left text-ink/75">
          <th scope="col" className={cell}>
            Name
          </th>
          {where ? (
            <th scope="col" className={cell}>
              In
            </th>
          ) : null}
          <th scope="col" className={cell}>
            Type
          </th>
          <th scope="col" className={cell}>
            Required
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={`${row.in ?? ''}${row.name}`}>
            <td className={`${cell} font-mono`}>{row.name}</td>
            {where ? <td className={cell}>{row.in}</td> : null}
            <td className={cell}>
              {row.type}
              {row.note ? <span className="block text-ink/70">{row.note}</span> : null}
            </td>
            <td className={cell}>{row.required ? 'required' : 'optional'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function BodyDetails({ title, body, caption }: { title: string; body: BodyView; caption: string }) {
  return (
    <details className="rounded-sm border border-rule">
      <summary className="cursor-pointer px-2 py-1 text-sm">
        <span className="font-medium">{title}</span> — {body.shape}
      </summary>
      <div className="space-y-1 border-t border-rule px-2 py-1.5">
        {body.note ? <p className="text-xs text-ink/75">{body.note}</p> : null}
        {body.fields.length > 0 ? <FieldTable caption={caption} rows={body.fields} /> : null}
      </div>
    </details>
  );
}

export function OperationCard({ operation }: { operation: OperationView }) {
  const { method, path, summary, access, parameters, requestBodies, response } = operation;
  return (
    <article aria-label={`${method} ${path}`} className="space-y-2 rounded-sm border border-rule bg-panel px-3 py-2.5">
      <h3 className="flex flex-wrap items-center gap-2">
        <MethodBadge method={method} />
        <code className="font-mono text-sm font-bold break-all">{path}</code>
      </h3>
      {summary ? <p className="text-sm">{summary}</p> : null}
      <p className="text-sm">
        <span className="text-ink/75">Who may call it: </span>
        {access}
      </p>
      {parameters.length > 0 ? (
        <FieldTable caption={`Parameters of ${method} ${path}`} rows={parameters} where />
      ) : null}
      {requestBodies.map((body) => (
        <BodyDetails
          key={body.label}
          title={`Request body, ${body.label}`}
          body={body}
          caption={`${body.label} request fields of ${method} ${path}`}
        />
      ))}
      {response.body ? (
        <BodyDetails
          title={`Answer ${response.status}`}
          body={response.body}
          caption={`Answer fields of ${method} ${path}`}
        />
      ) : (
        <p className="text-sm">
          <span className="text-ink/75">Answer {response.status}: </span>
          {response.status === '204' ? 'no body' : 'no JSON body described'}
        </p>
      )}
    </article>
  );
}
