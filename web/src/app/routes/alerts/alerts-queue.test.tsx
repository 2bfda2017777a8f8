import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AERATION_LOOP_ID, fakeAlert } from '../../../features/alerts/testing/fake-alerts';
import { bodyOf, queriesTo, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { installFakeSocket } from '../../../test/fake-socket';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const aeration = fakeLoop({
  id: AERATION_LOOP_ID,
  tag: 'AER-DO-101',
  name: 'Aeration basin dissolved oxygen',
  area: 'aeration',
  areaName: 'Aeration',
});
const storage = fakeLoop({ id: '44444444-4444-4444-8444-444444444444', tag: 'STO-LT-201', area: 'storage' });

function routes(roles: string[], extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    'GET /api/v1/loops': { body: [aeration, storage] },
    'GET /api/v1/areas': {
      body: [
        { id: 'aeration', name: 'Aeration' },
        { id: 'storage', name: 'Storage' },
      ],
    },
    ...extra,
  };
}

const lastQuery = (fetchMock: Parameters<typeof queriesTo>[0]) => queriesTo(fetchMock, 'GET', '/api/v1/alerts').at(-1);

describe('the alert queue', () => {
  it('asks for what the filters in the address say, and keeps changes in the address', async () => {
    const fetchMock = stubFetch(routes(['operator'], { 'GET /api/v1/alerts': { body: [fakeAlert({ number: 7 })] } }));
    const { router } = renderApp('/alerts?state=unacknowledged,returned_unacknowledged&priority=1,2&area=aeration');
    expect(await screen.findByRole('link', { name: 'Alert 7' })).toBeTruthy();
    const first = lastQuery(fetchMock);
    expect(first?.get('state')).toBe('unacknowledged,returned_unacknowledged');
    expect(first?.get('priority')).toBe('1,2');
    expect(first?.get('area')).toBe('aeration');
    expect(first?.get('from')).toBeNull();

    const filters = screen.getByRole('search', { name: 'Filter the alerts' });
    fireEvent.change(within(filters).getByLabelText('State'), { target: { value: 'all' } });
    await waitFor(() => expect(lastQuery(fetchMock)?.get('state')).toBeNull());
    fireEvent.click(within(filters).getByLabelText('P3 low'));
    await waitFor(() => expect(lastQuery(fetchMock)?.get('priority')).toBe('1,2,3'));
    fireEvent.change(within(filters).getByLabelText('Loop'), { target: { value: AERATION_LOOP_ID } });
    await waitFor(() => expect(lastQuery(fetchMock)?.get('loopId')).toBe(AERATION_LOOP_ID));
    fireEvent.change(within(filters).getByLabelText('Time'), { target: { value: '24h' } });
    await waitFor(() => expect(lastQuery(fetchMock)?.get('from')).not.toBeNull());
    const from = Date.parse(lastQuery(fetchMock)?.get('from') ?? '');
    expect(Math.abs(Date.now() - 24 * 3_600_000 - from)).toBeLessThan(2 * 60_000);

    const search = new URLSearchParams(router.state.location.search);
    expect(search.get('state')).toBe('all');
    expect(search.get('priority')).toBe('1,2,3');
    expect(search.get('loop')).toBe(AERATION_LOOP_ID);
    expect(search.get('range')).toBe('24h');
  });

  it('asks for the open alerts when the address says nothing, and says what will appear when there are none', async () => {
    const fetchMock = stubFetch(routes(['operator']));
    renderApp('/alerts');
    expect(await screen.findByRole('heading', { name: 'No open alerts' })).toBeTruthy();
    expect(lastQuery(fetchMock)?.get('state')).toBe('open');
    expect(screen.queryByRole('button', { name: 'Acknowledge selected' })).toBeNull();
    expect(screen.getByText('Acknowledging, shelving and closing alerts needs the on-call role.')).toBeTruthy();
  });

  it('acknowledges the ticked alerts and names the ones the server skipped, with its reason', async () => {
    const first = fakeAlert({ number: 11 });
    const second = fakeAlert({ number: 12, loopTag: 'STO-LT-201', rule: 'cusum', state: 'returned_unacknowledged' });
    const done = fakeAlert({ number: 13, state: 'acknowledged' });
    const posted: unknown[] = [];
    stubFetch(
      routes(['oncall'], {
        'GET /api/v1/alerts': { body: [first, second, done] },
        'POST /api/v1/alerts/acknowledge': ({ init }) => {
          posted.push(bodyOf(init));
          return {
            body: {
              acknowledged: [first.id],
              skipped: [{ id: second.id, reason: 'already acknowledged by Rowan Vale' }],
            },
          };
        },
      }),
    );
    renderApp('/alerts');
    const table = await screen.findByRole('table', { name: /^Alerts, most urgent first/ });
    await within(table).findByRole('link', { name: 'Alert 11' });
    expect(within(table).queryByRole('checkbox', { name: 'Select alert 13' })).toBeNull();
    fireEvent.click(within(table).getByRole('checkbox', { name: 'Select every waiting alert shown' }));
    expect(screen.getByText('2 alerts selected')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Note for the timeline (optional)'), { target: { value: 'on my way' } });
    fireEvent.click(screen.getByRole('button', { name: 'Acknowledge selected' }));

    const result = await screen.findByText('Acknowledged 1 alert.');
    expect(posted).toEqual([{ ids: [first.id, second.id], note: 'on my way' }]);
    const message = result.closest('[role="status"]') as HTMLElement;
    expect(within(message).getByText('alert 12 (STO-LT-201 CUSUM): already acknowledged by Rowan Vale')).toBeTruthy();
  });

  it('adds a raised alert pushed over the socket without asking again', async () => {
    const socket = installFakeSocket();
    const fetchMock = stubFetch(routes(['operator'], { 'GET /api/v1/alerts': { body: [fakeAlert({ number: 21 })] } }));
    renderApp('/alerts');
    const table = await screen.findByRole('table', { name: /^Alerts, most urgent first/ });
    await within(table).findByRole('link', { name: 'Alert 21' });
    const asked = queriesTo(fetchMock, 'GET', '/api/v1/alerts').length;
    act(() => socket.alert(fakeAlert({ number: 22, raisedAt: '2025-06-03T10:00:00Z' }), 'raised'));
    expect(await within(table).findByRole('link', { name: 'Alert 22' })).toBeTruthy();
    const links = within(table).getAllByRole('link', { name: /^Alert \d+$/ });
    expect(links.map((link) => link.textContent)).toEqual(['Alert 22', 'Alert 21']);
    act(() => socket.alert(fakeAlert({ number: 22, raisedAt: '2025-06-03T10:00:00Z', state: 'closed' })));
    await waitFor(() => expect(within(table).queryByRole('link', { name: 'Alert 22' })).toBeNull());
    expect(queriesTo(fetchMock, 'GET', '/api/v1/alerts').length).toBe(asked);
  });

  it('explains an acknowledge link that was not valid', async () => {
    stubFetch(routes(['oncall']));
    renderApp('/alerts?ack=invalid');
    const banner = await screen.findByRole('status', { name: 'Acknowledge link' });
    expect(banner.textContent).toContain('That acknowledge link is not valid');
  });
});
