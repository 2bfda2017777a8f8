import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { fakeLoop, fakeVersion } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

describe('the Twin model tab of a loop', () => {
  it('shows an operator the active version, who approved it and the correction in use', async () => {
    const version = fakeVersion({
      status: 'active',
      number: 3,
      reviewer: { email: 'reviewer@quillmere.example', name: 'Priya Hallam' },
      reviewedAt: '2025-03-03T10:15:00Z',
      activatedAt: '2025-03-03T10:20:00Z',
    });
    const loop = fakeLoop({ activeVersionId: version.id, activeVersionNumber: 3, status: 'in_step' });
    stubFetch({
      ...signedInAs(['operator']),
      [`GET /api/v1/loops/${loop.id}`]: { body: loop },
      [`GET /api/v1/model-versions/${version.id}`]: { body: version },
    });
    renderApp(`/loops/${loop.id}/model`);
    expect(await screen.findByRole('heading', { name: "Version 3 is the twin's model" })).toBeTruthy();
    expect(screen.getByText('Priya Hallam, 2025-03-03 10:15 GMT')).toBeTruthy();
    expect(screen.getByText('First fit from the March step tests.')).toBeTruthy();
    expect(screen.getByText('Free run.')).toBeTruthy();
    expect(screen.getByRole('region', { name: 'Verdict' }).textContent).toMatch(/^Stable\./);
    expect(screen.queryByRole('link', { name: /full analysis/ })).toBeNull();
    expect(screen.queryByRole('link', { name: 'Log' })).toBeNull();
  });

  it('says how a twin model gets there when none is active', async () => {
    const loop = fakeLoop();
    stubFetch({ ...signedInAs(['operator']), [`GET /api/v1/loops/${loop.id}`]: { body: loop } });
    renderApp(`/loops/${loop.id}/model`);
    expect(await screen.findByRole('heading', { name: 'No twin model is active' })).toBeTruthy();
  });
});
