import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { queriesTo, signedInAs, stubFetch } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

const LOAD = {
  from: '2025-05-27T10:00:00Z',
  to: '2025-06-03T10:00:00Z',
  targets: { perDay: 144, per10Min: 1, floodPer10Min: 10 },
  perDay: [
    { day: '2025-06-02', count: 3 },
    { day: '2025-06-03', count: 12 },
  ],
  per10Min: [{ start: '2025-06-03T09:10:00Z', count: 12 }],
  windowsOverTargetPercent: 0.1,
  floods: [{ start: '2025-06-03T09:10:00Z', end: '2025-06-03T09:20:00Z', count: 12 }],
  chattering: [{ alertId: 'aaaaaaaa-aaaa-4aaa-8aaa-000000000001', loopTag: 'AER-DO-101', rule: 'band', repeats: 4 }],
  stale: [],
  topLoops: [
    { loopId: '33333333-3333-4333-8333-333333333333', loopTag: 'AER-DO-101', loopName: 'Aeration DO', count: 14 },
  ],
  meanTimeToAcknowledgeS: 270,
  total: 15,
};

describe('the alert-load report', () => {
  it('asks for the last 7 days, reads the report out and links its CSV', async () => {
    const fetchMock = stubFetch({ ...signedInAs(['operator']), 'GET /api/v1/alerts/load': { body: LOAD } });
    renderApp('/alerts/load');
    expect(await screen.findByText('4.5 min')).toBeTruthy();
    const query = queriesTo(fetchMock, 'GET', '/api/v1/alerts/load')[0];
    const span = Date.parse(query?.get('to') ?? '') - Date.parse(query?.get('from') ?? '');
    expect(span).toBe(7 * 86_400_000);
    expect(screen.getByText('15 activations')).toBeTruthy();
    expect(screen.getByRole('figure', { name: 'Alerts per day (UTC days)' })).toBeTruthy();
    expect(screen.getByText('0.1 % of 10-minute windows over the target of 1.')).toBeTruthy();
    const floods = screen.getByRole('table', { name: 'Floods' });
    expect(within(floods).getByText('12')).toBeTruthy();
    expect(screen.getByText('No alert has been active for longer than a day.')).toBeTruthy();
    const top = screen.getByRole('table', { name: 'The ten loops raising most' });
    expect(within(top).getByRole('link', { name: 'AER-DO-101' }).getAttribute('href')).toBe(
      '/loops/33333333-3333-4333-8333-333333333333/alerts',
    );
    const csv = screen.getByRole('link', { name: 'Download CSV' }).getAttribute('href') ?? '';
    expect(csv).toBe(
      `/api/v1/alerts/load.csv?from=${encodeURIComponent(query?.get('from') ?? '')}&to=${encodeURIComponent(query?.get('to') ?? '')}`,
    );

    fireEvent.click(screen.getByRole('button', { name: '30 days' }));
    await waitFor(() => {
      const latest = queriesTo(fetchMock, 'GET', '/api/v1/alerts/load').at(-1);
      expect(Date.parse(latest?.get('to') ?? '') - Date.parse(latest?.get('from') ?? '')).toBe(30 * 86_400_000);
    });
  });
});
