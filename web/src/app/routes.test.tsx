import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ADVISORY_CAUTION } from '../config/product';
import { errorBody, signedInAs, stubFetch } from '../test/fake-api';
import { renderApp } from '../test/render-app';

describe('app routes', () => {
  it('sends a visitor without a session to the sign-in page', async () => {
    stubFetch({ 'GET /api/v1/me': { status: 401, body: errorBody('unauthenticated', 'Sign in first.') } });
    const { router } = renderApp('/alerts');
    const button = await screen.findByRole('button', { name: 'Sign in with your plant account' });
    expect(button.closest('form')?.getAttribute('action')).toBe('/auth/login');
    expect(router.state.location.pathname).toBe('/signin');
    const returnTo = button.closest('form')?.querySelector<HTMLInputElement>('input[name="returnTo"]');
    expect(returnTo?.value).toBe('/alerts');
    expect(screen.getByText(ADVISORY_CAUTION[0])).toBeTruthy();
    expect(screen.getByText(ADVISORY_CAUTION[1])).toBeTruthy();
  });

  it('shows a not-found page for an unknown address, keeping the navigation', async () => {
    stubFetch(signedInAs(['operator']));
    renderApp('/no-such-page');
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeTruthy();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeTruthy();
  });

  it('says in plain words when the server cannot be reached', async () => {
    stubFetch({ 'GET /api/v1/me': { status: 502, body: 'Bad gateway' } });
    renderApp('/');
    expect(await screen.findByRole('heading', { level: 1, name: 'The Shadowloop server had a problem' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Reload the page' })).toBeTruthy();
  });

  it('shows an empty floor that explains how loops get there', async () => {
    stubFetch({ ...signedInAs(['operator']), 'GET /api/v1/loops': { body: [] }, 'GET /api/v1/areas': { body: [] } });
    renderApp('/');
    expect(await screen.findByRole('heading', { level: 1, name: 'Floor' })).toBeTruthy();
    expect(await screen.findByText(/once a control engineer registers it and activates a model version/)).toBeTruthy();
  });

  it('shows the cautions and the version on the About page', async () => {
    stubFetch(signedInAs(['operator']));
    renderApp('/about');
    expect(await screen.findByRole('heading', { level: 1, name: 'About Shadowloop' })).toBeTruthy();
    expect(screen.getByText(ADVISORY_CAUTION[0])).toBeTruthy();
    expect(screen.getByText('Version')).toBeTruthy();
  });
});
