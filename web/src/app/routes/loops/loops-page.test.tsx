import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { signedInAs, stubFetch } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const AREAS = [
  { id: 'aeration', name: 'Aeration' },
  { id: 'storage', name: 'Storage' },
];

function manyLoops() {
  return Array.from({ length: 30 }, (_, i) =>
    fakeLoop({
      id: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
      tag: `AER-DO-${String(i + 100)}`,
      name: `Basin ${i}`,
      area: i % 3 === 0 ? 'storage' : 'aeration',
      areaName: i % 3 === 0 ? 'Storage' : 'Aeration',
      status: i === 7 ? 'diverged' : 'in_step',
    }),
  );
}

function tagsShown(): string[] {
  const table = screen.getByRole('table', { name: 'Registered loops' });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[0].textContent ?? '');
}

describe('loops page', () => {
  it('pages, filters by area and status, and says when nothing matches', async () => {
    stubFetch({
      ...signedInAs(['operator']),
      'GET /api/v1/loops': { body: manyLoops() },
      'GET /api/v1/areas': { body: AREAS },
    });
    renderApp('/loops');
    expect(await screen.findByText('Loops 1–25 of 30')).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Register a loop' })).toBeNull();

    fireEvent.click(screen.getByRole('button', { name: 'Next page' }));
    expect(await screen.findByText('Loops 26–30 of 30')).toBeTruthy();

    fireEvent.change(screen.getByRole('combobox', { name: 'Area' }), { target: { value: 'storage' } });
    expect(await screen.findByText('Loops 1–10 of 10')).toBeTruthy();
    expect(tagsShown().every((tag) => (Number(tag.slice(-3)) - 100) % 3 === 0)).toBe(true);

    fireEvent.change(screen.getByRole('combobox', { name: 'Tracking status' }), { target: { value: 'diverged' } });
    expect(await screen.findByText('No loop matches these filters. Clear a filter to see more loops.')).toBeTruthy();

    fireEvent.change(screen.getByRole('combobox', { name: 'Area' }), { target: { value: '' } });
    await waitFor(() => expect(tagsShown()).toEqual(['AER-DO-107']));
    expect(within(screen.getByRole('table')).getByText('diverged')).toBeTruthy();
  });

  it('sorts by a column heading and finds by tag or name', async () => {
    stubFetch({
      ...signedInAs(['engineer']),
      'GET /api/v1/loops': { body: manyLoops() },
      'GET /api/v1/areas': { body: AREAS },
    });
    renderApp('/loops');
    await screen.findByText('Loops 1–25 of 30');
    expect(screen.getByRole('link', { name: 'Register a loop' }).getAttribute('href')).toBe('/loops/new');
    expect(tagsShown()[0]).toBe('AER-DO-100');

    fireEvent.click(screen.getByRole('button', { name: /^Tag/ }));
    expect(tagsShown()[0]).toBe('AER-DO-129');
    expect(screen.getByRole('columnheader', { name: /^Tag/ }).getAttribute('aria-sort')).toBe('descending');

    fireEvent.change(screen.getByRole('searchbox', { name: 'Find by tag or name' }), { target: { value: 'basin 12' } });
    await waitFor(() => expect(tagsShown()).toEqual(['AER-DO-112']));
  });

  it('explains how loops get here when there are none', async () => {
    stubFetch({ ...signedInAs(['operator']), 'GET /api/v1/loops': { body: [] }, 'GET /api/v1/areas': { body: AREAS } });
    renderApp('/loops');
    expect(await screen.findByRole('heading', { name: 'No loops registered yet' })).toBeTruthy();
    expect(screen.getByText(/Ask a control engineer/)).toBeTruthy();
  });
});
