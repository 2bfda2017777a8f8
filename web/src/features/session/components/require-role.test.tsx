import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';

describe('pages a role does not allow', () => {
  it('tells an operator opening /admin which role is needed, inside the frame', async () => {
    const fetchMock = stubFetch(signedInAs(['operator']));
    renderApp('/admin/users');
    const heading = await screen.findByRole('heading', { level: 1, name: 'Not available for your role' });
    expect(heading).toBeTruthy();
    expect(screen.getByText('Administrator')).toBeTruthy();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeTruthy();
    const calledUsers = fetchMock.mock.calls.some(([input]) => String(input).includes('/api/v1/users'));
    expect(calledUsers).toBe(false);
  });

  it('tells an operator opening /models that it needs a control engineer', async () => {
    stubFetch(signedInAs(['operator', 'oncall']));
    renderApp('/models');
    await screen.findByRole('heading', { level: 1, name: 'Not available for your role' });
    expect(screen.getByText('Control engineer')).toBeTruthy();
    expect(screen.getByText(/Operator, On-call engineer/)).toBeTruthy();
  });

  it('opens Models for a control engineer', async () => {
    stubFetch(signedInAs(['engineer']));
    renderApp('/models');
    expect(await screen.findByRole('heading', { level: 1, name: 'Models' })).toBeTruthy();
  });
});
