import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { errorBody, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { fakeLoop, fakeVersion } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

const LOOP = fakeLoop();
const VERSION = fakeVersion();
const SPREADSHEET = '0,98\t0,015\t0,004\r\n0,02\t0,95\t0\r\n0,01\t0\t0,97\r\n';

function paste(cell: HTMLElement, text: string) {
  fireEvent.paste(cell, { clipboardData: { getData: () => text } });
}

function routes(extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(['engineer']),
    [`GET /api/v1/loops/${LOOP.id}`]: { body: LOOP },
    'POST /api/v1/analysis': { body: VERSION.analysis },
    [`GET /api/v1/model-versions/${VERSION.id}`]: { body: VERSION },
    ...extra,
  };
}

describe('a new model version', () => {
  it('takes a block pasted from a spreadsheet at the focused cell, previews the verdict and saves a draft', async () => {
    const sent: unknown[] = [];
    stubFetch(
      routes({
        [`POST /api/v1/loops/${LOOP.id}/model-versions`]: ({ init }) => (
          sent.push(JSON.parse(String(init.body))),
          { status: 201, body: VERSION }
        ),
      }),
    );
    const { router } = renderApp(`/models/${LOOP.id}/new`);
    const matrixA = await screen.findByRole('table', { name: 'Matrix A' });
    expect(within(matrixA).getByRole('rowheader', { name: 'water temperature (°C)' })).toBeTruthy();

    paste(within(matrixA).getAllByRole('textbox')[0], SPREADSHEET);
    expect(screen.getByText('Pasted 9 values into A from row 1, column 1.')).toBeTruthy();
    expect((within(matrixA).getAllByRole('textbox')[1] as HTMLInputElement).value).toBe('0.015');

    const matrixB = screen.getByRole('table', { name: 'Matrix B' });
    paste(within(matrixB).getAllByRole('textbox')[0], '0\n0.05\n0\n9');
    expect(
      screen.getByText('Pasted 3 values into B from row 1, column 1. 1 value fell outside B and was left out.'),
    ).toBeTruthy();
    paste(within(screen.getByRole('table', { name: 'Matrix C' })).getAllByRole('textbox')[0], '1\t0\t0');

    expect(
      await screen.findByText(/The slowest mode, λ = 0\.99\d*, settles in about/, {}, { timeout: 3000 }),
    ).toBeTruthy();

    fireEvent.change(screen.getByLabelText('Change note'), { target: { value: 'Fit from the March step tests.' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as draft' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/models/versions/${VERSION.id}`));
    expect(sent[0]).toMatchObject({
      source: 'discrete',
      A: [
        [0.98, 0.015, 0.004],
        [0.02, 0.95, 0],
        [0.01, 0, 0.97],
      ],
      B: [[0], [0.05], [0]],
      C: [[1, 0, 0]],
    });
  });

  it('refuses a paste with text in it, saying where', async () => {
    stubFetch(routes());
    renderApp(`/models/${LOOP.id}/new`);
    const matrixA = await screen.findByRole('table', { name: 'Matrix A' });
    paste(within(matrixA).getAllByRole('textbox')[0], 'a\tb\n1\t2');
    expect(
      screen.getByText(
        /Nothing was pasted into A: row 1, column 1: “a” is not a number; row 1, column 2: “b” is not a number/,
      ),
    ).toBeTruthy();
  });

  it('lists what the server refused', async () => {
    stubFetch(
      routes({
        [`POST /api/v1/loops/${LOOP.id}/model-versions`]: {
          status: 400,
          body: errorBody('invalid_model', 'The model has 1 problem.', [
            { field: 'A.1.0', message: 'A[2][1] is not a finite number' },
          ]),
        },
      }),
    );
    renderApp(`/models/${LOOP.id}/new`);
    const matrixA = await screen.findByRole('table', { name: 'Matrix A' });
    paste(within(matrixA).getAllByRole('textbox')[0], SPREADSHEET);
    paste(within(screen.getByRole('table', { name: 'Matrix B' })).getAllByRole('textbox')[0], '0\n0.05\n0');
    paste(within(screen.getByRole('table', { name: 'Matrix C' })).getAllByRole('textbox')[0], '1\t0\t0');
    fireEvent.change(screen.getByLabelText('Change note'), { target: { value: 'x' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as draft' }));
    expect(await screen.findByText('A[2][1] is not a finite number')).toBeTruthy();
    expect(within(matrixA).getAllByRole('textbox')[3].getAttribute('aria-invalid')).toBe('true');
  });
});
