import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl, launchBrowser, screenshotPath, signedInPage } from './browser.js';

/** Digester heating around its operating point, sampled every 10 s: sludge, water-jacket and wall temperatures. */
const A_FROM_SPREADSHEET = '0.985\t0.012\t0.002\r\n0.03\t0.96\t0\r\n0.008\t0\t0.99\r\n';
const B_FROM_SPREADSHEET = '0\r\n0.04\r\n0\r\n';
const C_FROM_SPREADSHEET = '1\t0\t0\r\n';

let browser: Browser;
const contexts: BrowserContext[] = [];
const tag = `DIG-E2E-${Date.now().toString(36).toUpperCase()}`;
let loopId = '';
let analysisUrl = '';

const pageAs = (email: string) => signedInPage(browser, contexts, email);

/** What a spreadsheet copy delivers: a paste event whose clipboard holds tab-separated rows. */
async function pasteInto(page: Page, matrix: string, text: string): Promise<void> {
  await page
    .getByRole('table', { name: `Matrix ${matrix}` })
    .getByRole('textbox')
    .first()
    .focus();
  await page.evaluate((pasted) => {
    const data = new DataTransfer();
    data.setData('text/plain', pasted);
    document.activeElement?.dispatchEvent(
      new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
    );
  }, text);
}

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  for (const context of contexts) await context.close();
  await browser?.close();
});

