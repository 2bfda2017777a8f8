import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { errorBody, stubFetch, type FakeReply } from '../../../test/fake-api';
import { OPENAPI_FIXTURE } from '../openapi.fixture';
import { ApiReference } from './api-reference';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function renderReference() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <ApiReference />
    </QueryClientProvider>,
  );
}

const operationNames = () => screen.queryAllByRole('article').map((article) => article.getAttribute('aria-label'));

describe('API reference', () => {
  it('holds the place while loading, then shows every operation under its tag', async () => {
    stubFetch({ 'GET /api/v1/openapi.json': { body: OPENAPI_FIXTURE } });
    renderReference();
    expect(screen.getByRole('status').textContent).toContain('Loading the API description');

    const readings = await screen.findByRole('region', { name: 'Readings' });
    expect(
      within(readings)
        .getAllByRole('article')
        .map((article) => article.getAttribute('aria-label')),
    ).toEqual(['GET /api/v1/loops/{loopId}/series', 'POST /api/v1/loops/{loopId}/readings']);
    expect(screen.getAllByRole('heading', { level: 2 }).map((heading) => heading.textContent)).toEqual([
      'Health',
      'Users',
      'Readings',
      'Backtests',
      'Model versions',
      'On-call rota',
    ]);
    expect(screen.getByText('7 operations · API version 0.4.2')).toBeTruthy();

    const series = screen.getByRole('article', { name: 'GET /api/v1/loops/{loopId}/series' });
    expect(within(series).getByText('GET')).toBeTruthy();
    expect(within(series).getByText('Any signed-in user')).toBeTruthy();
    const parameters = within(series).getByRole('table', { name: 'Parameters of GET /api/v1/loops/{loopId}/series' });
    expect(within(parameters).getByText('maxPoints').closest('tr')?.textContent).toBe(
      'maxPointsqueryintegerdefault 2000optional',
    );

    const shifts = screen.getByRole('article', { name: 'PUT /api/v1/oncall/shifts/{id}' });
    expect(within(shifts).getByText('Needs the administrator or on-call engineer role')).toBeTruthy();
    const link = screen.getByRole('link', { name: '/api/v1/openapi.json' });
    expect(link.getAttribute('href')).toBe('/api/v1/openapi.json');
  });

  it('shows the multipart form beside the JSON body, naming the file part', async () => {
    stubFetch({ 'GET /api/v1/openapi.json': { body: OPENAPI_FIXTURE } });
    renderReference();
    const backtest = await screen.findByRole('article', { name: 'POST /api/v1/loops/{loopId}/backtests' });
    expect(
      within(backtest)
        .getByText(/^Request body, JSON/)
        .closest('summary')?.textContent,
    ).toBe('Request body, JSON — An object with 3 fields');
    const multipart = within(backtest)
      .getByText(/^Request body, Multipart form/)
      .closest('summary');
    expect(multipart?.textContent).toBe(
      'Request body, Multipart form — A form with the text fields versionIds, mapping, then the file part "file"',
    );
    const fields = within(backtest).getByRole('table', {
      name: 'Multipart form request fields of POST /api/v1/loops/{loopId}/backtests',
    });
    expect(
      within(fields)
        .getAllByRole('row')
        .map((row) => row.textContent),
    ).toEqual([
      'NameTypeRequired',
      'versionIdsstringrequired',
      'mappingstringrequired',
      'filefilethe CSV file (UTF-8, header line first)required',
    ]);
    expect(
      within(backtest)
        .getByText(/^Answer 202/)
        .closest('summary')?.textContent,
    ).toBe('Answer 202 — An object with 2 fields');
  });

  it('filters by path or words, says when nothing matches, and clears', async () => {
    stubFetch({ 'GET /api/v1/openapi.json': { body: OPENAPI_FIXTURE } });
    renderReference();
    const filter = await screen.findByRole('searchbox', { name: 'Filter by path or words' });
    await screen.findByRole('region', { name: 'Health' });

    fireEvent.change(filter, { target: { value: '/loops/:loopId post' } });
    expect(operationNames()).toEqual(['POST /api/v1/loops/{loopId}/readings', 'POST /api/v1/loops/{loopId}/backtests']);
    expect(screen.getByText('2 of 7 operations · API version 0.4.2')).toBeTruthy();

    fireEvent.change(filter, { target: { value: 'evidence' } });
    expect(operationNames()).toEqual(['DELETE /api/v1/model-versions/{id}/evidence/{backtestId}']);

    fireEvent.change(filter, { target: { value: 'shelve' } });
    expect(operationNames()).toEqual([]);
    expect(screen.getByRole('heading', { name: 'No operation matches “shelve”' })).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Clear the filter' }));
    expect(operationNames()).toHaveLength(7);
  });

  it('says in plain words when the document cannot be read, and tries again', async () => {
    let answer: FakeReply = { status: 500, body: errorBody('internal', 'The database did not answer.') };
    const fetchMock = stubFetch({ 'GET /api/v1/openapi.json': () => answer });
    renderReference();
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('The Shadowloop server had a problem')).toBeTruthy();
    expect(within(alert).getByText('The database did not answer.')).toBeTruthy();

    answer = { status: 200, body: OPENAPI_FIXTURE };
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('region', { name: 'Users' })).toBeTruthy();
    expect(fetchMock).toHaveBeenCalledTimes(2);
  });
});
