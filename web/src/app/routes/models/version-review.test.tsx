import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ADVISORY_CAUTION } from '../../../config/product';
import { analysisRoutes as routesFor, LOOP } from '../../../test/analysis-routes';
import { errorBody, stubFetch } from '../../../test/fake-api';
import { fakeVersion } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

describe('reviewing and activating a version', () => {
  it('explains the four-eyes rule to the author instead of offering approval', async () => {
    const version = fakeVersion({ status: 'in_review' });
    stubFetch(routesFor(version, 'engineer@quillmere.example'));
    renderApp(`/models/versions/${version.id}`);
    expect(await screen.findByText("Waiting for another engineer's review")).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Approve' })).toBeNull();
  });

  it('lets a second engineer approve, then activate after ticking the cautions', async () => {
    let current = fakeVersion({ status: 'in_review' });
    const activations: unknown[] = [];
    stubFetch(
      routesFor(current, 'reviewer@quillmere.example', {
        [`GET /api/v1/model-versions/${current.id}`]: () => ({ body: current }),
        [`POST /api/v1/model-versions/${current.id}/approve`]: () => {
          current = {
            ...current,
            status: 'approved',
            reviewer: { email: 'reviewer@quillmere.example', name: 'Priya Hallam' },
          };
          return { body: current };
        },
        [`POST /api/v1/model-versions/${current.id}/activate`]: ({ init }) => {
          activations.push(JSON.parse(String(init.body)));
          current = { ...current, status: 'active' };
          return { body: current };
        },
      }),
    );
    renderApp(`/models/versions/${current.id}`);
    fireEvent.click(await screen.findByRole('button', { name: 'Approve' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Activate…' }));

    const dialog = screen.getByRole('dialog', { name: `Activate version 1 on the twin of ${LOOP.tag}` });
    expect(within(dialog).getByText(ADVISORY_CAUTION[0])).toBeTruthy();
    expect(within(dialog).getByText(ADVISORY_CAUTION[1])).toBeTruthy();
    const confirm = within(dialog).getByRole('button', { name: 'Activate version 1' }) as HTMLButtonElement;
    expect(confirm.disabled).toBe(true);
    fireEvent.click(within(dialog).getByRole('checkbox', { name: 'I have read the cautions' }));
    fireEvent.click(confirm);
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(activations).toEqual([{ acknowledgeCautions: true }]);
    expect(screen.getByText('active')).toBeTruthy();
  });

  it('spells out the four-eyes rule when the server refuses an approval', async () => {
    const version = fakeVersion({
      status: 'in_review',
      author: { email: 'someone@quillmere.example', name: 'Someone' },
    });
    stubFetch(
      routesFor(version, 'engineer@quillmere.example', {
        [`POST /api/v1/model-versions/${version.id}/approve`]: {
          status: 403,
          body: errorBody('forbidden', 'You cannot approve your own model version.'),
        },
      }),
    );
    renderApp(`/models/versions/${version.id}`);
    fireEvent.click(await screen.findByRole('button', { name: 'Approve' }));
    expect(await screen.findByText('You cannot approve your own version.')).toBeTruthy();
  });
});
