import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import { recordingCsv, recordModel, TANK_OPERATING_POINT, TANK_PLANT } from '../helpers/backtest-fixtures.js';
import { createDraft, ENGINEER, REVIEWER, signedIn, uniqueTag } from '../helpers/registry-fixtures.js';
import { loopWithTwin, slotMsAgo } from '../helpers/twin-fixtures.js';
import { appUrl, launchBrowser, screenshotPath, signedInPage } from './browser.js';

/**
 * Evidence for a review, in Chromium: the engineer uploads a recording of the plant as a CSV,
 * backtests the draft against the active version, reads the verdict, attaches the result and
 * submits the draft; the reviewer finds the evidence on the review page. The recording is made
 * by the engine's `step` from the draft's own model, so the draft must fit it at 100 % (up to
 * rounding) and the active version, with a quarter more gain from the valve, less.
 */
const OPERATING_POINT = TANK_OPERATING_POINT;
const PLANT_MODEL = TANK_PLANT;
const ACTIVE_MODEL = { ...PLANT_MODEL, B: [[0], [0.375]] };
const SLOTS = 3000;
const NOTE = 'Recorded after the valve positioner was replaced.';

let browser: Browser;
const contexts: BrowserContext[] = [];
let loop: Loop;
let active: ModelVersion;
let candidate: ModelVersion;
let csv = '';
let backtestUrl = '';

const pageAs = (email: string) => signedInPage(browser, contexts, email);

beforeAll(async () => {
  browser = await launchBrowser();
  const engineer = await signedIn(appUrl, ENGINEER);
  const reviewer = await signedIn(appUrl, REVIEWER);
  ({ loop, version: active } = await loopWithTwin(
    engineer,
    reviewer,
    { tag: uniqueTag('BT'), name: 'Backtest tank', operatingPoint: OPERATING_POINT },
    ACTIVE_MODEL,
  ));
  candidate = await createDraft(engineer, loop.id, {
    ...PLANT_MODEL,
    changeNote: 'Valve gain re-identified from the step tests after the positioner change.',
  });
  // a level band the plant's own model never leaves; the active version's residual does
  const band = { mode: 'absolute', limits: [0.05], raiseAfter: 3, clearAfter: 3, deadband: 0.1 };
  const saved = await engineer.request(
    'PUT',
    `/api/v1/loops/${loop.id}/drift-rules/band`,
    { enabled: true, priority: 2, params: band },
    { csrf: true },
  );
  expect(saved.status).toBe(200);
  const firstK = Math.round(slotMsAgo(SLOTS + 60) / 1000);
  const rows = recordModel({ ...PLANT_MODEL, ...OPERATING_POINT }, { firstK, slots: SLOTS, hold: 50, spread: 10 });
  csv = recordingCsv(rows, loop.samplePeriodS, ['time', loop.inputs[0].name, loop.outputs[0].name]);
});

afterAll(async () => {
  for (const context of contexts) await context.close();
  await browser?.close();
});

