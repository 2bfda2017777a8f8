import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { queriesTo, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';
import {
  ACTIVE,
  ACTIVE_ID,
  BACKTEST_ID,
  CANDIDATE,
  CANDIDATE_ID,
  DO_LOOP,
  fakeBacktest,
  LOOP_ID,
  summaryOf,
} from '../../backtests/testing/fake-backtests';

const rules = `/api/v1/loops/${LOOP_ID}/drift-rules`;
const list = `/api/v1/loops/${LOOP_ID}/backtests`;
const detail = (id: string) => `/api/v1/backtests/${id}`;
const UPLOAD_ID = '66666666-6666-4666-8666-000000000002';

const band = {
  id: '55555555-5555-4555-8555-555555555555',
  loopId: LOOP_ID,
  kind: 'band',
  enabled: true,
  priority: 2,
  params: { mode: 'sigma', k: 4, sigma: [0.1], raiseAfter: 3, clearAfter: 5, deadband: 0.1 },
  version: 3,
  updatedAt: '2025-06-01T08:00:00Z',
  updatedBy: 'Tobias Renner',
  expectation: {
    falseAlertIntervalSamples: 77_760,
    falseAlertIntervalHours: 216,
    detectionDelaySamples: null,
    shiftSigma: null,
    sentence: 'About one false alert every 9 days at this sample period.',
  },
};

/** A newer backtest of the active version alone, over an uploaded file. */
const upload = fakeBacktest({
  id: UPLOAD_ID,
  source: 'upload',
  from: null,
  to: null,
  upload: { fileName: 'do-june.csv', rowsRead: 68, accepted: 68, duplicates: 0, rejected: 0, badRows: [] },
  versions: [{ id: ACTIVE_ID, number: 3, status: 'active', authorId: null }],
  createdAt: '2025-06-03T08:00:00Z',
});
const failed = fakeBacktest({ id: '66666666-6666-4666-8666-000000000003', status: 'failed', results: null });
const candidateOnly = fakeBacktest({
  id: '66666666-6666-4666-8666-000000000004',
  versions: [{ id: CANDIDATE_ID, number: 4, status: 'draft', authorId: null }],
});

function routes(roles: string[], extra: FakeRoutes): FakeRoutes {
  return {
    ...signedInAs(roles),
    [`GET /api/v1/loops/${LOOP_ID}`]: { body: DO_LOOP },
    [`GET ${rules}`]: { body: [band] },
    [`POST ${rules}/preview`]: { body: band.expectation },
    ...extra,
  };
}

async function bandCard() {
  return screen.findByRole('region', { name: 'Band with persistence' });
}

const sigmaField = (card: HTMLElement) => within(card).getByLabelText('dissolved oxygen (mg/L)') as HTMLInputElement;

describe('Fill sigma from a backtest', () => {
  it('lists the succeeded backtests of the active version and fills sigma from the picked one, loaded only then', async () => {
    const fetchMock = stubFetch(
      routes(['engineer'], {
        [`GET ${list}`]: { body: [upload, fakeBacktest(), failed, candidateOnly].map(summaryOf) },
        [`GET ${detail(BACKTEST_ID)}`]: { body: fakeBacktest() },
        [`GET ${detail(UPLOAD_ID)}`]: { body: upload },
      }),
    );
    renderApp(`/loops/${LOOP_ID}/rules`);
    const card = await bandCard();
    const select = (await within(card).findByLabelText('Fill sigma from a backtest')) as HTMLSelectElement;
    // createdAt 08:00 UTC is 09:00 on London summer time (UTC+1); one day [from, to) at 10 s is 86 400 / 10 samples.
    expect(Array.from(select.options, (o) => o.textContent)).toEqual([
      'pick one…',
      'backtest of 2025-06-03 09:00 BST, uploaded file do-june.csv',
      'backtest of 2025-06-02 09:00 BST, 8,640 samples',
    ]);
    expect(queriesTo(fetchMock, 'GET', detail(BACKTEST_ID))).toHaveLength(0);
    expect(queriesTo(fetchMock, 'GET', detail(UPLOAD_ID))).toHaveLength(0);

    fireEvent.change(select, { target: { value: BACKTEST_ID } });
    // The active version's suggestion (ACTIVE, 0.093), not the candidate's (CANDIDATE, 0.041).
    await waitFor(() => expect(sigmaField(card).value).toBe(String(ACTIVE.suggestion.sigma?.[0])));
    expect(ACTIVE.suggestion.sigma?.[0]).not.toBe(CANDIDATE.suggestion.sigma?.[0]);
    expect(
      within(card).getByText(
        'Sigma from the backtest of 2025-06-02 09:00 BST over 2025-06-01 01:00 BST to 2025-06-02 01:00 BST (one-step residuals of version 3).',
      ),
    ).toBeTruthy();
    expect(queriesTo(fetchMock, 'GET', detail(BACKTEST_ID))).toHaveLength(1);
    expect(queriesTo(fetchMock, 'GET', detail(UPLOAD_ID))).toHaveLength(0);
  });

  it('fills nothing and says why when the backtest had too few residuals for a sigma', async () => {
    // The server's reason, as api/src/modules/backtests/rule-suggestion.ts words it for too few one-step residuals.
    const reason =
      'Rule settings are suggested from at least 100 one-step residuals per output; dissolved oxygen has 68.';
    const short = {
      ...upload,
      results: {
        ...fakeBacktest().results!,
        versions: [{ ...ACTIVE, suggestion: { sigma: null, band: null, cusum: null, sentence: reason } }],
      },
    };
    stubFetch(
      routes(['engineer'], {
        [`GET ${list}`]: { body: [summaryOf(short)] },
        [`GET ${detail(UPLOAD_ID)}`]: { body: short },
      }),
    );
    renderApp(`/loops/${LOOP_ID}/rules`);
    const card = await bandCard();
    fireEvent.change(await within(card).findByLabelText('Fill sigma from a backtest'), {
      target: { value: UPLOAD_ID },
    });
    expect(
      await within(card).findByText(
        `No sigma filled from the backtest of 2025-06-03 09:00 BST over uploaded file do-june.csv: ${reason}`,
      ),
    ).toBeTruthy();
    expect(sigmaField(card).value).toBe(String(band.params.sigma[0]));
  });

  it('points to the Backtests tab when no finished backtest includes the active version', async () => {
    stubFetch(routes(['engineer'], { [`GET ${list}`]: { body: [failed, candidateOnly].map(summaryOf) } }));
    renderApp(`/loops/${LOOP_ID}/rules`);
    const card = await bandCard();
    const link = await within(card).findByRole('link', { name: 'Backtests tab' });
    expect(link.getAttribute('href')).toBe(`/loops/${LOOP_ID}/backtests`);
    expect(link.parentElement?.textContent).toContain('No finished backtest includes active version 3 yet');
    expect(within(card).queryByLabelText('Fill sigma from a backtest')).toBeNull();
  });

  it('shows operators neither way of filling sigma', async () => {
    const fetchMock = stubFetch(routes(['operator'], { [`GET ${list}`]: { body: [summaryOf(fakeBacktest())] } }));
    renderApp(`/loops/${LOOP_ID}/rules`);
    const card = await bandCard();
    expect(within(card).getByText('About one false alert every 9 days at this sample period.')).toBeTruthy();
    expect(within(card).queryByRole('button', { name: 'Fill sigma from recent residuals' })).toBeNull();
    expect(within(card).queryByLabelText('Fill sigma from a backtest')).toBeNull();
    expect(within(card).queryByRole('link', { name: 'Backtests tab' })).toBeNull();
    expect(queriesTo(fetchMock, 'GET', list)).toHaveLength(0);
  });
});
