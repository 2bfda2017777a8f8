import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';

describe('my access tokens', () => {
  it('shows a new token once with a warning, then lists it by prefix only', async () => {
    let tokens: unknown[] = [];
    stubFetch({
      ...signedInAs(['operator']),
      'GET /api/v1/access-tokens': () => ({ body: tokens }),
      'POST /api/v1/access-tokens': () => {
        const created = { id: 't1', label: 'bridge', prefix: 'slp_ab12', createdAt: '2025-03-01T08:00:00Z' };
        tokens = [{ ...created, lastUsedAt: null, revokedAt: null }];
        return { status: 201, body: { ...created, token: 'slp_ab12.secret-value' } };
      },
    });
    renderApp('/tokens');
    expect(await screen.findByText(/You have no access tokens yet/)).toBeTruthy();

    fireEvent.change(screen.getByRole('textbox', { name: 'Label' }), { target: { value: 'bridge' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create token' }));

    const value = await screen.findByRole<HTMLInputElement>('textbox', { name: 'New token value' });
    expect(value.value).toBe('slp_ab12.secret-value');
    expect(screen.getByText(/will not show this token again/)).toBeTruthy();
    await waitFor(() => expect(screen.getByText('slp_ab12…')).toBeTruthy());

    fireEvent.click(screen.getByRole('button', { name: 'I have copied it' }));
    expect(screen.queryByText('slp_ab12.secret-value')).toBeNull();
    expect(screen.queryByRole('textbox', { name: 'New token value' })).toBeNull();
  });
});
