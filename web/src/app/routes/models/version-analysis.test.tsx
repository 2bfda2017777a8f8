import { analyzeModel } from '@shadowloop/simulator/engine';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { analysisRoutes as routesFor } from '../../../test/analysis-routes';
import { stubFetch } from '../../../test/fake-api';
import { fakeVersion } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

describe('the analysis page of a version', () => {
  it('leads with the verdict, plots the eigenvalues and lists the modes', async () => {
    const version = fakeVersion();
    stubFetch(routesFor(version, 'engineer@quillmere.example'));
    renderApp(`/models/versions/${version.id}`);
    const verdict = await screen.findByRole('region', { name: 'Verdict' });
    expect(verdict.textContent).toMatch(
      /^Stable\. The slowest mode, λ = 0\.99\d*, settles in about .+; it dominates the long-run response\.$/,
    );
    expect(screen.getByRole('group', { name: 'Eigenvalues in the complex plane with the unit circle' })).toBeTruthy();
    expect(
      within(screen.getByRole('table', { name: 'Modes of the model, slowest first' })).getByText('slowest'),
    ).toBeTruthy();
    expect(screen.getByRole('combobox', { name: 'Horizon' })).toHaveProperty('value', '500');
    expect(
      await screen.findByText(
        /Steady-state gain [0-9.]+ °C per %; reaches 95 % after [0-9.]+ (min|h) \(\d+ samples\)\./,
      ),
    ).toBeTruthy();
    expect(await screen.findByText(/The modes cannot be separated for this model: A is defective/)).toBeTruthy();
  });

  it('asks for a justification before an unstable draft goes to review', async () => {
    const A = [
      [1.02, 0, 0],
      [0, 0.9, 0],
      [0, 0, 0.5],
    ];
    const version = fakeVersion({
      A,
      analysis: analyzeModel({ A, B: [[1], [0], [0]], C: [[1, 0, 0]], samplePeriodS: 10 }),
    });
    const bodies: unknown[] = [];
    stubFetch(
      routesFor(version, 'engineer@quillmere.example', {
        [`POST /api/v1/model-versions/${version.id}/submit`]: ({ init }) => (
          bodies.push(JSON.parse(String(init.body))),
          { body: { ...version, status: 'in_review' } }
        ),
      }),
    );
    renderApp(`/models/versions/${version.id}`);
    const submit = await screen.findByRole('button', { name: 'Submit for review' });
    expect((submit as HTMLButtonElement).disabled).toBe(true);
    fireEvent.change(screen.getByLabelText('Why this model should run although it is not stable'), {
      target: { value: 'The tank integrates; the level loop holds it.' },
    });
    fireEvent.click(submit);
    await waitFor(() => expect(bodies).toEqual([{ justification: 'The tank integrates; the level loop holds it.' }]));
  });
});
