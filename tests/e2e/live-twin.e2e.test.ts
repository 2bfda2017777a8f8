import type { Knex } from 'knex';
import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import { ENGINEER, OPERATOR, signedIn } from '../helpers/registry-fixtures.js';
import {
  insertPrediction,
  markTwinRunning,
  openDb,
  personalToken,
  postReadings,
  reading,
} from '../helpers/twin-fixtures.js';
import { appUrl, launchBrowser, screenshotPath, signedInPage, stack } from './browser.js';

/**
 * The live twin in Chromium without the simulator: the test stores the predictions the stepping
 * service would, posts readings through the ingest API, and watches the Floor and the Trend page.
 */
let browser: Browser;
let db: Knex;
let token: string;
let loop: Loop;
let version: ModelVersion;
const contexts: BrowserContext[] = [];
const ADMIN = 'admin@quillmere.example';
const PERIOD_MS = 10_000;
let lastSlotMs = 0;

/** Dissolved oxygen around 2 mg/L, as the twin predicts it, and a measurement a little off it. */
const predictedAt = (slotMs: number) => 2 + 0.05 * Math.sin(slotMs / 60_000);
const measuredAt = (slotMs: number) => predictedAt(slotMs) + 0.02 * Math.sin(slotMs / 7_000);

/** The next free slot on the loop's 10 s grid, never in the future. */
function nextSlotMs(): number {
  lastSlotMs = Math.max(Math.floor(Date.now() / PERIOD_MS) * PERIOD_MS, lastSlotMs + PERIOD_MS);
  return lastSlotMs;
}

/** What the stepping service does each sample: store its prediction and its state; then the plant's reading arrives. */
async function storeSlot(slotMs: number, measured = measuredAt(slotMs)): Promise<void> {
  await markTwinRunning(db, loop, version, { k: slotMs / PERIOD_MS, x: [3720, predictedAt(slotMs)] });
  await insertPrediction(db, {
    loopId: loop.id,
    versionId: version.id,
    slotMs,
    samplePeriodS: 10,
    x: [3720, predictedAt(slotMs)],
    y: [predictedAt(slotMs)],
  });
  const posted = await postReadings(appUrl, token, loop.id, [reading(slotMs, [62], [measured])]);
  expect(posted.body).toMatchObject({ accepted: 1, rejected: [] });
}

const pageAs = (email: string) =>
  signedInPage(browser, contexts, email, { viewport: { width: 1440, height: 1000 }, timezoneId: 'America/New_York' });

beforeAll(async () => {
  browser = await launchBrowser();
  db = openDb(stack.databaseUrl);
  const engineer = await signedIn(appUrl, ENGINEER);
  token = await personalToken(engineer, 'live twin e2e');
  const loops = await engineer.request<Loop[]>('GET', '/api/v1/loops');
  loop = loops.body.find((l) => l.tag === 'AER-DO-101') as Loop;
  version = (await engineer.request<ModelVersion>('GET', `/api/v1/model-versions/${loop.activeVersionId}`)).body;
  const startMs = Math.floor(Date.now() / PERIOD_MS) * PERIOD_MS - 45 * PERIOD_MS;
  const history = Array.from({ length: 44 }, (_, i) => startMs + i * PERIOD_MS);
  await markTwinRunning(db, loop, version, { k: history[history.length - 1] / PERIOD_MS, x: [3720, 2] });
  for (const slotMs of history) {
    await insertPrediction(db, {
      loopId: loop.id,
      versionId: version.id,
      slotMs,
      samplePeriodS: 10,
      x: [3720, predictedAt(slotMs)],
      y: [predictedAt(slotMs)],
    });
  }
  const posted = await postReadings(
    appUrl,
    token,
    loop.id,
    history.map((slotMs) => reading(slotMs, [62], [measuredAt(slotMs)])),
  );
  expect(posted.body).toMatchObject({ accepted: history.length, rejected: [] });
  lastSlotMs = history[history.length - 1];
});
afterAll(async () => {
  for (const context of contexts) await context.close();
  await browser?.close();
  await db?.destroy();
});

