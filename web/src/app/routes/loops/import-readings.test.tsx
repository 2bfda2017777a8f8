import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const loop = fakeLoop();
const HEADER = ['time', 'valve', 'sludge temperature'];

describe('importing readings from a CSV file', () => {
  it('previews the file, checks the mapping, imports and lists the bad rows by line', async () => {
    let sent: FormData | null = null;
    stubFetch({
      ...signedInAs(['engineer']),
      [`GET /api/v1/loops/${loop.id}`]: { body: loop },
      [`POST /api/v1/loops/${loop.id}/readings/import/preview`]: {
        body: {
          header: HEADER,
          rows: [['2025-03-01T08:00:00Z', '40', '35.1']],
          suggestedMapping: { t: 'time', u: ['valve'], y: ['sludge temperature'] },
        },
      },
      [`POST /api/v1/loops/${loop.id}/readings/import`]: ({ init }) => {
        sent = init.body as FormData;
        return {
          body: {
            id: String(sent.get('importId')),
            loopId: loop.id,
            fileName: 'history.csv',
            rowsRead: 3,
            accepted: 2,
            duplicates: 0,
            rejected: 1,
            badRows: [{ line: 3, reason: 'y[0] is not a finite number' }],
            done: true,
            error: null,
            startedAt: '2025-03-01T08:00:00Z',
            finishedAt: '2025-03-01T08:00:01Z',
          },
        };
      },
    });
    renderApp(`/loops/${loop.id}/import`);
    const file = new File(['time,valve,sludge temperature\n2025-03-01T08:00:00Z,40,35.1\n'], 'history.csv', {
      type: 'text/csv',
    });
    fireEvent.change(await screen.findByLabelText('CSV file of readings'), { target: { files: [file] } });

    const rows = await screen.findByRole('region', { name: 'First rows of the file' });
    expect(within(rows).getByText('35.1')).toBeTruthy();
    const time = screen.getByRole('combobox', { name: 'Time' });
    expect((time as HTMLSelectElement).value).toBe('0');

    fireEvent.change(screen.getByRole('combobox', { name: 'Output: sludge temperature' }), { target: { value: '1' } });
    fireEvent.click(screen.getByRole('button', { name: 'Import readings' }));
    expect(await screen.findByText('Column “valve” is already used for hot-water valve; choose another.')).toBeTruthy();
    expect(sent).toBeNull();

    fireEvent.change(screen.getByRole('combobox', { name: 'Output: sludge temperature' }), { target: { value: '2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Import readings' }));
    const result = await screen.findByRole('region', { name: 'Import result' });
    expect(within(result).getByText('y[0] is not a finite number')).toBeTruthy();
    expect(within(result).getByRole('cell', { name: '3' })).toBeTruthy();
    await waitFor(() => expect(sent).not.toBeNull());
    const form = sent as unknown as FormData;
    expect([...form.keys()]).toEqual(['mapping', 'importId', 'file']);
    expect(JSON.parse(String(form.get('mapping')))).toEqual({ t: 0, u: [1], y: [2] });
  });
});
