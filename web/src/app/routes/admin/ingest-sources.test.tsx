import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const loop = fakeLoop();

describe('ingest sources', () => {
  it('creates a source for chosen loops, shows its token once, and revokes it', async () => {
    let sources: unknown[] = [];
    const bodies: unknown[] = [];
    let revoked = '';
    stubFetch({
      ...signedInAs(['admin']),
      'GET /api/v1/loops': { body: [loop] },
      'GET /api/v1/ingest-sources': () => ({ body: sources }),
      'POST /api/v1/ingest-sources': ({ init }) => {
        bodies.push(JSON.parse(String(init.body)));
        const source = {
          id: '33333333-3333-4333-8333-333333333333',
          name: 'Historian bridge',
          description: '',
          prefix: 'sli_ab12',
          loops: [{ id: loop.id, tag: loop.tag }],
          createdAt: '2025-03-01T08:00:00Z',
          lastUsedAt: null,
          revokedAt: null,
        };
        sources = [source];
        return { status: 201, body: { ...source, token: 'sli_ab12.secret' } };
      },
      'DELETE /api/v1/ingest-sources/33333333-3333-4333-8333-333333333333': () => {
        revoked = 'yes';
        return { status: 204 };
      },
    });
    renderApp('/admin/ingest-sources');
    expect(await screen.findByText(/No ingest sources yet/)).toBeTruthy();
    fireEvent.change(screen.getByRole('textbox', { name: 'Name' }), { target: { value: 'Historian bridge' } });
    fireEvent.click(await screen.findByRole('checkbox', { name: `${loop.tag} · ${loop.name}` }));
    fireEvent.click(screen.getByRole('button', { name: 'Create source and token' }));

    const value = await screen.findByRole<HTMLInputElement>('textbox', { name: 'New token value' });
    expect(value.value).toBe('sli_ab12.secret');
    expect(
      screen.getByText(/will not show this token again. It may post readings for DIG-TEMP-301 and nothing else/),
    ).toBeTruthy();
    expect(bodies).toEqual([{ name: 'Historian bridge', description: '', loopIds: [loop.id] }]);
    const table = screen.getByRole('table', { name: 'Ingest sources' });
    await waitFor(() => expect(within(table).getByText('sli_ab12…')).toBeTruthy());

    fireEvent.click(within(table).getByRole('button', { name: 'Revoke Historian bridge' }));
    fireEvent.click(within(table).getByRole('button', { name: 'Confirm revoke' }));
    await waitFor(() => expect(revoked).toBe('yes'));
  });
});
