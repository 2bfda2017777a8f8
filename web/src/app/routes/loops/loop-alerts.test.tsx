import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AERATION_LOOP_ID, fakeAlert } from '../../../features/alerts/testing/fake-alerts';
import { bodyOf, queriesTo, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const loop = fakeLoop({ id: AERATION_LOOP_ID, tag: 'AER-DO-101', timeZone: 'Europe/London' });

function routes(roles: string[], extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    [`GET /api/v1/loops/${loop.id}`]: { body: { ...loop, maintenance: false } },
    [`GET /api/v1/loops/${loop.id}/alert-suppressions`]: {
      body: [
        {
          id: 1,
          loopId: loop.id,
          rule: 'band',
          at: '2025-06-01T12:00:00Z',
          summary: 'Dissolved oxygen left its band during diffuser cleaning.',
          detail: {},
        },
      ],
    },
    'GET /api/v1/alerts': {
      body: [
        fakeAlert({ number: 51, raisedAt: '2025-06-03T10:00:00Z' }),
        fakeAlert({
          number: 50,
          state: 'acknowledged',
          active: false,
          clearedAt: '2025-06-02T10:04:00Z',
          raisedAt: '2025-06-02T10:00:00Z',
          acknowledgedAt: '2025-06-02T10:02:00Z',
          acknowledgedBy: { id: 'u2', name: 'Rowan Vale', email: 'rowan@quillmere.example' },
        }),
      ],
    },
    ...extra,
  };
}

describe('the Alerts tab of a loop', () => {
  it("lists the loop's alerts newest first with who acknowledged them", async () => {
    const fetchMock = stubFetch(routes(['operator']));
    renderApp(`/loops/${loop.id}/alerts`);
    const table = await screen.findByRole('table', { name: 'Alerts of AER-DO-101, newest first' });
    await within(table).findByRole('link', { name: 'Alert 51' });
    const rows = within(table).getAllByRole('row');
    expect(within(rows[1]).getByRole('link', { name: 'Alert 51' }).getAttribute('href')).toMatch(/^\/alerts\//);
    expect(within(rows[2]).getByText('Rowan Vale')).toBeTruthy();
    expect(within(rows[2]).getByText('4 min, then cleared')).toBeTruthy();
    expect(within(table).queryByRole('columnheader', { name: 'Loop' })).toBeNull();
    expect(queriesTo(fetchMock, 'GET', '/api/v1/alerts').some((q) => q.get('loopId') === loop.id)).toBe(true);
    expect(screen.queryByRole('region', { name: 'Maintenance' })).toBeNull();
    const recorded = await screen.findByRole('table', { name: 'Raises recorded during maintenance' });
    expect(within(recorded).getByText('Dissolved oxygen left its band during diffuser cleaning.')).toBeTruthy();
  });

  it('puts the loop into maintenance with a note, for an engineer', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['engineer'], {
        [`PUT /api/v1/loops/${loop.id}/maintenance`]: ({ init }) => {
          bodies.push(bodyOf(init));
          return { body: { loopId: loop.id, loopTag: loop.tag, maintenance: true } };
        },
      }),
    );
    renderApp(`/loops/${loop.id}/alerts`);
    const section = await screen.findByRole('region', { name: 'Maintenance' });
    expect(within(section).getByText(/AER-DO-101 is in normal service/)).toBeTruthy();
    fireEvent.click(within(section).getByRole('button', { name: 'Put into maintenance' }));
    expect(within(section).getByText('Say why, for example the work order.')).toBeTruthy();
    fireEvent.change(within(section).getByLabelText('Why'), { target: { value: 'WO-4411 diffuser cleaning' } });
    fireEvent.click(within(section).getByRole('button', { name: 'Put into maintenance' }));
    await waitFor(() => expect(within(section).getByText(/AER-DO-101 is in maintenance/)).toBeTruthy());
    expect(bodies).toEqual([{ maintenance: true, note: 'WO-4411 diffuser cleaning' }]);
    expect(within(section).getByRole('button', { name: 'Back to normal service' })).toBeTruthy();
  });
});
