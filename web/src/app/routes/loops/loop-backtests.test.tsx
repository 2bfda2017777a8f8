import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import {
  ACTIVE_ID,
  BACKTEST_ID,
  CANDIDATE_ID,
  DO_LOOP,
  fakeBacktest,
  runningBacktest,
  summaryOf,
  VERDICT,
} from '../../../features/backtests/testing/fake-backtests';
import { bodyOf, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { fakeVersion } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

const loopPath = `/api/v1/loops/${DO_LOOP.id}`;
const versions = [
  fakeVersion({ id: '44444444-4444-4444-8444-000000000005', loopId: DO_LOOP.id, number: 5, status: 'rejected' }),
  fakeVersion({ id: CANDIDATE_ID, loopId: DO_LOOP.id, number: 4, status: 'draft' }),
  fakeVersion({ id: ACTIVE_ID, loopId: DO_LOOP.id, number: 3, status: 'active' }),
  fakeVersion({ id: '44444444-4444-4444-8444-000000000002', loopId: DO_LOOP.id, number: 2, status: 'retired' }),
];

function routes(roles: string[], extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    [`GET ${loopPath}`]: { body: DO_LOOP },
    [`GET ${loopPath}/model-versions`]: { body: versions },
    [`GET ${loopPath}/backtests`]: { body: [] },
    [`GET /api/v1/backtests/${BACKTEST_ID}`]: { body: runningBacktest(0, 'waiting') },
    ...extra,
  };
}

const checkbox = (name: string) => screen.getByRole('checkbox', { name: new RegExp(`^${name}`) }) as HTMLInputElement;

