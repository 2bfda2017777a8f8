import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { OPENAPI_FIXTURE } from '../../../features/api-reference/openapi.fixture';
import { queriesTo, signedInAs, stubFetch } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';

describe('admin API page', () => {
  it('is a tab of the admin section and renders the document at /admin/api', async () => {
    stubFetch({ ...signedInAs(['admin']), 'GET /api/v1/openapi.json': { body: OPENAPI_FIXTURE } });
    renderApp('/admin/api');
    expect(await screen.findByRole('heading', { level: 1, name: 'API' })).toBeTruthy();
    const tabs = screen.getByRole('navigation', { name: 'Admin' });
    expect(within(tabs).getByRole('link', { name: 'API' }).getAttribute('aria-current')).toBe('page');
    expect(await screen.findByRole('article', { name: 'POST /api/v1/loops/{loopId}/readings' })).toBeTruthy();
    expect(screen.getByRole('link', { name: '/api/v1/openapi.json' })).toBeTruthy();
  });

  it('is refused, like the other admin pages, without the administrator role', async () => {
    const fetchMock = stubFetch({ ...signedInAs(['engineer']), 'GET /api/v1/openapi.json': { body: OPENAPI_FIXTURE } });
    renderApp('/admin/api');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not available for your role' })).toBeTruthy();
    expect(screen.queryByRole('article')).toBeNull();
    expect(queriesTo(fetchMock, 'GET', '/api/v1/openapi.json')).toHaveLength(0);
  });
});
