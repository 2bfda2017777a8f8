import { useQuery } from '@tanstack/react-query';
import { useId, useMemo, useState, type ReactNode } from 'react';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { OPENAPI_PATH, openApiQueryOptions } from '../api/get-openapi';
import { describeOperations, groupByTag, matchesFilter } from '../utils/describe-operations';
import { OperationCard } from './operation-card';

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** How programs call the API, in one paragraph, with the raw document beside it. */
function CallingNotes() {
  return (
    <div className="max-w-3xl space-y-1 text-sm">
      <p>
        Scripts and plant bridges call the same API as this app. They send an access token as{' '}
        <code className="font-mono">Authorization: Bearer …</code> (each person makes their own under Access tokens in
        the user menu; an ingest source has its own token that may only post readings). A browser session instead sends
        the <code className="font-mono">x-csrf-token</code> header, from{' '}
        <code className="font-mono">GET /api/v1/csrf-token</code>, with every request that changes something. Errors
        come back with their HTTP status as JSON{' '}
        <code className="font-mono">{'{"error":{"code","message","details"}}'}</code>.
      </p>
      <p>
        The machine-readable OpenAPI 3.1 document:{' '}
        <a className="font-medium underline" href={OPENAPI_PATH}>
          {OPENAPI_PATH}
        </a>
      </p>
    </div>
  );
}

function LoadingOperations() {
  return (
    <div role="status" className="space-y-2">
      {[0, 1, 2].map((row) => (
        <span key={row} aria-hidden="true" className="block h-24 animate-pulse rounded-sm bg-rule/40" />
      ))}
      <span className="sr-only">Loading the API description…</span>
    </div>
  );
}

/** The OpenAPI document read aloud: operations grouped by tag, with a filter by path or words. */
export function ApiReference() {
  const openApi = useQuery(openApiQueryOptions());
  const [filter, setFilter] = useState('');
  const filterId = useId();
  const operations = useMemo(() => (openApi.data ? describeOperations(openApi.data) : []), [openApi.data]);
  const shown = useMemo(() => operations.filter((operation) => matchesFilter(operation, filter)), [operations, filter]);

  let body: ReactNode;
  if (openApi.isError) body = <ErrorNotice error={openApi.error} onRetry={() => void openApi.refetch()} />;
  else if (openApi.isPending) body = <LoadingOperations />;
  else if (operations.length === 0)
    body = (
      <EmptyState title="The document lists no operations">
        <p>The api answered with an OpenAPI document without paths. Open the raw document above to see what it sent.</p>
      </EmptyState>
    );
  else if (shown.length === 0)
    body = (
      <EmptyState title={`No operation matches “${filter.trim()}”`}>
        <p>Try part of a path such as /alerts, or one word from a summary such as backtest.</p>
        <Button onClick={() => setFilter('')}>Clear the filter</Button>
      </EmptyState>
    );
  else
    body = groupByTag(shown).map(({ tag, operations: grouped }) => (
      <section key={tag} aria-label={capitalised(tag)} className="space-y-2">
        <h2 className="border-b border-rule pb-1 text-lg font-bold">{capitalised(tag)}</h2>
        {grouped.map((operation) => (
          <OperationCard key={operation.id} operation={operation} />
        ))}
      </section>
    ));

  return (
    <div className="space-y-4">
      <CallingNotes />
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <div className="flex flex-col gap-1">
          <label htmlFor={filterId} className="font-medium">
            Filter by path or words
          </label>
          <input
            id={filterId}
            type="search"
            className={`${INPUT_CLASSES} w-80 max-w-full`}
            placeholder="/loops/{loopId} or acknowledge"
            value={filter}
            onChange={(event) => setFilter(event.target.value)}
          />
        </div>
        {openApi.data ? (
          <p className="pb-1.5 tabular-nums text-ink/75" aria-live="polite">
            {filter.trim() ? `${shown.length} of ${operations.length} operations` : `${operations.length} operations`}
            {openApi.data.info?.version ? ` · API version ${openApi.data.info.version}` : ''}
          </p>
        ) : null}
      </div>
      {body}
    </div>
  );
}
