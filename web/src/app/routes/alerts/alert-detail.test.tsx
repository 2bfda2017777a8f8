import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ADVISORY_CAUTION } from '../../../config/product';
import { AERATION_LOOP_ID, fakeAlert, withEvents } from '../../../features/alerts/testing/fake-alerts';
import { bodyOf, errorBody, queriesTo, signedInAs, stubFetch, type FakeRoutes } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

vi.mock('uplot', () => import('../../../test/fake-uplot'));

const loop = fakeLoop({
  id: AERATION_LOOP_ID,
  tag: 'AER-DO-101',
  samplePeriodS: 10,
  outputs: [{ name: 'dissolved oxygen', unit: 'mg/L' }],
  timeZone: 'Europe/London',
});
const alert = fakeAlert({ number: 41 });
const SETTINGS = {
  secondaryAfterMin: 10,
  areaAfterMin: 30,
  ackLinkTtlMin: 240,
  shelveMaxHours: 8,
  targetPerDay: 144,
  targetPer10Min: 1,
  floodPer10Min: 10,
};

function routes(roles: string[], extra: FakeRoutes = {}): FakeRoutes {
  return {
    ...signedInAs(roles),
    'GET /api/v1/loops': { body: [loop] },
    [`GET /api/v1/loops/${loop.id}`]: { body: loop },
    [`GET /api/v1/loops/${loop.id}/series`]: {
      body: {
        t: ['2025-06-03T09:14:50Z', '2025-06-03T09:15:00Z'],
        measured: [[2.3, 2.6]],
        predicted: [[2.0, 2.0]],
        residual: [[0.3, 0.6]],
        inputs: [[40, 40]],
        downsampled: false,
      },
    },
    [`GET /api/v1/alerts/${alert.id}`]: { body: withEvents(alert) },
    'GET /api/v1/alert-settings': { body: SETTINGS },
    ...extra,
  };
}

