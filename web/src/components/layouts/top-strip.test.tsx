import { act, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fakeAlert } from '../../features/alerts/testing/fake-alerts';
import { queriesTo, signedInAs, stubFetch } from '../../test/fake-api';
import { installFakeSocket } from '../../test/fake-socket';
import { renderApp } from '../../test/render-app';

const onCall = {
  at: '2025-06-03T09:00:00Z',
  primary: { id: 'u2', name: 'Rowan Vale', email: 'rowan@quillmere.example' },
  secondary: null,
  areas: [],
};

describe('the top strip and the waiting-alerts banner', () => {
  it('names who is on call and, for on-call users, counts the alerts waiting for acknowledgement', async () => {
    const socket = installFakeSocket();
    const fetchMock = stubFetch({
      ...signedInAs(['oncall']),
      'GET /api/v1/oncall/now': { body: onCall },
      'GET /api/v1/alerts': {
        body: [
          fakeAlert({ number: 61, raisedAt: new Date(Date.now() - 3 * 60_000).toISOString() }),
          fakeAlert({ number: 60, raisedAt: new Date(Date.now() - 20 * 60_000).toISOString() }),
        ],
      },
    });
    renderApp('/');
    const onCallLink = await screen.findByRole('link', { name: 'On call now: Rowan Vale' });
    const strip = onCallLink.closest('header') as HTMLElement;
    expect(onCallLink.getAttribute('href')).toBe('/rota');
    const count = await within(strip).findByRole('link', { name: '2 unacknowledged alerts' });
    expect(count.getAttribute('href')).toBe('/alerts?state=unacknowledged,returned_unacknowledged');
    expect(queriesTo(fetchMock, 'GET', '/api/v1/alerts')[0]?.get('state')).toBe(
      'unacknowledged,returned_unacknowledged',
    );

    const banner = screen.getByRole('status', { name: 'Alerts waiting for acknowledgement' });
    expect(banner.textContent).toContain('2 alerts wait for acknowledgement');
    expect(banner.textContent).toContain('most urgent: AER-DO-101 band, active, raised 3 minutes ago');

    act(() =>
      socket.alert(
        fakeAlert({ number: 61, state: 'acknowledged', raisedAt: new Date(Date.now() - 3 * 60_000).toISOString() }),
      ),
    );
    expect(await within(strip).findByRole('link', { name: '1 unacknowledged alert' })).toBeTruthy();
    expect(screen.getByRole('status', { name: 'Alerts waiting for acknowledgement' }).textContent).toContain(
      '1 alert waits for acknowledgement',
    );
  });

  it('says nobody is on call in words, and shows an operator no count and no banner', async () => {
    const fetchMock = stubFetch(signedInAs(['operator']));
    renderApp('/');
    const onCallLink = await screen.findByRole('link', { name: 'On call now: nobody' });
    const strip = onCallLink.closest('header') as HTMLElement;
    expect(within(strip).queryByRole('link', { name: /unacknowledged/ })).toBeNull();
    expect(screen.queryByRole('status', { name: 'Alerts waiting for acknowledgement' })).toBeNull();
    expect(queriesTo(fetchMock, 'GET', '/api/v1/alerts')).toHaveLength(0);
  });
});
