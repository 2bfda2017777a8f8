import type { Knex } from 'knex';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../ops/idp/demo-accounts.js';
import { rotateDemoIngestSource } from '../../ops/lib/demo-ingest-source.js';
import { startService, stopServices, type Service } from '../../ops/lib/processes.js';
import { QUILLMERE_PROFILES } from '../../simulator/src/demo-plant/quillmere.js';
import { eventually, openDb } from '../helpers/twin-fixtures.js';
import { appUrl, launchBrowser, screenshotPath, signIn, stack } from './browser.js';

/**
 * The demo as `npm start` runs it: the simulator and the demo plant as processes of their own
 * (DEMO_SPEED 1, the same fault script), posting through the real ingest API to the api of this
 * run, with the seeded drift rules and on-call rota. Within 2 minutes every demo loop is in step
 * on the Floor and a trend page receives every sample; the scheduled fault must raise an alert
 * within 5 minutes of the demo plant's start; the on-call engineer's e-mail reaches the local
 * mailbox; its one-click link (sign-in first, as from a mail client) acknowledges the alert; the
 * alert is closed with a cause in the app. Screenshots in test-output/e2e/.
 */
const FIVE_MINUTES_MS = 5 * 60_000;
const ONCALL = 'oncall@quillmere.example';
const ADMIN = 'admin@quillmere.example';
const DEMO_TAGS = QUILLMERE_PROFILES.map((p) => p.tag);
const root = process.cwd();
let db: Knex;
let browser: Browser;
let services: Service[] = [];
let startedAt = 0;
const contexts: BrowserContext[] = [];

beforeAll(async () => {
  db = openDb(stack.databaseUrl);
  browser = await launchBrowser();
  const source = await rotateDemoIngestSource(stack.databaseUrl);
  services = [startService('simulator', 'simulator/src/index.ts', { DATABASE_URL: stack.databaseUrl }, root)];
  startedAt = Date.now();
  services.push(
    startService(
      'demo-plant',
      'simulator/src/demo-plant/main.ts',
      { DATABASE_URL: stack.databaseUrl, API_URL: appUrl, DEMO_PLANT_TOKEN: source.token, DEMO_SPEED: '1' },
      root,
    ),
  );
});

afterAll(async () => {
  await stopServices(services, 5000);
  // other suites drive the demo loops by hand: leave them as the seed made them
  if (db) {
    const demoLoopIds = db('loops').whereIn('tag', DEMO_TAGS).select('id');
    for (const table of ['predictions', 'readings', 'twin_state', 'loop_tracking', 'loop_leases', 'alerts'])
      await db(table).whereIn('loop_id', demoLoopIds).delete();
  }
  for (const context of contexts) await context.close();
  await browser?.close();
  await db?.destroy();
});

async function newPage(): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 1000 }, timezoneId: 'Europe/London' });
  contexts.push(context);
  return context.newPage();
}

type AlertRow = { id: string; number: string; rule_kind: string; raised_at: Date; state: string; tag: string };

