import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { HEALTHY, signedInAs, stubFetch } from '../../test/fake-api';
import { renderApp } from '../../test/render-app';
import { summariseHealth } from './health-summary';

describe('health summary', () => {
  it('names every state in words, not colour alone', () => {
    expect(summariseHealth({ ...HEALTHY, status: 'ok', httpStatus: 200 }, false).word).toBe('Services OK');
    expect(summariseHealth({ ...HEALTHY, status: 'degraded', httpStatus: 200 }, false).word).toBe('Services degraded');
    const databaseDown = { status: 'degraded' as const, checks: { database: { ok: false } }, httpStatus: 503 };
    expect(summariseHealth(databaseDown, false)).toEqual({ tone: 'diverged', word: 'Services down' });
    expect(summariseHealth(undefined, true).word).toBe('No answer');
  });

  it('reads the 503 body and lists each check in the top strip', async () => {
    stubFetch({
      ...signedInAs(['operator']),
      'GET /api/health': {
        status: 503,
        body: {
          status: 'degraded',
          checks: { database: { ok: false, detail: 'connection refused' }, mail: { ok: true } },
        },
      },
    });
    renderApp('/');
    expect(await screen.findByRole('button', { name: 'System health: Services down' })).toBeTruthy();
    expect(screen.getByText('Database: not ok (connection refused)')).toBeTruthy();
    expect(screen.getByText('Mail server: ok')).toBeTruthy();
  });
});
