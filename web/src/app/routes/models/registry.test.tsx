import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const ENTRY = {
  id: '7',
  at: '2025-03-03T10:20:00Z',
  actorEmail: 'reviewer@quillmere.example',
  action: 'model_version.activated',
  target: 'model_version:22222222-2222-4222-8222-222222222222',
  details: { loopId: fakeLoop().id, loopTag: 'DIG-TEMP-301', versionNumber: 2 },
};

describe('models section', () => {
  it('lists every loop with its active version and what waits for review', async () => {
    const loops = [
      fakeLoop(),
      fakeLoop({
        id: '33333333-3333-4333-8333-333333333333',
        tag: 'AER-DO-101',
        activeVersionId: 'v',
        activeVersionNumber: 4,
        inReviewCount: 1,
        draftCount: 2,
      }),
    ];
    stubFetch({ ...signedInAs(['engineer']), 'GET /api/v1/loops': { body: loops } });
    renderApp('/models');
    const table = await screen.findByRole('table', { name: 'Model registry: loops and their model versions' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(within(rows[0]).getByRole('link', { name: 'AER-DO-101' }).getAttribute('href')).toBe(
      `/models/${loops[1].id}`,
    );
    expect(within(rows[0]).getByText('1 in review')).toBeTruthy();
    expect(within(rows[0]).getByText('2 drafts')).toBeTruthy();
    expect(within(rows[0]).getByRole('link', { name: 'version 4' })).toBeTruthy();
    expect(within(rows[1]).getByText('none active')).toBeTruthy();
  });

  it('gives engineers the audit log, naming loops and versions', async () => {
    stubFetch({ ...signedInAs(['engineer']), 'GET /api/v1/audit': { body: { items: [ENTRY], total: 1 } } });
    renderApp('/models/audit');
    expect(await screen.findByText('DIG-TEMP-301 · version 2')).toBeTruthy();
    expect(screen.getByRole('heading', { level: 1, name: 'Audit log' })).toBeTruthy();
  });

  it('shows a loop’s log from the audit entries of the loop and its versions', async () => {
    const loop = fakeLoop();
    const requested: string[] = [];
    stubFetch({
      ...signedInAs(['engineer']),
      [`GET /api/v1/loops/${loop.id}`]: { body: loop },
      'GET /api/v1/audit': ({ url }) => (
        requested.push(new URL(url, 'http://x').search),
        { body: { items: [ENTRY], total: 1 } }
      ),
    });
    renderApp(`/loops/${loop.id}/log`);
    expect(await screen.findByText('model_version.activated')).toBeTruthy();
    await waitFor(() => expect(requested).toContain(`?limit=50&offset=0&targetType=loop&targetId=${loop.id}`));
  });
});
