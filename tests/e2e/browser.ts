import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type BrowserContextOptions, type Page } from 'playwright-core';
import { inject } from 'vitest';
import { DEMO_PASSWORD } from '../../ops/idp/demo-accounts.js';

export const stack = inject('stack');
export const appUrl = stack.appUrl as string;

/** Debian's Chromium, headless, with everything that would reach the network switched off. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** Signs in through the local identity provider's pages, as a person would, and waits for the frame. */
export async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${appUrl}/`);
  await page.getByRole('button', { name: 'Sign in with your plant account' }).click();
  await page.waitForURL(`${stack.idpIssuer}/**`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  const allow = page.getByRole('button', { name: 'Allow' });
  await Promise.race([
    allow.waitFor({ timeout: 10_000 }).then(() => allow.click()),
    page.waitForURL(`${appUrl}/**`, { timeout: 10_000 }),
  ]);
  await page.waitForURL(`${appUrl}/**`);
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
}

export function screenshotPath(name: string): string {
  return path.join(stack.outputDir, name);
}

/** A page in a context of its own, signed in as `email`; the context joins `contexts` for closing. */
export async function signedInPage(
  browser: Browser,
  contexts: BrowserContext[],
  email: string,
  options: BrowserContextOptions = { viewport: { width: 1400, height: 1000 } },
): Promise<Page> {
  const context = await browser.newContext(options);
  contexts.push(context);
  const page = await context.newPage();
  await signIn(page, email);
  return page;
}
