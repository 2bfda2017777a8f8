import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { bodyOf, queriesTo, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const rowan = { id: '66666666-6666-4666-8666-666666666661', name: 'Rowan Vale', email: 'rowan@quillmere.example' };
const priya = { id: '66666666-6666-4666-8666-666666666662', name: 'Priya Hallam', email: 'priya@quillmere.example' };
const tuesdayDay = {
  id: '77777777-7777-4777-8777-777777777771',
  user: rowan,
  area: 'aeration',
  position: 'primary',
  // 08:00 to 20:00 plant time (BST) on Tuesday 3 June 2025.
  startsAt: '2025-06-03T07:00:00Z',
  endsAt: '2025-06-03T19:00:00Z',
  note: '',
};
const plantNight = {
  id: '77777777-7777-4777-8777-777777777772',
  user: priya,
  area: null,
  position: 'secondary',
  startsAt: '2025-06-04T19:00:00Z',
  endsAt: '2025-06-05T07:00:00Z',
  note: 'covering for Sam',
};
const SETTINGS = {
  secondaryAfterMin: 10,
  areaAfterMin: 30,
  ackLinkTtlMin: 240,
  shelveMaxHours: 24,
  targetPerDay: 144,
  targetPer10Min: 1,
  floodPer10Min: 10,
};

function routes(roles: string[], extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    'GET /api/v1/loops': { body: [fakeLoop({ timeZone: 'Europe/London' })] },
    'GET /api/v1/areas': {
      body: [
        { id: 'aeration', name: 'Aeration' },
        { id: 'storage', name: 'Storage' },
      ],
    },
    'GET /api/v1/oncall/shifts': { body: [tuesdayDay, plantNight] },
    'GET /api/v1/oncall/people': { body: [rowan, priya] },
    'GET /api/v1/oncall/area-engineers': { body: [{ area: 'aeration', engineers: [priya] }] },
    'GET /api/v1/alert-settings': { body: SETTINGS },
    ...extra,
  };
}

const cell = (name: string) => screen.getByRole('cell', { name });

describe('the rota', () => {
  it('places each shift in its area row and day column, by plant time, with its position in words', async () => {
    const fetchMock = stubFetch(routes(['operator']));
    renderApp('/rota?week=2025-06-02');
    await screen.findByText('Rowan Vale · primary');
    const queries = queriesTo(fetchMock, 'GET', '/api/v1/oncall/shifts');
    expect(queries).toHaveLength(1);
    const query = queries[0];
    expect(query?.get('from')).toBe('2025-06-01T23:00:00.000Z');
    expect(query?.get('to')).toBe('2025-06-08T23:00:00.000Z');

    expect(within(cell('Aeration, Tue 3 Jun')).getByText('Rowan Vale · primary')).toBeTruthy();
    expect(within(cell('Aeration, Mon 2 Jun')).queryByText(/Rowan Vale/)).toBeNull();
    expect(within(cell('Plant-wide, Tue 3 Jun')).queryByText(/Rowan Vale/)).toBeNull();
    const block = within(cell('Aeration, Tue 3 Jun')).getByText('Rowan Vale · primary');
    expect((block as HTMLElement).style.left).toBe(`${(8 / 24) * 100}%`);
    expect((block as HTMLElement).style.width).toBe('50%');
    expect(within(cell('Plant-wide, Wed 4 Jun')).getByText('Priya Hallam · secondary …')).toBeTruthy();
    expect(within(cell('Plant-wide, Thu 5 Jun')).getByText('… Priya Hallam · secondary')).toBeTruthy();

    expect(screen.queryByRole('button', { name: 'Add a shift' })).toBeNull();
    expect(screen.getByText(/Changing the rota needs the on-call or administrator role/)).toBeTruthy();
    expect(screen.getByText('Priya Hallam')).toBeTruthy();
    expect(screen.getByText(/goes to the secondary on call after 10 min/)).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Next week' }));
    await waitFor(() =>
      expect(queriesTo(fetchMock, 'GET', '/api/v1/oncall/shifts').at(-1)?.get('from')).toBe('2025-06-08T23:00:00.000Z'),
    );
  });

  it('adds a shift in plant time for an on-call engineer', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['oncall'], {
        'POST /api/v1/oncall/shifts': ({ init }) => {
          bodies.push(bodyOf(init));
          return { status: 201, body: tuesdayDay };
        },
      }),
    );
    renderApp('/rota?week=2025-06-02');
    fireEvent.click(await screen.findByRole('button', { name: 'Add a shift' }));
    const dialog = screen.getByRole('dialog', { name: 'Add a shift' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Add the shift' }));
    expect(within(dialog).getByText('Choose who is on call.')).toBeTruthy();
    fireEvent.change(within(dialog).getByLabelText('Person'), { target: { value: priya.id } });
    fireEvent.change(within(dialog).getByLabelText('Area'), { target: { value: 'storage' } });
    fireEvent.click(within(dialog).getByLabelText(/^Secondary/));
    fireEvent.change(within(dialog).getByLabelText('Starts'), { target: { value: '2025-06-06T20:00' } });
    fireEvent.change(within(dialog).getByLabelText('Ends'), { target: { value: '2025-06-07T08:00' } });
    fireEvent.change(within(dialog).getByLabelText('Note (optional)'), { target: { value: 'weekend night' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Add the shift' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(bodies).toEqual([
      {
        userId: priya.id,
        area: 'storage',
        position: 'secondary',
        startsAt: '2025-06-06T19:00:00.000Z',
        endsAt: '2025-06-07T07:00:00.000Z',
        note: 'weekend night',
      },
    ]);
  });

  it('swaps a shift with another one', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['admin'], {
        [`POST /api/v1/oncall/shifts/${tuesdayDay.id}/swap`]: ({ init }) => {
          bodies.push(bodyOf(init));
          return { body: [tuesdayDay, plantNight] };
        },
      }),
    );
    renderApp('/rota?week=2025-06-02');
    fireEvent.click(await screen.findByRole('button', { name: /^Change the shift: Rowan Vale, primary/ }));
    const dialog = screen.getByRole('dialog', { name: 'Shift of Rowan Vale' });
    fireEvent.change(within(dialog).getByLabelText('Swap with…'), { target: { value: plantNight.id } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Swap the two shifts' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(bodies).toEqual([{ withShiftId: plantNight.id }]);
  });

  it('lets an administrator change the escalation timings in place', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['admin'], {
        'PUT /api/v1/alert-settings': ({ init }) => {
          bodies.push(bodyOf(init));
          return { body: { ...SETTINGS, secondaryAfterMin: 15 } };
        },
      }),
    );
    renderApp('/rota?week=2025-06-02');
    fireEvent.click(await screen.findByRole('button', { name: 'Change the timings' }));
    const form = screen.getByRole('form', { name: 'Escalation timings and targets' });
    fireEvent.change(within(form).getByLabelText('Call the secondary after (min)'), { target: { value: '30' } });
    fireEvent.click(within(form).getByRole('button', { name: 'Save the timings' }));
    expect(within(form).getByText('The area step must come after the secondary is called.')).toBeTruthy();
    fireEvent.change(within(form).getByLabelText('Call the secondary after (min)'), { target: { value: '15' } });
    fireEvent.click(within(form).getByRole('button', { name: 'Save the timings' }));
    expect(await screen.findByText(/goes to the secondary on call after 15 min/)).toBeTruthy();
    expect(bodies).toEqual([{ ...SETTINGS, secondaryAfterMin: 15 }]);
  });
});
