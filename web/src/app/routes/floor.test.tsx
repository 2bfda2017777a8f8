import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { signedInAs, stubFetch } from '../../test/fake-api';
import { installFakeSocket } from '../../test/fake-socket';
import { fakeLoop } from '../../test/registry-fixtures';
import { renderApp } from '../../test/render-app';

vi.mock('uplot', () => import('../../test/fake-uplot'));

const ids = {
  do: '00000000-0000-4000-8000-000000000001',
  level: '00000000-0000-4000-8000-000000000002',
  heat: '00000000-0000-4000-8000-000000000003',
};
const LOOPS = [
  // the list knows the registry; the twin's tracking (asked for per loop with a twin) says how it tracks
  fakeLoop({
    id: ids.do,
    tag: 'AER-DO-101',
    name: 'Basin 1 dissolved oxygen',
    area: 'aeration',
    areaName: 'Aeration',
    status: 'no_twin',
    activeVersionId: '22222222-2222-4222-8222-222222222222',
  }),
  fakeLoop({
    id: ids.heat,
    tag: 'AER-DO-102',
    name: 'Basin 2 dissolved oxygen',
    area: 'aeration',
    areaName: 'Aeration',
    status: 'diverged',
    activeVersionId: null,
    ...{ worstBandFraction: 1.6, lastReadingAt: null },
  }),
  fakeLoop({
    id: ids.level,
    tag: 'STO-LT-201',
    name: 'Storage tank levels',
    area: 'storage',
    areaName: 'Storage',
    status: 'stale',
    activeVersionId: null,
  }),
];
const EMPTY_SERIES = { t: [], measured: [[]], predicted: [[]], residual: [[]], inputs: [[]], downsampled: false };

function tileTags(): string[] {
  return screen
    .getAllByRole('link')
    .filter((l) => l.getAttribute('href')?.startsWith('/loops/0'))
    .map((l) => within(l).getAllByText(/^[A-Z]{3}-/)[0].textContent ?? '');
}

describe('the Floor', () => {
  it('shows every loop as a tile by area, worst residual first, with status words and reading age', async () => {
    const socket = installFakeSocket();
    stubFetch({
      ...signedInAs(['operator']),
      'GET /api/v1/loops': { body: LOOPS },
      'GET /api/v1/areas': {
        body: [
          { id: 'aeration', name: 'Aeration' },
          { id: 'storage', name: 'Storage' },
        ],
      },
      ...Object.fromEntries(Object.values(ids).map((id) => [`GET /api/v1/loops/${id}/series`, { body: EMPTY_SERIES }])),
      [`GET /api/v1/loops/${ids.do}/tracking`]: {
        body: {
          loopId: ids.do,
          status: 'in_step',
          lastReadingAt: new Date(Date.now() - 3000).toISOString(),
          worstBandFraction: 0.38,
          lastSlotAt: null,
          lastResidual: [0.1],
          residualCount: 40,
          residualMean: [0],
          residualSd: [0.1],
          band: [0.3],
        },
      },
    });
    renderApp('/');
    await screen.findByRole('heading', { level: 2, name: /Aeration/ });
    expect(tileTags()).toEqual(['AER-DO-102', 'AER-DO-101', 'STO-LT-201']);
    const first = screen.getByRole('link', { name: 'AER-DO-101 Basin 1 dissolved oxygen' });
    expect(within(first).getByText('in step')).toBeTruthy();
    expect(within(first).getByText('Residual 38 % of band')).toBeTruthy();
    expect(within(first).getByText(/^Last reading \d s ago$/)).toBeTruthy();
    expect(first.getAttribute('href')).toBe(`/loops/${ids.do}`);
    expect(screen.getByText('Residual 160 % of band — outside the band')).toBeTruthy();
    expect(screen.getByText('3 loops: 1 diverged, 1 stale, 1 in step')).toBeTruthy();
    await waitFor(() => expect(socket.watchedLoops().sort()).toEqual(Object.values(ids).sort()));
    expect(socket.watchedAreas().sort()).toEqual(['aeration', 'storage']);

    act(() =>
      socket.sample({
        loopId: ids.level,
        t: new Date().toISOString(),
        k: 1,
        predicted: [1],
        measured: [1.2],
        residual: [0.2],
        status: 'in_step',
      }),
    );
    act(() =>
      socket.status({
        loopId: ids.level,
        area: 'storage',
        status: 'in_step',
        previousStatus: 'stale',
        at: new Date().toISOString(),
        lastReadingAt: new Date().toISOString(),
        worstBandFraction: 0.1,
      }),
    );
    const tank = screen.getByRole('link', { name: 'STO-LT-201 Storage tank levels' });
    await waitFor(() => expect(within(tank).getByText('in step')).toBeTruthy());
    expect(within(tank).getByText('1.2 °C')).toBeTruthy();

    fireEvent.change(screen.getByRole('combobox', { name: 'Tracking status' }), { target: { value: 'diverged' } });
    await waitFor(() => expect(tileTags()).toEqual(['AER-DO-102']));
  });
});
