import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ACTIVE, fakeBacktest, summaryOf } from '../../../features/backtests/testing/fake-backtests';
import { bodyOf, errorBody, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const loop = fakeLoop({
  id: '33333333-3333-4333-8333-333333333333',
  tag: 'AER-DO-101',
  outputs: [{ name: 'dissolved oxygen', unit: 'mg/L' }],
  activeVersionId: '22222222-2222-4222-8222-222222222222',
  activeVersionNumber: 1,
});
const base = `/api/v1/loops/${loop.id}/drift-rules`;
const expectation = (sentence: string) => ({
  falseAlertIntervalSamples: 77_760,
  falseAlertIntervalHours: 216,
  detectionDelaySamples: null,
  shiftSigma: null,
  sentence,
});
const band = {
  id: '55555555-5555-4555-8555-555555555555',
  loopId: loop.id,
  kind: 'band',
  enabled: true,
  priority: 2,
  params: { mode: 'sigma', k: 4, sigma: [0.1], raiseAfter: 3, clearAfter: 5, deadband: 0.1 },
  version: 3,
  updatedAt: '2025-06-01T08:00:00Z',
  updatedBy: 'Tobias Renner',
  expectation: expectation('About one false alert every 9 days at this sample period.'),
};

function routes(roles: string[], extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    [`GET /api/v1/loops/${loop.id}`]: { body: loop },
    [`GET ${base}`]: { body: [band] },
    [`GET /api/v1/loops/${loop.id}/backtests`]: { body: [] },
    ...extra,
  };
}

