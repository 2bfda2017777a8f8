import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import {
  BACKTEST_ID,
  CANDIDATE_ID,
  DO_LOOP,
  fakeBacktest,
  runningBacktest,
  VERDICT,
} from '../../../features/backtests/testing/fake-backtests';
import { BACKTEST_CAUTION } from '../../../features/backtests/utils/backtest-words';
import { CORRECTION_WORDS } from '../../../features/models/components/correction-words';
import { bodyOf, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';
import type { Backtest } from '../../../features/backtests/types';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

const path = `/api/v1/backtests/${BACKTEST_ID}`;

function routes(roles: string[], backtest: Backtest | (() => Backtest), extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    [`GET /api/v1/loops/${DO_LOOP.id}`]: { body: DO_LOOP },
    [`GET ${path}`]: () => ({ body: typeof backtest === 'function' ? backtest() : backtest }),
    ...extra,
  };
}

describe('the page of a backtest', () => {
  it('polls a running job every second, with its stage words and Cancel, until it is cancelled', async () => {
    let current = runningBacktest(0.42, 'replaying version 4');
    const cancels: number[] = [];
    stubFetch(
      routes(['engineer'], () => current, {
        [`POST ${path}/cancel`]: () => {
          cancels.push(1);
          current = { ...current, cancelRequested: true };
          return { body: current };
        },
      }),
    );
    renderApp(`/backtests/${BACKTEST_ID}`);
    expect(
      await screen.findByRole('heading', {
        level: 1,
        name: 'Backtest · AER-DO-101 · 2025-06-01 01:00 BST to 2025-06-02 01:00 BST',
      }),
    ).toBeTruthy();
    const progress = screen.getByRole('region', { name: 'Progress' });
    expect(within(progress).getByRole('progressbar').getAttribute('value')).toBe('42');
    expect(within(progress).getByText('42 % · replaying version 4')).toBeTruthy();

    current = runningBacktest(0.61, 'replaying version 3');
    expect(await within(progress).findByText('61 % · replaying version 3', {}, { timeout: 3000 })).toBeTruthy();

    fireEvent.click(within(progress).getByRole('button', { name: 'Cancel' }));
    expect(await within(progress).findByText('Cancelling: the job stops at its next step.')).toBeTruthy();
    expect(cancels).toEqual([1]);
    current = { ...current, status: 'cancelled' };
    expect(await screen.findByText('This backtest was cancelled', {}, { timeout: 3000 })).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'Progress' })).toBeNull();
  });

  it('reads the results out: verdict and caution, both replays per version, whiteness, rules and suggestions', async () => {
    const backtest = fakeBacktest();
    stubFetch(routes(['operator'], backtest));
    renderApp(`/backtests/${BACKTEST_ID}`);

    const verdict = await screen.findByRole('region', { name: 'Verdict' });
    expect(within(verdict).getByText(VERDICT)).toBeTruthy();
    expect(within(verdict).getByText('the candidate is better')).toBeTruthy();
    expect(within(verdict).getByText(BACKTEST_CAUTION)).toBeTruthy();
    // fitDelta 91.2 − 79.1 = 12.1 points one step ahead; 78.4 − 79.1 = −0.7 in free run.
    const deltas = within(verdict).getByRole('table', { name: 'Fit difference per output, candidate − active' });
    expect(within(deltas).getByRole('cell', { name: '+12 points' })).toBeTruthy();
    expect(within(deltas).getByRole('cell', { name: '−0.7 points' })).toBeTruthy();

    const cards = screen.getAllByRole('region', { name: /^Version \d$/ });
    expect(cards.map((c) => c.getAttribute('aria-label'))).toEqual(['Version 4', 'Version 3']);
    const [candidate, active] = cards;
    expect(within(candidate).getByText(/fit = 100·\(1 − ‖y − ŷ‖ \/ ‖y − ȳ‖\), Ljung/)).toBeTruthy();
    expect(within(candidate).getByText(CORRECTION_WORDS.kalman.explanation, { exact: false })).toBeTruthy();
    const oneStep = within(candidate).getByRole('table', { name: 'Version 4, one step ahead' });
    const [, row] = within(oneStep).getAllByRole('row');
    expect(
      within(row)
        .getAllByRole('cell')
        .map((c) => c.textContent),
    ).toEqual([
      'dissolved oxygen',
      '91.2 %',
      '0.041 mg/L',
      '0.002 mg/L',
      '0.041 mg/L',
      '8,640',
      'white (N·Σr² = 3.46, limit 37.7)',
    ]);
    // The free run's residual has r(1) … r(3) = 0.9, 0.8, 0.7, beyond 1.96/√8640 = 0.0211, and a
    // portmanteau far over the limit χ²₀.₉₅(25) = 37.652 (NIST/SEMATECH e-Handbook).
    const freeRun = within(candidate).getByRole('table', { name: 'Version 4, free run' });
    expect(
      within(freeRun).getByText(/^not white: N·Σr² = .*, limit 37\.7; 3 of 25 lags outside ±0\.021$/),
    ).toBeTruthy();
    expect(within(active).getByText(/uses no correction, so its one-step and free-run figures agree/)).toBeTruthy();
    expect(within(active).getByText('active when the backtest ran')).toBeTruthy();

    const replay = within(candidate).getByRole('region', { name: 'Drift rules replayed' });
    expect(within(replay).getByText('within the target')).toBeTruthy();
    expect(within(replay).getByText('2 alerts in 1 day: 2 a day against the target of 6 a day.')).toBeTruthy();
    const raises = within(replay).getByRole('table', { name: 'Raises of the replay, in time order' });
    expect(within(raises).getByRole('cell', { name: '2025-06-01 10:15:00 BST' })).toBeTruthy();
    expect(within(raises).getByRole('cell', { name: 'still raised at the end' })).toBeTruthy();
    expect(within(active).getByText('19 alerts in 1 day: 19 a day against the target of 6 a day.')).toBeTruthy();
    expect(within(active).getByText('over the target')).toBeTruthy();
    expect(
      within(candidate).getByText(
        'Band 4σ with 3 samples in a row: about one false alert every 9 days at this sample period.',
      ),
    ).toBeTruthy();

    const charts = screen.getByRole('region', { name: 'Measured against predicted' });
    expect(within(charts).getByRole('figure', { name: 'dissolved oxygen (mg/L)' })).toBeTruthy();
    expect(within(charts).getByText('version 4, one step ahead')).toBeTruthy();
    expect(within(charts).queryByText('version 4, free run')).toBeNull();
    fireEvent.click(within(charts).getByRole('checkbox', { name: 'Show the free runs' }));
    expect(within(charts).getByText('version 4, free run')).toBeTruthy();
    expect(
      screen.getByText(/8,640 samples from the first reading to the last, 8,639 with a reading \(1 missing/),
    ).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Attach as evidence/ })).toBeNull();
  });

  it('lets an engineer attach the result to the draft with a note, only to the draft, and take it off again', async () => {
    let current = fakeBacktest();
    const attached: unknown[] = [];
    const detached: string[] = [];
    stubFetch(
      routes(['engineer'], () => current, {
        [`DELETE /api/v1/model-versions/${CANDIDATE_ID}/evidence/${BACKTEST_ID}`]: () => {
          detached.push(BACKTEST_ID);
          current = { ...current, attachedTo: [] };
          return { status: 204 };
        },
        [`POST /api/v1/model-versions/${CANDIDATE_ID}/evidence`]: ({ init }) => {
          attached.push(bodyOf(init));
          current = { ...current, attachedTo: [{ versionId: CANDIDATE_ID, versionNumber: 4 }] };
          return { status: 201, body: {} };
        },
      }),
    );
    renderApp(`/backtests/${BACKTEST_ID}`);
    fireEvent.click(await screen.findByRole('button', { name: 'Attach as evidence to version 4' }));
    expect(screen.queryByRole('button', { name: 'Attach as evidence to version 3' })).toBeNull();
    fireEvent.change(screen.getByLabelText('Note for the reviewer (optional)'), {
      target: { value: '  The week after the diffuser cleaning. ' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Attach to version 4' }));
    expect(await screen.findByText('Attached as evidence to version 4.')).toBeTruthy();
    expect(attached).toEqual([{ backtestId: BACKTEST_ID, note: 'The week after the diffuser cleaning.' }]);

    fireEvent.click(screen.getByRole('button', { name: 'Take it off version 4' }));
    expect(await screen.findByRole('button', { name: 'Attach as evidence to version 4' })).toBeTruthy();
    expect(detached).toEqual([BACKTEST_ID]);
  });

  it('offers no attach to an engineer who did not write the draft (the evidence is its author’s)', async () => {
    const theirs = fakeBacktest();
    theirs.versions = theirs.versions.map((v) => ({ ...v, authorId: '22222222-2222-4222-8222-0000000000f2' }));
    stubFetch(routes(['engineer'], theirs));
    renderApp(`/backtests/${BACKTEST_ID}`);
    await screen.findByRole('region', { name: 'Verdict' });
    expect(screen.queryByRole('button', { name: /Attach as evidence/ })).toBeNull();
  });

  it('says in plain words why a backtest failed and what to do', async () => {
    const failed = fakeBacktest({
      status: 'failed',
      results: null,
      error: 'The recording holds no readings between 2025-06-01T00:00:00Z and 2025-06-02T00:00:00Z.',
    });
    stubFetch(routes(['engineer'], failed));
    renderApp(`/backtests/${BACKTEST_ID}`);
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('The backtest stopped without results')).toBeTruthy();
    expect(within(alert).getByText(failed.error ?? '')).toBeTruthy();
    expect(within(alert).getByText(/start a new backtest from the Backtests tab of AER-DO-101/)).toBeTruthy();
  });

  it('shows an uploaded file’s tally with the rejected rows by line', async () => {
    const upload = fakeBacktest({
      source: 'upload',
      from: null,
      to: null,
      upload: {
        fileName: 'week-23.csv',
        rowsRead: 8641,
        accepted: 8640,
        duplicates: 0,
        rejected: 1,
        badRows: [{ line: 17, reason: 'y[0] is not a finite number' }],
      },
    });
    stubFetch(routes(['engineer'], upload));
    renderApp(`/backtests/${BACKTEST_ID}`);
    expect(
      await screen.findByRole('heading', { level: 1, name: 'Backtest · AER-DO-101 · uploaded file week-23.csv' }),
    ).toBeTruthy();
    const tally = screen.getByRole('region', { name: 'Uploaded file' });
    expect(tally.textContent).toContain(
      '8,641 rows read, 8,640 used, 0 duplicates (a second row for a slot), 1 rejected.',
    );
    expect(within(tally).getByRole('cell', { name: 'y[0] is not a finite number' })).toBeTruthy();
  });
});
