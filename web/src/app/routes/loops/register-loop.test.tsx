import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { errorBody, signedInAs, stubFetch, type FakeReply } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const AREAS = [{ id: 'digestion', name: 'Digestion' }];

function fill(label: string, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

function fillValidLoop() {
  fill('Tag', 'DIG-TEMP-301');
  fill('Name', 'Digester heating');
  fireEvent.change(screen.getByRole('combobox', { name: 'Area' }), { target: { value: 'digestion' } });
  fill('Sample period (s)', '10');
  fill('Plant time zone', 'Europe/London');
  fill('Input 1 name', 'hot-water valve');
  fill('Input 1 unit', '%');
  fill('State 1 name', 'sludge temperature');
  fill('Output 1 name', 'sludge temperature');
}

function renderRegister(reply: () => FakeReply) {
  const bodies: unknown[] = [];
  stubFetch({
    ...signedInAs(['engineer']),
    'GET /api/v1/areas': { body: AREAS },
    'POST /api/v1/loops': ({ init }) => {
      bodies.push(JSON.parse(String(init.body)));
      return reply();
    },
  });
  return { bodies, ...renderApp('/loops/new') };
}

describe('registering a loop', () => {
  it('checks the fields as the engineer goes, before anything is sent', async () => {
    const { bodies } = renderRegister(() => ({ status: 201, body: fakeLoop() }));
    await screen.findByLabelText('Tag');
    fill('Tag', 'dig temp');
    fireEvent.click(screen.getByRole('button', { name: 'Register the loop' }));
    expect(await screen.findByText('use capitals, digits and single - _ . separators, e.g. AER-DO-101')).toBeTruthy();
    expect(screen.getByText('give the sample period in seconds')).toBeTruthy();
    expect(screen.getByText('name input 1')).toBeTruthy();
    expect(screen.getByLabelText('Tag').getAttribute('aria-invalid')).toBe('true');
    expect(bodies).toEqual([]);
  });

  it('shows the server’s field problems on the fields they belong to', async () => {
    renderRegister(() => ({
      status: 400,
      body: errorBody('validation_failed', 'The loop is not valid.', [
        { path: 'body.inputs.0.name', message: 'Too long for the historian.' },
        { path: 'body.operatingPoint.u0', message: 'u0 has 2 entries; the loop has 1 inputs.' },
        { path: 'body.timeZone', message: '"Mars/Base" is not a known time zone.' },
      ]),
    }));
    await screen.findByLabelText('Tag');
    fillValidLoop();
    fireEvent.click(screen.getByRole('button', { name: 'Register the loop' }));
    expect(await screen.findByText('Too long for the historian.')).toBeTruthy();
    expect(screen.getByLabelText('Input 1 name').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText('u0 has 2 entries; the loop has 1 inputs.')).toBeTruthy();
    expect(screen.getByText('"Mars/Base" is not a known time zone.')).toBeTruthy();
  });

  it('puts a taken tag on the tag field', async () => {
    renderRegister(() => ({ status: 409, body: errorBody('conflict', 'Tag DIG-TEMP-301 is already registered.') }));
    await screen.findByLabelText('Tag');
    fillValidLoop();
    fireEvent.click(screen.getByRole('button', { name: 'Register the loop' }));
    expect(await screen.findByText('Tag DIG-TEMP-301 is already registered.')).toBeTruthy();
    expect(screen.getByLabelText('Tag').getAttribute('aria-invalid')).toBe('true');
  });

  it('sends the signals and operating point, then opens the new loop', async () => {
    const { bodies, router } = renderRegister(() => ({ status: 201, body: fakeLoop() }));
    await screen.findByLabelText('Tag');
    fillValidLoop();
    fill('Input 1 value at the operating point', '35,5');
    fireEvent.click(screen.getByRole('button', { name: 'Register the loop' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/loops/${fakeLoop().id}`));
    expect(bodies[0]).toMatchObject({
      tag: 'DIG-TEMP-301',
      samplePeriodS: 10,
      inputs: [{ name: 'hot-water valve', unit: '%' }],
      operatingPoint: { u0: [35.5] },
      timeZone: 'Europe/London',
    });
  });
});
