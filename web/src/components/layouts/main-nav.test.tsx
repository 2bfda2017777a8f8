import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../test/fake-api';
import { renderApp } from '../../test/render-app';

async function mainNavLinkNames(): Promise<string[]> {
  const nav = await screen.findByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((link) => link.textContent?.trim() ?? '');
}

describe('main navigation', () => {
  it('shows an operator only the pages every role may use', async () => {
    stubFetch(signedInAs(['operator']));
    renderApp('/');
    expect(await mainNavLinkNames()).toEqual(['Floor', 'Loops', 'Alerts', 'Rota']);
  });

  it('adds Models for a control engineer', async () => {
    stubFetch(signedInAs(['engineer']));
    renderApp('/');
    expect(await mainNavLinkNames()).toEqual(['Floor', 'Loops', 'Models', 'Alerts', 'Rota']);
  });

  it('shows an administrator every page', async () => {
    stubFetch(signedInAs(['operator', 'engineer', 'oncall', 'admin']));
    renderApp('/');
    expect(await mainNavLinkNames()).toEqual(['Floor', 'Loops', 'Models', 'Alerts', 'Rota', 'Admin']);
  });

  it('gives each link its word as its accessible name', async () => {
    stubFetch(signedInAs(['admin', 'engineer']));
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Admin' }).getAttribute('href')).toBe('/admin');
    expect(within(nav).getByRole('link', { name: 'Floor' }).getAttribute('href')).toBe('/');
  });
});
