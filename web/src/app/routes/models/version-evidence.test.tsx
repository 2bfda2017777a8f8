import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import {
  BACKTEST_ID,
  fakeBacktest,
  fakeEvidence,
  summaryOf,
  VERDICT,
} from '../../../features/backtests/testing/fake-backtests';
import { analysisRoutes as routesFor, LOOP } from '../../../test/analysis-routes';
import { bodyOf, stubFetch } from '../../../test/fake-api';
import { fakeVersion } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

describe('evidence on the review page', () => {
  it('shows the reviewer each attached backtest: verdict, fit and alerts against the active version, and a link', async () => {
    const version = fakeVersion({
      status: 'in_review',
      author: { email: 'engineer@quillmere.example', name: 'Tobias Renner' },
    });
    stubFetch(
      routesFor(version, 'reviewer@quillmere.example', {
        [`GET /api/v1/model-versions/${version.id}/evidence`]: { body: [fakeEvidence()] },
      }),
    );
    renderApp(`/models/versions/${version.id}`);
    const section = await screen.findByRole('region', { name: 'Evidence' });
    const item = await within(section).findByRole('article');
    expect(within(item).getByText(VERDICT)).toBeTruthy();
    expect(within(item).getByText('The week after the diffuser cleaning.')).toBeTruthy();
    const fits = within(item).getByRole('table', { name: 'Fit of version 1 against active version 3' });
    expect(
      within(fits)
        .getAllByRole('cell')
        .map((c) => c.textContent),
    ).toEqual([
      'dissolved oxygen',
      '91.2 % (active: 79.1 %)',
      '78.4 % (active: 79.1 %)',
      '0.041 mg/L (active: 0.098 mg/L)',
    ]);
    expect(item.textContent).toContain(
      'Its drift rules would have raised 2 alerts (2 a day); active version 3: 19 alerts (19 a day); the target is 6 a day.',
    );
    expect(within(item).getByRole('link', { name: 'Open the full backtest' }).getAttribute('href')).toBe(
      `/backtests/${BACKTEST_ID}`,
    );
    expect(screen.getByRole('button', { name: 'Approve' })).toBeTruthy();
  });

  it('says so when no backtest is attached', async () => {
    const version = fakeVersion({ status: 'in_review' });
    stubFetch(routesFor(version, 'reviewer@quillmere.example'));
    renderApp(`/models/versions/${version.id}`);
    const section = await screen.findByRole('region', { name: 'Evidence' });
    expect(await within(section).findByText(/^No backtest attached\./)).toBeTruthy();
  });

  it('lets the author tick finished backtests of the draft to attach when submitting', async () => {
    const version = fakeVersion();
    const versions = [
      { id: version.id, number: 1, status: 'draft', authorId: null },
      { id: '44444444-4444-4444-8444-000000000009', number: 0, status: 'active', authorId: null },
    ];
    const done = summaryOf(fakeBacktest({ loopId: LOOP.id, versions }));
    const other = {
      ...done,
      id: '66666666-6666-4666-8666-000000000002',
      attachedTo: [{ versionId: version.id, versionNumber: 1 }],
    };
    const failed = { ...done, id: '66666666-6666-4666-8666-000000000003', status: 'failed' as const };
    const notThisVersion = { ...done, id: '66666666-6666-4666-8666-000000000004', versions: versions.slice(1) };
    const bodies: unknown[] = [];
    stubFetch(
      routesFor(version, 'engineer@quillmere.example', {
        [`GET /api/v1/loops/${LOOP.id}/backtests`]: { body: [done, other, failed, notThisVersion] },
        [`POST /api/v1/model-versions/${version.id}/submit`]: ({ init }) => {
          bodies.push(bodyOf(init));
          return { body: { ...version, status: 'in_review' } };
        },
      }),
    );
    renderApp(`/models/versions/${version.id}`);
    const picker = await screen.findByRole('group', { name: 'Backtests to attach as evidence' });
    const boxes = within(picker).getAllByRole('checkbox') as HTMLInputElement[];
    expect(boxes).toHaveLength(2);
    expect(boxes.map((b) => [b.checked, b.disabled])).toEqual([
      [false, false],
      [true, true],
    ]);
    expect(within(picker).getByText(/\(attached\)/)).toBeTruthy();
    fireEvent.click(boxes[0]);
    fireEvent.click(screen.getByRole('button', { name: 'Submit for review' }));
    await waitFor(() => expect(bodies).toEqual([{ backtestIds: [BACKTEST_ID] }]));
  });
});