describe('a backtest as evidence for a review, in Chromium', () => {
  it('the engineer uploads a recording, compares the draft with the active version and attaches the result', async () => {
    const page = await pageAs(ENGINEER);
    await page.goto(`${appUrl}/loops/${loop.id}`);
    await page.getByRole('navigation', { name: 'Loop pages' }).getByRole('link', { name: 'Backtests' }).click();
    await page.getByRole('region', { name: 'No backtests yet' }).waitFor();
    const panel = page.getByRole('region', { name: 'New backtest' });
    await expect.poll(() => panel.getByRole('checkbox', { name: /^Version 2/ }).isChecked()).toBe(true);
    expect(await panel.getByRole('checkbox', { name: /^Version 1/ }).isChecked()).toBe(true);

    await panel.getByRole('radio', { name: 'Upload a CSV' }).check();
    await panel.getByLabel('CSV file of readings for the backtest').setInputFiles({
      name: 'tank-recording.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(csv),
    });
    await panel.getByRole('region', { name: 'First rows of the file' }).waitFor();
    const mapping = panel.getByRole('form', { name: 'Column mapping' });
    // the headers carry the loop's signal names, so the mapping comes prefilled
    expect(await mapping.getByRole('combobox', { name: 'Output: Level' }).inputValue()).toBe('2');
    await page.screenshot({ path: screenshotPath('backtest-1-upload-and-mapping.png'), fullPage: true });
    await mapping.locator('button[type="submit"]').click();

    await page.waitForURL(/\/backtests\/[0-9a-f-]{36}$/);
    backtestUrl = page.url();
    const verdict = page.getByRole('region', { name: 'Verdict' });
    await verdict.waitFor({ timeout: 60_000 });
    expect(await verdict.innerText()).toMatch(/the candidate is better/);
    expect(await verdict.innerText()).toMatch(/Version 2 fits Level .*better than active version 1/);
    expect(await verdict.innerText()).toMatch(/not a guarantee/);
    const tally = await page.getByRole('region', { name: 'Uploaded file' }).innerText();
    expect(tally).toContain(`${SLOTS.toLocaleString('en-GB')} rows read, ${SLOTS.toLocaleString('en-GB')} used`);

    // the recording is the draft's own output: Ljung's fit is 100 % up to rounding, in both runs
    const draftCard = page.getByRole('region', { name: 'Version 2', exact: true });
    for (const run of ['one step ahead', 'free run']) {
      const table = draftCard.getByRole('table', { name: `Version 2, ${run}` });
      expect(await table.getByRole('row').nth(1).getByRole('cell').nth(1).innerText()).toBe('100 %');
    }
    await page.getByRole('region', { name: 'Measured against predicted' }).locator('canvas').first().waitFor();
    await page.screenshot({ path: screenshotPath('backtest-2-result.png'), fullPage: true });

    await draftCard.getByRole('button', { name: 'Attach as evidence to version 2' }).click();
    await draftCard.getByLabel('Note for the reviewer (optional)').fill(NOTE);
    await draftCard.getByRole('button', { name: 'Attach to version 2' }).click();
    await draftCard.getByText('Attached as evidence to version 2.').waitFor();
    expect(await page.getByRole('region', { name: 'Version 1', exact: true }).innerText()).not.toMatch(/Attach/);
  });

  it('the engineer submits the draft with the backtest attached', async () => {
    const page = await pageAs(ENGINEER);
    await page.goto(`${appUrl}/models/versions/${candidate.id}`);
    const evidence = page.getByRole('region', { name: 'Evidence' });
    await evidence.getByRole('article').waitFor();
    const picker = page.getByRole('group', { name: 'Backtests to attach as evidence' });
    expect(await picker.innerText()).toContain('(attached)');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText("Waiting for another engineer's review").waitFor();
  });

  it('the reviewer sees the evidence on the review page and opens the full backtest', async () => {
    const page = await pageAs(REVIEWER);
    await page.goto(`${appUrl}/models/versions/${candidate.id}`);
    await page.getByRole('button', { name: 'Approve' }).waitFor();
    const item = page.getByRole('region', { name: 'Evidence' }).getByRole('article');
    await item.waitFor();
    const text = await item.innerText();
    expect(text).toMatch(/Version 2 fits Level .*better than active version 1/);
    expect(text).toContain(NOTE);
    expect(text).toContain('uploaded file tank-recording.csv');
    const fits = item.getByRole('table', { name: `Fit of version 2 against active version ${active.number}` });
    expect(await fits.getByRole('row').nth(1).getByRole('cell').nth(1).innerText()).toMatch(/^100 % \(active: .+ %\)$/);
    await page.screenshot({ path: screenshotPath('backtest-3-review-evidence.png'), fullPage: true });
    await item.getByRole('link', { name: 'Open the full backtest' }).click();
    await page.waitForURL(backtestUrl);
    await page.getByRole('region', { name: 'Verdict' }).waitFor();
  });
});