describe('the live twin in Chromium', () => {
  it('the Floor shows the loop in step with its sparkline, band use and reading age', async () => {
    await storeSlot(nextSlotMs());
    const page = await pageAs(OPERATOR);
    const tile = page.getByRole('link', { name: 'AER-DO-101 Basin 1 dissolved oxygen' });
    await expect.poll(() => tile.innerText(), { timeout: 15_000 }).toMatch(/in step/);
    expect(await tile.innerText()).toMatch(/Residual \d+ % of band/);
    expect(await tile.innerText()).toMatch(/Last reading (just now|\d+ s ago)/);
    await tile.locator('canvas').first().waitFor();
    await page.screenshot({ path: screenshotPath('live-twin-1-floor.png'), fullPage: true });
  });

  it('the Trend page draws the loop and takes a new reading live from the socket', async () => {
    const page = await pageAs(OPERATOR);
    await page.goto(`${appUrl}/loops/${loop.id}`);
    const readout = page.getByRole('region', { name: 'Readout' });
    await expect.poll(() => readout.innerText(), { timeout: 15_000 }).toMatch(/\d\.\d+ mg\/L/);
    expect(await readout.innerText()).toMatch(/(GMT|BST)/);
    await page.getByRole('figure', { name: 'Dissolved oxygen (mg/L)' }).locator('canvas').waitFor();
    await page.getByText('● Live').waitFor();
    await storeSlot(nextSlotMs(), 2.345);
    await expect.poll(() => readout.innerText(), { timeout: 10_000 }).toContain('2.345 mg/L');
    const forecast = page.getByRole('region', { name: 'Next 60 samples' });
    await expect
      .poll(() => forecast.innerText(), { timeout: 10_000 })
      .toMatch(/Dissolved oxygen: [\d.]+ mg\/L → [\d.]+ mg\/L/);
    await page.screenshot({ path: screenshotPath('live-twin-2-trend.png'), fullPage: true });

    const move = page.getByRole('region', { name: 'Try a move' });
    await move.getByLabel('Step added to the input (%)').fill('5');
    await move.getByRole('button', { name: 'Preview the move' }).click();
    await move.getByText(/Dissolved oxygen: [\d.]+ mg\/L with the move/).waitFor();
    expect(await move.innerText()).toMatch(/not a setpoint change/);
    await page.screenshot({ path: screenshotPath('live-twin-3-move-preview.png'), fullPage: true });
  });

  it('an admin creates an ingest source and sees its token once', async () => {
    const page = await pageAs(ADMIN);
    await page.goto(`${appUrl}/admin/ingest-sources`);
    await page.getByRole('textbox', { name: 'Name' }).fill('Aeration historian bridge');
    await page.getByRole('checkbox', { name: /AER-DO-101/ }).check();
    await page.getByRole('button', { name: 'Create source and token' }).click();
    const value = page.getByRole('textbox', { name: 'New token value' });
    await expect.poll(() => value.inputValue()).toMatch(/^sli_/);
    await page.screenshot({ path: screenshotPath('live-twin-4-ingest-source.png'), fullPage: true });
  });

  it('an engineer imports a CSV of readings and sees the bad row by its line', async () => {
    const page = await pageAs(ENGINEER);
    await page.goto(`${appUrl}/loops/${loop.id}/import`);
    const dayAgo = Math.floor(Date.now() / PERIOD_MS) * PERIOD_MS - 86_400_000;
    const lines = [
      'time,Blower speed,Dissolved oxygen',
      ...Array.from(
        { length: 30 },
        (_, i) => `${new Date(dayAgo + i * PERIOD_MS).toISOString()},62,${(2 + i / 1000).toFixed(3)}`,
      ),
    ];
    lines[5] = `${new Date(dayAgo + 4 * PERIOD_MS).toISOString()},62,not-a-number`;
    await page
      .getByLabel('CSV file of readings')
      .setInputFiles({ name: 'basin1-history.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\n')) });
    await page.getByRole('region', { name: 'First rows of the file' }).waitFor();
    await page.getByRole('button', { name: 'Import readings' }).click();
    const result = page.getByRole('region', { name: 'Import result' });
    await expect.poll(() => result.innerText(), { timeout: 20_000 }).toMatch(/Accepted\s+29/);
    expect(await result.innerText()).toMatch(/\b6\b/);
    await page.screenshot({ path: screenshotPath('live-twin-5-import.png'), fullPage: true });
  });
});