describe('model registry in Chromium: register, paste, analyse, review, activate', () => {
  it('an engineer registers a loop with three states', async () => {
    const page = await pageAs('engineer@quillmere.example');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Loops' }).click();
    await page.getByRole('link', { name: 'Register a loop' }).click();
    await page.getByLabel('Tag', { exact: true }).fill(tag);
    await page.getByLabel('Name', { exact: true }).fill('Digester 2 heating');
    await page.getByLabel('Area', { exact: true }).selectOption({ label: 'Digestion' });
    await page.getByLabel('Sample period (s)').fill('10');
    await page.getByLabel('Plant time zone').fill('Europe/London');
    await page.getByLabel('Input 1 name').fill('hot-water valve');
    await page.getByLabel('Input 1 unit').fill('%');
    await page.getByRole('button', { name: 'Add a state' }).click();
    await page.getByRole('button', { name: 'Add a state' }).click();
    for (const [i, name] of ['sludge temperature', 'jacket water temperature', 'wall temperature'].entries()) {
      await page.getByLabel(`State ${i + 1} name`).fill(name);
      await page.getByLabel(`State ${i + 1} unit`).fill('°C');
    }
    await page.getByLabel('Output 1 name').fill('sludge temperature');
    await page.getByLabel('Output 1 unit').fill('°C');
    await page.screenshot({ path: screenshotPath('registry-1-register-loop.png'), fullPage: true });
    await page.getByRole('button', { name: 'Register the loop' }).click();
    await page.waitForURL(/\/loops\/[0-9a-f-]{36}$/);
    loopId = new URL(page.url()).pathname.split('/').pop() ?? '';
    await page.getByRole('heading', { level: 1, name: `${tag} · Digester 2 heating` }).waitFor();
  });

  it('pastes a 3-state model from a spreadsheet, sees the verdict and saves a draft', async () => {
    const page = await pageAs('engineer@quillmere.example');
    await page.goto(`${appUrl}/loops/${loopId}`);
    await page.getByRole('link', { name: 'Model versions' }).click();
    await page.getByRole('link', { name: 'New version' }).click();
    await pasteInto(page, 'A', A_FROM_SPREADSHEET);
    await page.getByText('Pasted 9 values into A from row 1, column 1.').waitFor();
    await pasteInto(page, 'B', B_FROM_SPREADSHEET);
    await pasteInto(page, 'C', C_FROM_SPREADSHEET);
    await page.getByLabel('Change note').fill('First fit from the heating step tests of week 9.');
    const preview = page.getByRole('region', { name: 'Verdict preview' });
    await expect
      .poll(() => preview.innerText(), { timeout: 10_000 })
      .toMatch(/Stable\. The slowest mode, λ = 0\.99\d*/);
    await page.screenshot({ path: screenshotPath('registry-2-editor-pasted.png'), fullPage: true });
    await page.getByRole('button', { name: 'Save as draft' }).click();
    await page.waitForURL(/\/models\/versions\/[0-9a-f-]{36}$/);
    analysisUrl = page.url();
  });

  it('reads the analysis with the unit circle and step responses, and submits it', async () => {
    const page = await pageAs('engineer@quillmere.example');
    await page.goto(analysisUrl);
    expect(await page.getByRole('region', { name: 'Verdict' }).innerText()).toMatch(
      /^Stable\. The slowest mode, λ = 0\.99\d*, settles in about .+; it dominates the long-run response\./,
    );
    await page.getByRole('group', { name: 'Eigenvalues in the complex plane with the unit circle' }).waitFor();
    expect(await page.locator('svg circle').count()).toBeGreaterThanOrEqual(4);
    const steps = page.getByRole('region', { name: 'Step responses' });
    await steps.locator('canvas').first().waitFor();
    expect(await steps.innerText()).toMatch(
      /hot-water valve → sludge temperature[\s\S]*Steady-state gain [\d.]+ °C per %/,
    );
    await page
      .getByRole('region', { name: 'State transition explorer' })
      .getByText('Free response x(k) = A^k x0')
      .waitFor();
    await page.screenshot({ path: screenshotPath('registry-3-analysis.png'), fullPage: true });
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText("Waiting for another engineer's review").waitFor();
  });

  it('the reviewer approves and activates after reading the cautions', async () => {
    const page = await pageAs('reviewer@quillmere.example');
    await page.goto(analysisUrl);
    await page.getByRole('button', { name: 'Approve' }).click();
    await page.getByRole('button', { name: 'Activate…' }).click();
    const dialog = page.getByRole('dialog');
    expect(await dialog.innerText()).toMatch(/not a safety instrumented system/);
    await dialog.getByRole('checkbox', { name: 'I have read the cautions' }).check();
    await page.screenshot({ path: screenshotPath('registry-4-activate-cautions.png'), fullPage: true });
    await dialog.getByRole('button', { name: 'Activate version 1' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('button', { name: 'Retire…' }).waitFor();
  });

  it('the operator sees the new version on the loop’s Twin model tab', async () => {
    const page = await pageAs('operator@quillmere.example');
    await page.goto(`${appUrl}/loops/${loopId}`);
    await page.getByRole('navigation', { name: 'Loop pages' }).getByRole('link', { name: 'Twin model' }).click();
    await page.getByRole('heading', { name: "Version 1 is the twin's model" }).waitFor();
    const summary = await page.getByRole('region', { name: 'Active model version' }).innerText();
    expect(summary).toContain('Priya Hallam');
    expect(summary).toContain('First fit from the heating step tests of week 9.');
    await page.screenshot({ path: screenshotPath('registry-5-operator-twin-model.png'), fullPage: true });
  });

  it('an engineer starts a new draft from the active version and compares the two', async () => {
    const page = await pageAs('engineer@quillmere.example');
    await page.goto(analysisUrl);
    await page.getByRole('link', { name: 'New draft from this version' }).click();
    const firstCell = page.getByRole('table', { name: 'Matrix A' }).getByRole('textbox').first();
    await expect.poll(() => firstCell.inputValue()).toBe('0.985');
    await firstCell.fill('0.987');
    await page.getByLabel('Change note').fill('Slightly slower sludge response after the insulation repair.');
    await page.getByRole('button', { name: 'Save as draft' }).click();
    await page.waitForURL(/\/models\/versions\/[0-9a-f-]{36}$/);
    await page.getByRole('link', { name: 'Compare with another version' }).click();
    await page.getByText('A: 1 of 9 cells changed.').waitFor();
    expect(await page.getByRole('region', { name: 'Matrices' }).innerText()).toContain('was 0.985 (+0.002)');
    await page.screenshot({ path: screenshotPath('registry-6-compare.png'), fullPage: true });
  });
});
