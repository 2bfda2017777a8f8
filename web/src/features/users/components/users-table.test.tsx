import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { errorBody, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { renderApp } from '../../../test/render-app';

const OPERATOR_ACCOUNT = {
  id: 'u2',
  email: 'operator@quillmere.example',
  name: 'Demo Operator',
  roles: ['operator'],
  createdAt: '2025-01-01T00:00:00Z',
  lastSignInAt: null,
};

function adminWithUsers(extra: FakeRoutes): FakeRoutes {
  return {
    ...signedInAs(['operator', 'engineer', 'oncall', 'admin']),
    'GET /api/v1/users': { body: [OPERATOR_ACCOUNT] },
    ...extra,
  };
}

describe('users and roles', () => {
  it('saves the ticked roles with the CSRF header', async () => {
    const sent: unknown[] = [];
    const fetchMock = stubFetch(
      adminWithUsers({
        'PUT /api/v1/users/u2/roles': ({ init }) => {
          sent.push(JSON.parse(String(init.body)));
          return { body: { ...OPERATOR_ACCOUNT, roles: ['operator', 'oncall'] } };
        },
      }),
    );
    renderApp('/admin/users');
    fireEvent.click(
      await screen.findByRole('checkbox', { name: 'On-call engineer role for operator@quillmere.example' }),
    );
    fireEvent.click(screen.getByRole('button', { name: 'Save roles for operator@quillmere.example' }));
    await waitFor(() => expect(sent).toEqual([{ roles: ['operator', 'oncall'] }]));
    const put = fetchMock.mock.calls.find(([, init]) => init?.method === 'PUT');
    expect((put?.[1]?.headers as Record<string, string>)['x-csrf-token']).toBe('csrf-1');
  });

  it("shows the server's message when a save is refused", async () => {
    stubFetch(
      adminWithUsers({
        'PUT /api/v1/users/u2/roles': {
          status: 422,
          body: errorBody('last_admin', 'At least one administrator must remain.'),
        },
      }),
    );
    renderApp('/admin/users');
    fireEvent.click(await screen.findByRole('checkbox', { name: 'Operator role for operator@quillmere.example' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save roles for operator@quillmere.example' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('At least one administrator must remain.');
  });
});