describe('the Backtests tab of a loop', () => {
  it('says what a backtest is for, ticks the active version and the newest draft, and starts one over the last 7 days', async () => {
    const starts: unknown[] = [];
    stubFetch(
      routes(['engineer'], {
        [`POST ${loopPath}/backtests`]: ({ init }) => {
          starts.push(bodyOf(init));
          return { status: 202, body: { id: BACKTEST_ID, status: 'queued', upload: null } };
        },
      }),
    );
    const { router } = renderApp(`/loops/${DO_LOOP.id}/backtests`);
    expect(await screen.findByRole('region', { name: 'No backtests yet' })).toBeTruthy();
    const panel = screen.getByRole('region', { name: 'New backtest' });
    await waitFor(() => expect(checkbox('Version 4').checked).toBe(true));
    expect(checkbox('Version 3').checked).toBe(true);
    expect(checkbox('Version 5').checked).toBe(false);
    expect(checkbox('Version 2').checked).toBe(false);

    fireEvent.click(within(panel).getByRole('button', { name: 'Last 7 days' }));
    fireEvent.click(within(panel).getByRole('button', { name: 'Start backtest' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/backtests/${BACKTEST_ID}`));
    const body = starts[0] as { versionIds: string[]; from: string; to: string };
    expect(body.versionIds).toEqual([CANDIDATE_ID, ACTIVE_ID]);
    // The quick pick ends now and starts 7 × 24 h earlier (whole minutes on the plant clock).
    expect(Date.parse(body.to) - Date.parse(body.from)).toBe(7 * 86_400_000);
    expect(Math.abs(Date.parse(body.to) - Date.now())).toBeLessThan(120_000);
    expect(await screen.findByRole('progressbar', { name: 'Backtest progress' })).toBeTruthy();
  });

  it('refuses a range that ends before it starts, and a backtest without versions', async () => {
    const fetchMock = stubFetch(routes(['engineer']));
    renderApp(`/loops/${DO_LOOP.id}/backtests`);
    const panel = await screen.findByRole('region', { name: 'New backtest' });
    await waitFor(() => expect(checkbox('Version 4').checked).toBe(true));
    fireEvent.change(within(panel).getByLabelText('From'), { target: { value: '2025-06-02T10:00' } });
    fireEvent.change(within(panel).getByLabelText('To'), { target: { value: '2025-06-01T10:00' } });
    fireEvent.click(within(panel).getByRole('button', { name: 'Start backtest' }));
    expect(await within(panel).findByText('The start must be before the end.')).toBeTruthy();

    fireEvent.change(within(panel).getByLabelText('To'), { target: { value: '2025-06-03T10:00' } });
    fireEvent.click(checkbox('Version 4'));
    fireEvent.click(checkbox('Version 3'));
    fireEvent.click(within(panel).getByRole('button', { name: 'Start backtest' }));
    expect(await within(panel).findByText('Tick at least one model version to replay.')).toBeTruthy();
    const posts = fetchMock.mock.calls.filter(([, init]) => (init as RequestInit | undefined)?.method === 'POST');
    expect(posts).toEqual([]);
  });

  it('uploads a CSV through the preview and the column mapping, sending versions and mapping before the file', async () => {
    let sent: FormData | null = null;
    stubFetch(
      routes(['engineer'], {
        [`POST ${loopPath}/readings/import/preview`]: {
          body: {
            header: ['time', 'blower', 'DO'],
            rows: [['2025-06-01T00:00:00Z', '61.5', '2.03']],
            suggestedMapping: null,
          },
        },
        [`POST ${loopPath}/backtests`]: ({ init }) => {
          sent = init.body as FormData;
          return { status: 202, body: { id: BACKTEST_ID, status: 'queued', upload: null } };
        },
      }),
    );
    const { router } = renderApp(`/loops/${DO_LOOP.id}/backtests`);
    await waitFor(() => expect(checkbox('Version 4').checked).toBe(true));
    fireEvent.click(screen.getByRole('radio', { name: 'Upload a CSV' }));
    const file = new File(['time,blower,DO\n2025-06-01T00:00:00Z,61.5,2.03\n'], 'week-23.csv', { type: 'text/csv' });
    fireEvent.change(screen.getByLabelText('CSV file of readings for the backtest'), { target: { files: [file] } });
    const rows = await screen.findByRole('region', { name: 'First rows of the file' });
    expect(within(rows).getByText('2.03')).toBeTruthy();

    fireEvent.change(screen.getByRole('combobox', { name: 'Time' }), { target: { value: '0' } });
    fireEvent.change(screen.getByRole('combobox', { name: 'Input: blower speed' }), { target: { value: '1' } });
    fireEvent.change(screen.getByRole('combobox', { name: 'Output: dissolved oxygen' }), { target: { value: '2' } });
    const mapping = screen.getByRole('form', { name: 'Column mapping' });
    fireEvent.submit(mapping);
    await waitFor(() => expect(router.state.location.pathname).toBe(`/backtests/${BACKTEST_ID}`));
    const form = sent as unknown as FormData;
    expect([...form.keys()]).toEqual(['versionIds', 'mapping', 'file']);
    expect(JSON.parse(String(form.get('versionIds')))).toEqual([CANDIDATE_ID, ACTIVE_ID]);
    expect(JSON.parse(String(form.get('mapping')))).toEqual({ t: 0, u: [1], y: [2] });
    expect((form.get('file') as File).name).toBe('week-23.csv');
  });

  it('lists backtests with status words, a running one with its progress and Cancel', async () => {
    const cancels: string[] = [];
    const running = { ...runningBacktest(0.42, 'replaying version 4'), id: '66666666-6666-4666-8666-000000000002' };
    stubFetch(
      routes(['engineer'], {
        [`GET ${loopPath}/backtests`]: { body: [summaryOf(running), summaryOf(fakeBacktest())] },
        [`POST /api/v1/backtests/${running.id}/cancel`]: () => {
          cancels.push(running.id);
          return { body: { ...running, cancelRequested: true } };
        },
      }),
    );
    renderApp(`/loops/${DO_LOOP.id}/backtests`);
    const table = await screen.findByRole('table', { name: 'Backtests of this loop, newest first' });
    const [, runningRow, doneRow] = within(table).getAllByRole('row');
    expect(within(runningRow).getByText('running')).toBeTruthy();
    expect(within(runningRow).getByText('42 % · replaying version 4')).toBeTruthy();
    expect(within(doneRow).getByText('done')).toBeTruthy();
    expect(within(doneRow).getByText(VERDICT)).toBeTruthy();
    expect(within(doneRow).getByText('2025-06-01 01:00 BST to 2025-06-02 01:00 BST')).toBeTruthy();
    expect(within(doneRow).getByRole('link', { name: 'Versions 3 and 4' }).getAttribute('href')).toBe(
      `/backtests/${BACKTEST_ID}`,
    );
    fireEvent.click(within(runningRow).getByRole('button', { name: /^Cancel the backtest of versions 3 and 4/ }));
    await waitFor(() => expect(cancels).toEqual([running.id]));
  });

  it('shows an operator the list read-only, without the panel or Cancel', async () => {
    const running = { ...runningBacktest(0.1, 'reading the recording'), id: '66666666-6666-4666-8666-000000000002' };
    stubFetch(routes(['operator'], { [`GET ${loopPath}/backtests`]: { body: [summaryOf(running)] } }));
    renderApp(`/loops/${DO_LOOP.id}/backtests`);
    expect(await screen.findByText('10 % · reading the recording')).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'New backtest' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Cancel/ })).toBeNull();
  });

  it('tells an operator who starts backtests when there are none', async () => {
    stubFetch(routes(['operator']));
    renderApp(`/loops/${DO_LOOP.id}/backtests`);
    const empty = await screen.findByRole('region', { name: 'No backtests yet' });
    expect(within(empty).getByText(/Control engineers start backtests/)).toBeTruthy();
  });
});