describe('an alert on its own page', () => {
  it('says what happened, where it points, the values with units, the window around the raise and the timeline', async () => {
    const fetchMock = stubFetch(routes(['operator']));
    renderApp(`/alerts/${alert.id}`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Alert 41 · AER-DO-101 band' })).toBeTruthy();
    expect(screen.getByText(alert.summary)).toBeTruthy();
    const hint = screen.getByRole('region', { name: 'Where the residual points' });
    expect(within(hint).getByText('points to a sensor')).toBeTruthy();
    expect(within(hint).getByText('One output drifts alone: check its transmitter first.')).toBeTruthy();
    expect(within(hint).getByText('80 %')).toBeTruthy();
    const values = screen.getByRole('table', { name: 'Values at the raise' });
    expect(within(values).getByText('2.6 mg/L')).toBeTruthy();
    expect(within(values).getByText('0.43 mg/L')).toBeTruthy();
    expect(await screen.findByRole('figure', { name: 'dissolved oxygen (mg/L)' })).toBeTruthy();
    const series = queriesTo(fetchMock, 'GET', `/api/v1/loops/${loop.id}/series`)[0];
    expect(series?.get('from')).toBe('2025-06-03T09:05:00.000Z');
    expect(series?.get('to')).toBe('2025-06-03T09:18:20.000Z');
    const timeline = screen.getByRole('list', { name: 'Timeline' });
    expect(within(timeline).getByText('Notified by e-mail')).toBeTruthy();
    expect(within(timeline).getByText('to oncall@quillmere.example, for the raise')).toBeTruthy();
    expect(screen.getByText(ADVISORY_CAUTION[0])).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Acknowledge…' })).toBeNull();
    expect(screen.getByText('Acknowledging, shelving and closing alerts needs the on-call role.')).toBeTruthy();
  });

  it.each([
    ['done', 'The alert is acknowledged.'],
    ['used', 'That acknowledge link was used already'],
    ['expired', 'That acknowledge link has expired.'],
    ['already', 'Nothing was left to acknowledge'],
    ['forbidden', 'that needs the on-call role'],
  ])('says what the e-mail link did: %s', async (outcome, words) => {
    stubFetch(routes(['oncall']));
    renderApp(`/alerts/${alert.id}?ack=${outcome}`);
    const banner = await screen.findByRole('status', { name: 'Acknowledge link' });
    expect(banner.textContent).toContain(words);
  });

  it('acknowledges with the note and shows why the server refused', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['oncall'], {
        [`POST /api/v1/alerts/${alert.id}/acknowledge`]: ({ init }) => {
          bodies.push(bodyOf(init));
          return { status: 409, body: errorBody('conflict', 'Alert 41 was acknowledged by Rowan Vale a moment ago.') };
        },
      }),
    );
    renderApp(`/alerts/${alert.id}`);
    fireEvent.click(await screen.findByRole('button', { name: 'Acknowledge…' }));
    const dialog = screen.getByRole('dialog', { name: 'Acknowledge alert 41' });
    fireEvent.change(within(dialog).getByLabelText('Note (optional)'), { target: { value: '  looking now ' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Acknowledge' }));
    expect(await within(dialog).findByText('Alert 41 was acknowledged by Rowan Vale a moment ago.')).toBeTruthy();
    expect(bodies).toEqual([{ note: 'looking now' }]);
  });

  it('shelves until a plant time within the limit, with the reason', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['oncall'], {
        [`POST /api/v1/alerts/${alert.id}/shelve`]: ({ init }) => {
          bodies.push(bodyOf(init));
          return { body: { ...alert, state: 'shelved' } };
        },
      }),
    );
    renderApp(`/alerts/${alert.id}`);
    fireEvent.click(await screen.findByRole('button', { name: 'Shelve…' }));
    const dialog = screen.getByRole('dialog', { name: 'Shelve alert 41' });
    await within(dialog).findByText(/The site allows at most 8 h/);
    const until = within(dialog).getByLabelText('Shelved until');
    fireEvent.change(until, { target: { value: '2020-01-01T08:00' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Shelve' }));
    expect(within(dialog).getByText('Choose a time in the future.')).toBeTruthy();
    expect(within(dialog).getByText('Say why the alert is shelved.')).toBeTruthy();
    expect(bodies).toEqual([]);

    const target = new Date(Date.now() + 2 * 3_600_000);
    target.setUTCSeconds(0, 0);
    const wall = new Intl.DateTimeFormat('sv-SE', {
      timeZone: 'Europe/London',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
    })
      .format(target)
      .replace(' ', 'T');
    fireEvent.change(until, { target: { value: wall } });
    fireEvent.change(within(dialog).getByLabelText('Reason'), { target: { value: 'blower 2 under repair' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Shelve' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(bodies).toEqual([{ note: 'blower 2 under repair', until: target.toISOString() }]);
  });

  it('closes with a cause and a note, showing the server’s problem at the field', async () => {
    const bodies: unknown[] = [];
    stubFetch(
      routes(['oncall'], {
        [`POST /api/v1/alerts/${alert.id}/close`]: ({ init }) => {
          bodies.push(bodyOf(init));
          return {
            status: 400,
            body: errorBody('validation_failed', 'The body is not valid.', [
              { path: 'body.note', message: 'say what was found or done' },
            ]),
          };
        },
      }),
    );
    renderApp(`/alerts/${alert.id}`);
    fireEvent.click(await screen.findByRole('button', { name: 'Close…' }));
    const dialog = screen.getByRole('dialog', { name: 'Close alert 41' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Close the alert' }));
    expect(within(dialog).getByText('Choose what caused the alert.')).toBeTruthy();
    fireEvent.change(within(dialog).getByLabelText('Cause'), { target: { value: 'sensor_fault' } });
    fireEvent.change(within(dialog).getByLabelText('Note'), { target: { value: 'DO probe fouled; cleaned' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Close the alert' }));
    expect(await within(dialog).findByText('say what was found or done')).toBeTruthy();
    expect(bodies).toEqual([{ cause: 'sensor_fault', note: 'DO probe fouled; cleaned' }]);
    expect(within(dialog).getByLabelText('Note').getAttribute('aria-invalid')).toBe('true');
  });
});
