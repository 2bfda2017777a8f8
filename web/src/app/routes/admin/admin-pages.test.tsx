import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { errorBody, signedInAs, stubFetch } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';

const ADMIN = signedInAs(['operator', 'engineer', 'oncall', 'admin']);

function auditEntries(count: number, from: number) {
  return Array.from({ length: count }, (_, index) => ({
    id: String(from + index),
    at: '2025-03-01T08:00:00Z',
    actorEmail: 'admin@quillmere.example',
    action: 'user.roles.updated',
    target: `user ${from + index}`,
    details: { roles: ['operator'] },
  }));
}

describe('admin pages', () => {
  it('opens Users and roles from /admin', async () => {
    stubFetch({ ...ADMIN, 'GET /api/v1/users': { body: [] } });
    const { router } = renderApp('/admin');
    expect(await screen.findByRole('heading', { level: 1, name: 'Users and roles' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/admin/users');
  });

  it('says the local mail server is not in use when the mailbox answers 404', async () => {
    stubFetch({ ...ADMIN, 'GET /api/v1/dev/mail': { status: 404, body: errorBody('not_found', 'No mailbox.') } });
    renderApp('/admin/dev-mail');
    expect(await screen.findByText('The local mail server is not in use')).toBeTruthy();
  });

  it('pages through the audit log and filters by action', async () => {
    const requested: string[] = [];
    stubFetch({
      ...ADMIN,
      'GET /api/v1/audit': ({ url }) => {
        const params = new URL(url, 'http://shadowloop.test').searchParams;
        requested.push(params.toString());
        const offset = Number(params.get('offset'));
        return { body: { items: auditEntries(offset === 0 ? 50 : 10, offset + 1), total: 60 } };
      },
    });
    renderApp('/admin/audit');
    expect(await screen.findByText('Entries 1–50 of 60')).toBeTruthy();

    fireEvent.click(screen.getByRole('button', { name: 'Next page' }));
    expect(await screen.findByText('Entries 51–60 of 60')).toBeTruthy();
    expect(screen.getByText('user 60')).toBeTruthy();

    fireEvent.change(screen.getByRole('textbox', { name: 'Action' }), { target: { value: 'token.revoked' } });
    fireEvent.click(screen.getByRole('button', { name: 'Apply filter' }));
    await waitFor(() => expect(requested.at(-1)).toBe('limit=50&offset=0&action=token.revoked'));
  });
});
