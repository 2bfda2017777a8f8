import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { MOVE_PREVIEW_CAUTION } from '../../../config/product';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { installFakeSocket } from '../../../test/fake-socket';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

const loop = fakeLoop({
  status: 'in_step',
  activeVersionId: '22222222-2222-4222-8222-222222222222',
  activeVersionNumber: 1,
  timeZone: 'Europe/London',
});
const at = (secondsAgo: number) => new Date(Math.round(Date.now() / 10_000) * 10_000 - secondsAgo * 1000).toISOString();
const trajectory = (values: number[]) => ({
  t: values.map((_, i) => at(-10 * (i + 1))),
  y: [values],
  x: [values, values, values],
});

function routes(moveBodies: unknown[]) {
  const base = `/api/v1/loops/${loop.id}`;
  return {
    ...signedInAs(['operator']),
    [`GET ${base}`]: { body: loop },
    [`GET ${base}/series`]: {
      body: {
        t: [at(20), at(10)],
        measured: [[35.1, 35.2]],
        predicted: [[35.0, 35.15]],
        residual: [[0.1, 0.05]],
        inputs: [[40, 41]],
        downsampled: false,
      },
    },
    [`GET ${base}/tracking`]: {
      body: {
        loopId: loop.id,
        status: 'in_step',
        lastReadingAt: at(10),
        worstBandFraction: 0.2,
        lastSlotAt: at(10),
        lastResidual: [0.05],
        residualCount: 40,
        residualMean: [0],
        residualSd: [0.1],
        band: [0.3],
      },
    },
    [`GET ${base}/forecast?n=60`]: {
      body: { loopId: loop.id, versionId: loop.activeVersionId, k: 1, u: [41], ...trajectory([35.2, 35.3, 35.4]) },
    },
    [`POST ${base}/move-preview`]: ({ init }: { init: RequestInit }) => {
      moveBodies.push(JSON.parse(String(init.body)));
      return {
        body: {
          loopId: loop.id,
          versionId: loop.activeVersionId,
          k: 1,
          u: [41],
          inputIndex: 0,
          delta: 5,
          ...trajectory([35.2, 35.6, 36.0]),
          baseline: trajectory([35.2, 35.3, 35.4]),
        },
      };
    },
  };
}

describe('the Trend tab', () => {
  it('reads out the newest values with units, follows live samples, forecasts and previews a move with the caution', async () => {
    const socket = installFakeSocket();
    const moves: unknown[] = [];
    stubFetch(routes(moves));
    renderApp(`/loops/${loop.id}`);
    const readout = await screen.findByRole('region', { name: 'Readout' });
    await waitFor(() => expect(within(readout).getByText('35.2 °C')).toBeTruthy());
    expect(within(readout).getByText('41 %')).toBeTruthy();
    expect(
      within(readout).getByText(/^Newest values, \d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} (GMT|BST|GMT\+1)/),
    ).toBeTruthy();
    expect(screen.getByRole('button', { name: '15 min' }).getAttribute('aria-pressed')).toBe('true');
    expect(screen.getByRole('figure', { name: 'sludge temperature (°C)' })).toBeTruthy();

    const forecast = screen.getByRole('region', { name: 'Next 60 samples' });
    expect(within(forecast).getByText('Model prediction, not a measurement')).toBeTruthy();
    await waitFor(() => expect(within(forecast).getByText(/35.2 °C → 35.4 °C/)).toBeTruthy());

    await waitFor(() => expect(socket.watchedLoops()).toEqual([loop.id]));
    act(() =>
      socket.sample({
        loopId: loop.id,
        t: at(0),
        k: 2,
        predicted: [35.3],
        measured: [35.45],
        residual: [0.15],
        status: 'in_step',
      }),
    );
    await waitFor(() => expect(within(readout).getByText('35.45 °C')).toBeTruthy(), { timeout: 2500 });

    const move = screen.getByRole('region', { name: 'Try a move' });
    expect(within(move).getByText(MOVE_PREVIEW_CAUTION)).toBeTruthy();
    fireEvent.change(within(move).getByLabelText('Step added to the input (%)'), { target: { value: 'lots' } });
    fireEvent.click(within(move).getByRole('button', { name: 'Preview the move' }));
    expect(within(move).getByRole('alert').textContent).toMatch(/Enter a step size in %/);
    fireEvent.change(within(move).getByLabelText('Step added to the input (%)'), { target: { value: '5' } });
    fireEvent.click(within(move).getByRole('button', { name: 'Preview the move' }));
    await within(move).findByText('A step of +5 % in hot-water valve, after 60 samples:');
    expect(within(move).getByText(/^: 36 °C with the move, 35.4 °C held \(\+0.6 °C\)$/)).toBeTruthy();
    expect(moves).toEqual([{ inputIndex: 0, delta: 5, n: 60 }]);
  });
});
