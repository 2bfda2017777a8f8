import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { errorBody, signedInAs, stubFetch } from '../../test/fake-api';
import { renderApp } from '../../test/render-app';

describe('user menu', () => {
  it('shows the name and roles and signs out to the sign-in page', async () => {
    const fetchMock = stubFetch({
      ...signedInAs(['operator', 'oncall'], 'Rowan Vale'),
      'POST /auth/logout': { status: 204 },
    });
    const { router } = renderApp('/');
    fireEvent.click(await screen.findByRole('button', { name: 'User menu' }));
    expect(screen.getByText('On-call engineer')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Access tokens' }).getAttribute('href')).toBe('/tokens');

    fireEvent.click(screen.getByRole('button', { name: 'Sign out' }));
    expect(await screen.findByRole('button', { name: 'Sign in with your plant account' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/signin');
    const logout = fetchMock.mock.calls.find(([input]) => input === '/auth/logout');
    expect((logout?.[1]?.headers as Record<string, string>)['x-csrf-token']).toBe('csrf-1');
  });

  it('goes to the sign-in page when the session ends while a page is open', async () => {
    let signedIn = true;
    stubFetch({
      ...signedInAs(['admin']),
      'GET /api/v1/me': () =>
        signedIn
          ? { body: { id: 'u1', email: 'a@quillmere.example', name: 'A', roles: ['admin'] } }
          : { status: 401, body: errorBody('unauthenticated', 'Sign in first.') },
      'GET /api/v1/users': () => ({ status: 401, body: errorBody('unauthenticated', 'Sign in first.') }),
    });
    const { router } = renderApp('/');
    await screen.findByRole('heading', { level: 1, name: 'Floor' });
    signedIn = false;
    fireEvent.click(screen.getByRole('link', { name: 'Admin' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/signin'));
    expect(new URLSearchParams(router.state.location.search).get('returnTo')).toBe('/admin/users');
  });
});