describe('the Rules tab', () => {
  it('previews the expectation as the engineer types, fills sigma, saves and shows the server’s field error', async () => {
    const previews: unknown[] = [];
    const saves: unknown[] = [];
    stubFetch(
      routes(['engineer'], {
        [`POST ${base}/preview`]: ({ init }) => {
          const body = bodyOf(init) as { params: { k: number } };
          previews.push(body);
          return {
            body: expectation(`With k = ${body.params.k}: about one false alert a year at this sample period.`),
          };
        },
        [`GET ${base}/suggest`]: {
          body: {
            residualCount: 400,
            minimumCount: 30,
            outputs: [{ name: 'dissolved oxygen', unit: 'mg/L', mean: 0, sigma: 0.12 }],
            sigma: [0.12],
            sentence: 'From 400 residuals since the twin began scoring readings.',
          },
        },
        [`PUT ${base}/band`]: ({ init }) => {
          saves.push(bodyOf(init));
          return {
            status: 400,
            body: errorBody('validation_failed', "The band rule's settings are not valid.", [
              { path: 'body.params.k', message: 'params.k: must be at most 20' },
            ]),
          };
        },
      }),
    );
    renderApp(`/loops/${loop.id}/rules`);
    const card = await screen.findByRole('region', { name: 'Band with persistence' });
    expect(within(card).getByText(/Raises when a residual stays outside its limit/)).toBeTruthy();
    const k = within(card).getByLabelText('k (standard deviations)');
    fireEvent.change(k, { target: { value: '5' } });
    const expected = within(card).getByRole('region', { name: 'What to expect' });
    await waitFor(() =>
      expect(expected.textContent).toContain('With k = 5: about one false alert a year at this sample period.'),
    );
    expect(previews.at(-1)).toEqual({
      kind: 'band',
      params: { mode: 'sigma', k: 5, sigma: [0.1], raiseAfter: 3, clearAfter: 5, deadband: 0.1 },
    });

    fireEvent.change(k, { target: { value: 'five' } });
    expect(within(card).getByText('“five” is not a number.')).toBeTruthy();
    fireEvent.change(k, { target: { value: '25' } });
    fireEvent.click(within(card).getByRole('button', { name: 'Fill sigma from recent residuals' }));
    await waitFor(() =>
      expect((within(card).getByLabelText('dissolved oxygen (mg/L)') as HTMLInputElement).value).toBe('0.12'),
    );
    fireEvent.change(within(card).getByLabelText('Why the change (for the version history)'), {
      target: { value: 'fewer false alerts' },
    });
    fireEvent.click(within(card).getByRole('button', { name: 'Save as a new version' }));
    expect(await within(card).findByText('must be at most 20')).toBeTruthy();
    expect(saves).toEqual([
      {
        enabled: true,
        priority: 2,
        params: { mode: 'sigma', k: 25, sigma: [0.12], raiseAfter: 3, clearAfter: 5, deadband: 0.1 },
        note: 'fewer false alerts',
      },
    ]);
    expect(k.getAttribute('aria-invalid')).toBe('true');
  });

  it('sends a band in absolute mode with a limit per output', async () => {
    const saves: unknown[] = [];
    stubFetch(
      routes(['engineer'], {
        [`POST ${base}/preview`]: { body: expectation('About one false alert every 9 days.') },
        [`PUT ${base}/band`]: ({ init }) => {
          saves.push(bodyOf(init));
          return { body: { ...band, version: 4 } };
        },
      }),
    );
    renderApp(`/loops/${loop.id}/rules`);
    const card = await screen.findByRole('region', { name: 'Band with persistence' });
    fireEvent.click(within(card).getByLabelText('a limit per output in its own unit'));
    const limits = within(card).getByRole('group', { name: 'Limit of |residual| per output' });
    fireEvent.change(within(limits).getByLabelText('dissolved oxygen (mg/L)'), { target: { value: '0.4' } });
    fireEvent.change(within(card).getByLabelText('Priority of its alerts'), { target: { value: '1' } });
    fireEvent.click(within(card).getByRole('button', { name: 'Save as a new version' }));
    expect(await within(card).findByText('Saved as version 4.')).toBeTruthy();
    expect(saves).toEqual([
      {
        enabled: true,
        priority: 1,
        params: { mode: 'absolute', limits: [0.4], sigma: [0.1], raiseAfter: 3, clearAfter: 5, deadband: 0.1 },
        note: '',
      },
    ]);
  });

  it('sets up a rule the loop does not have yet, from suggested starting values', async () => {
    const saves: unknown[] = [];
    stubFetch(
      routes(['engineer'], {
        [`POST ${base}/preview`]: { body: expectation('About one false alert every 2 days at this sample period.') },
        [`PUT ${base}/cusum`]: ({ init }) => {
          saves.push(bodyOf(init));
          return { body: { ...band, kind: 'cusum', version: 1 } };
        },
      }),
    );
    renderApp(`/loops/${loop.id}/rules`);
    const card = await screen.findByRole('region', { name: 'CUSUM' });
    fireEvent.click(within(card).getByRole('button', { name: 'Set up this rule…' }));
    expect(within(card).queryByText('Enter a number.')).toBeNull();
    fireEvent.click(within(card).getByRole('button', { name: 'Save as a new version' }));
    expect(within(card).getByText('Enter a number.')).toBeTruthy();
    fireEvent.change(within(card).getByLabelText('dissolved oxygen (mg/L)'), { target: { value: '0.1' } });
    fireEvent.click(within(card).getByRole('button', { name: 'Save as a new version' }));
    await waitFor(() => expect(saves).toHaveLength(1));
    expect(saves[0]).toEqual({
      enabled: true,
      priority: 2,
      params: { k: 0.5, h: 5, sigma: [0.1], shift: 1 },
      note: '',
    });
  });

  it('saves the sigma an engineer filled from a backtest of the active version', async () => {
    const saves: unknown[] = [];
    const backtest = fakeBacktest({
      loopId: loop.id,
      versions: [{ id: loop.activeVersionId!, number: 1, status: 'active', authorId: null }],
      results: {
        ...fakeBacktest().results!,
        versions: [{ ...ACTIVE, versionId: loop.activeVersionId!, versionNumber: 1 }],
        comparison: null,
      },
    });
    stubFetch(
      routes(['engineer'], {
        [`POST ${base}/preview`]: { body: expectation('About one false alert every 9 days at this sample period.') },
        [`GET /api/v1/loops/${loop.id}/backtests`]: { body: [summaryOf(backtest)] },
        [`GET /api/v1/backtests/${backtest.id}`]: { body: backtest },
        [`PUT ${base}/band`]: ({ init }) => {
          saves.push(bodyOf(init));
          return { body: { ...band, version: 4 } };
        },
      }),
    );
    renderApp(`/loops/${loop.id}/rules`);
    const card = await screen.findByRole('region', { name: 'Band with persistence' });
    fireEvent.change(await within(card).findByLabelText('Fill sigma from a backtest'), {
      target: { value: backtest.id },
    });
    expect(await within(card).findByText(/one-step residuals of version 1\)\.$/)).toBeTruthy();
    fireEvent.click(within(card).getByRole('button', { name: 'Save as a new version' }));
    expect(await within(card).findByText('Saved as version 4.')).toBeTruthy();
    expect(saves).toEqual([
      {
        enabled: true,
        priority: 2,
        params: { ...band.params, sigma: ACTIVE.suggestion.sigma },
        note: '',
      },
    ]);
  });

  it('shows operators the rules read-only, with their expectation in plain time', async () => {
    stubFetch(routes(['operator']));
    renderApp(`/loops/${loop.id}/rules`);
    const card = await screen.findByRole('region', { name: 'Band with persistence' });
    expect(within(card).getByText('About one false alert every 9 days at this sample period.')).toBeTruthy();
    expect(within(card).getByText(/limit 4 × sigma; sigma dissolved oxygen 0.1 mg\/L/)).toBeTruthy();
    expect(within(card).queryByRole('button', { name: 'Save as a new version' })).toBeNull();
    const cusum = screen.getByRole('region', { name: 'CUSUM' });
    expect(within(cusum).getByText('not set up')).toBeTruthy();
  });
});
