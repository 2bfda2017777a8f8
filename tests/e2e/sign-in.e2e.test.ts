import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl, launchBrowser, signIn, stack } from './browser.js';

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const navNames = async (page: Page) =>
  (await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allInnerTexts()).map((t) => t.trim());

describe('sign-in through the identity provider page in Chromium', () => {
  it('shows the cautions on the sign-in page', async () => {
    const page = await browser.newPage();
    await page.goto(`${appUrl}/`);
    await expect.poll(() => page.url()).toContain('/signin');
    const text = await page.locator('body').innerText();
    expect(text).toMatch(/not a safety instrumented system/i);
    await page.screenshot({ path: path.join(stack.outputDir, 'signin.png'), fullPage: true });
    await page.close();
  });

  it('operator sees Floor, Loops, Alerts and Rota, and a clear page for Admin', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'operator@quillmere.example');
    expect(await navNames(page)).toEqual(['Floor', 'Loops', 'Alerts', 'Rota']);
    await page.screenshot({ path: path.join(stack.outputDir, 'operator-floor.png'), fullPage: true });
    await page.goto(`${appUrl}/admin`);
    await expect.poll(() => page.locator('body').innerText()).toMatch(/not available for your role/i);
    await page.screenshot({ path: path.join(stack.outputDir, 'operator-admin-forbidden.png'), fullPage: true });
    await context.close();
  });

  it('admin sees every section and the users table', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'admin@quillmere.example');
    expect(await navNames(page)).toEqual(['Floor', 'Loops', 'Models', 'Alerts', 'Rota', 'Admin']);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Admin' }).click();
    await expect.poll(() => page.locator('body').innerText()).toContain('reviewer@quillmere.example');
    await page.screenshot({ path: path.join(stack.outputDir, 'admin-users.png'), fullPage: true });
    await context.close();
  });

  it('sign-out ends the session', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, 'oncall@quillmere.example');
    await page.getByRole('button', { name: 'User menu' }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${appUrl}/signin**`);
    const me = await page.request.get(`${appUrl}/api/v1/me`);
    expect(me.status()).toBe(401);
    await context.close();
  });
});