describe('a divergence in the running demo, from the plant to a closed alert', () => {
  it(
    "raises an alert from the demo plant's scheduled fault within 5 minutes, mails the on-call engineer, whose link acknowledges it; closed with a cause",
    { timeout: 8 * 60_000 },
    async () => {
      // before the fault: within 2 minutes every demo loop is in step, and a trend page follows each sample
      const watcher = await newPage();
      await signIn(watcher, ADMIN);
      type ListedLoop = { id: string; tag: string; status: string; samplePeriodS: number };
      const demoLoops = async () =>
        ((await (await watcher.request.get(`${appUrl}/api/v1/loops`)).json()) as ListedLoop[]).filter((l) =>
          DEMO_TAGS.includes(l.tag),
        );
      await eventually(
        async () => {
          const loops = await demoLoops();
          return loops.length === DEMO_TAGS.length && loops.every((l) => l.status === 'in_step') ? loops : undefined;
        },
        'every demo loop in step',
        Math.max(1000, 2 * 60_000 - (Date.now() - startedAt)),
        1000,
      );
      const inStepAfterS = (Date.now() - startedAt) / 1000;
      console.log(`every demo loop in step ${inStepAfterS.toFixed(0)} s after the start`);
      await watcher.goto(`${appUrl}/`);
      for (const tag of DEMO_TAGS) {
        const tile = watcher.getByRole('link', { name: new RegExp(`^${tag} `) });
        await expect.poll(() => tile.innerText(), { timeout: 15_000 }).toMatch(/in step/);
      }
      await watcher.screenshot({ path: screenshotPath('alerts-00a-floor-every-loop-in-step.png'), fullPage: true });
      const aeration = (await demoLoops()).find((l) => l.tag === 'AER-DO-101') as ListedLoop;
      const samples: number[] = [];
      watcher.on('websocket', (socket) =>
        socket.on('framereceived', (frame) => {
          const text = typeof frame.payload === 'string' ? frame.payload : frame.payload.toString('utf8');
          if (text.includes('twin:sample') && text.includes(aeration.id)) samples.push(Date.now());
        }),
      );
      await watcher.goto(`${appUrl}/loops/${aeration.id}`);
      await eventually(
        () => (samples.length >= 2 ? true : undefined),
        'two live samples on the trend page',
        3 * aeration.samplePeriodS * 1000,
        200,
      );
      expect(samples[1] - samples[0]).toBeLessThan(1.5 * aeration.samplePeriodS * 1000);
      await watcher.screenshot({ path: screenshotPath('alerts-00b-trend-following-the-twin.png'), fullPage: true });

      const raised = await eventually(
        async () =>
          (await db('alerts as a')
            .join('loops as l', 'l.id', 'a.loop_id')
            .whereIn('l.tag', DEMO_TAGS)
            .andWhere('a.raised_at', '>', new Date(startedAt))
            .orderBy('a.raised_at')
            .first<AlertRow | undefined>('a.id', 'a.number', 'a.rule_kind', 'a.raised_at', 'a.state', 'l.tag')) ??
          undefined,
        'an alert on a demo loop',
        FIVE_MINUTES_MS + 10_000,
        1000,
      );
      const afterMs = raised.raised_at.getTime() - startedAt;
      console.log(`first demo alert: ${raised.tag} ${raised.rule_kind} after ${(afterMs / 1000).toFixed(0)} s`);
      expect(afterMs).toBeLessThan(FIVE_MINUTES_MS);

      // the primary on call (the seeded rota) gets one e-mail with the alert link and the one-click link
      const mail = await eventually(
        async () =>
          (await db('dev_mail')
            .whereRaw('? = ANY(to_addresses)', [ONCALL])
            .andWhere('text', 'like', `%/alerts/${raised.id}%`)
            .first<{ subject: string; text: string } | undefined>('subject', 'text')) ?? undefined,
        'the alert e-mail in the local mailbox',
        30_000,
        500,
      );
      expect(mail.subject).toContain(raised.tag);
      expect(mail.text.toLowerCase()).toContain('advisory');
      const link = /https?:\/\/\S+\/a\/[A-Za-z0-9_.-]+/.exec(mail.text)?.[0];
      expect(link).toBeDefined();

      // the mailbox as an administrator sees it
      const mailbox = await newPage();
      await signIn(mailbox, ADMIN);
      await mailbox.goto(`${appUrl}/admin/dev-mail`);
      await mailbox.getByText(mail.subject).first().waitFor();
      await mailbox.screenshot({ path: screenshotPath('alerts-01-development-mailbox.png'), fullPage: true });
      await mailbox.goto(`${appUrl}/`);
      await mailbox.locator('main').getByText(raised.tag).first().waitFor();
      await mailbox.screenshot({ path: screenshotPath('alerts-00-floor-with-the-diverged-loop.png'), fullPage: true });

      // the on-call engineer follows the link from a mail client: no session yet, so sign-in comes first
      const page = await newPage();
      await page.goto(link as string);
      await page.waitForURL(`${stack.idpIssuer}/**`);
      await page.getByLabel('E-mail').fill(ONCALL);
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      const allow = page.getByRole('button', { name: 'Allow' });
      await Promise.race([
        allow.waitFor({ timeout: 10_000 }).then(() => allow.click()),
        page.waitForURL(`${appUrl}/alerts/**`, { timeout: 10_000 }),
      ]);
      await page.waitForURL(`${appUrl}/alerts/${raised.id}?ack=done`);
      await page.getByText('The alert is acknowledged').waitFor();
      await page.getByRole('heading', { name: 'Where the residual points' }).waitFor();
      await page.screenshot({ path: screenshotPath('alerts-02-acknowledged-from-the-mail-link.png'), fullPage: true });
      expect((await db('alerts').where({ id: raised.id }).first<{ state: string }>('state')).state).toBe(
        'acknowledged',
      );

      // the link works once
      await page.goto(link as string);
      await page.waitForURL(`${appUrl}/alerts/${raised.id}?ack=used`);
      await page.getByText('works only once').waitFor();

      // closed with a cause and a note, in the app
      await page.goto(`${appUrl}/alerts/${raised.id}`);
      await page.getByRole('button', { name: 'Close…' }).click();
      await page.getByLabel('Cause').selectOption('sensor_fault');
      await page.getByLabel('Note').fill('Level transmitter drifted; recalibrated against the dip tape.');
      await page.screenshot({ path: screenshotPath('alerts-03-closing-with-a-cause.png'), fullPage: true });
      await page.getByRole('button', { name: 'Close the alert' }).click();
      await eventually(
        async () =>
          (await db('alerts').where({ id: raised.id }).first<{ state: string }>('state')).state === 'closed'
            ? true
            : undefined,
        'the alert closed',
      );
      await page.getByText('closed', { exact: false }).first().waitFor();
      await page.screenshot({ path: screenshotPath('alerts-04-closed-with-timeline.png'), fullPage: true });
      const events = (await db('alert_events').where({ alert_id: raised.id }).orderBy('id').pluck('kind')) as string[];
      expect(events).toEqual(expect.arrayContaining(['raised', 'notified', 'acknowledged', 'closed']));

      // the queue and the Floor as the on-call engineer sees them now
      await page.goto(`${appUrl}/alerts?state=closed`);
      await page.locator('main').getByRole('link', { name: raised.tag }).first().waitFor();
      await page.screenshot({ path: screenshotPath('alerts-05-queue.png'), fullPage: true });
      await page.goto(`${appUrl}/rota`);
      await page.locator('main').getByText('Dara Okafor').first().waitFor();
      await page.screenshot({ path: screenshotPath('alerts-06-rota.png'), fullPage: true });
    },
  );
});
