import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import nodemailer from 'nodemailer';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { loadConfig, type Config } from '../../api/src/config/config.js';
import { createDb } from '../../api/src/db/knex.js';
import { configureAlertMail, enqueueAlertMail } from '../../api/src/modules/mail/alert-mail.js';
import { acknowledgeAlert } from '../../api/src/modules/alerts/alerts.service.js';
import { ackLinkKey, signAckToken } from '../../api/src/modules/mail/ack-token.js';
import { escalateDueAlerts } from '../../api/src/modules/mail/escalation.js';
import { startMailSender, type MailSender } from '../../api/src/modules/mail/outbox-sender.js';
import { dropDatabase, ensureDatabase, migrateAndSeed, withDatabase } from '../../ops/lib/database.js';
import { freePort } from '../../ops/lib/ports.js';
import { startMailServer, type MailServer } from '../../ops/mail/server.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient } from '../helpers/session-client.js';
import { eventually } from '../helpers/twin-fixtures.js';

/**
 * Alert e-mail end to end: outbox, sender, SMTP outages, restarts, the one-click link, escalation.
 * Other files start apis whose senders drain the run's shared database, so this file works in a
 * database, mail capture and sender of its own.
 */
const stack = inject('stack');
const SECRET = 'integration-test-session-secret-0123456789'; // the one startApi configures
const PUBLIC_URL = 'http://shadowloop.test';
const ONCALL = 'oncall@quillmere.example';
const SECOND = 'second-oncall@quillmere.example';
const ENGINEER = 'engineer@quillmere.example';
const adminUrl = process.env.SHADOWLOOP_TEST_PG_URL ?? '';
const dbName = `shadowloop_alertmail_${randomBytes(4).toString('hex')}`;
const logger = pino({ level: 'silent' });
let databaseUrl: string;
let db: Knex;
let mail: MailServer | null = null;
let mailPort: number;
let config: Config;

type OutboxRow = { id: string; to_address: string; message_id: string; attempts: number; sent_at: Date | null };
type Captured = { to_addresses: string[]; subject: string; text: string };

const senderConfig = (env: Record<string, string> = {}) =>
  loadConfig({
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: SECRET,
    OIDC_ISSUER: stack.idpIssuer,
    OIDC_CLIENT_ID: stack.clientId,
    OIDC_CLIENT_SECRET: stack.clientSecret,
    SMTP_PORT: String(mailPort),
    MAIL_POLL_INTERVAL_MS: '50',
    MAIL_RETRY_BASE_MS: '150',
    MAIL_RETRY_MAX_MS: '600',
    ...env,
  });

async function mailUp(): Promise<void> {
  mail ??= await startMailServer({ port: mailPort, databaseUrl });
}
async function mailDown(): Promise<void> {
  await mail?.close();
  mail = null;
}
const repeatsDropped = () => mail?.repeatsDropped ?? 0;

async function userId(email: string): Promise<string> {
  return ((await db('users').where({ email }).first('id')) as { id: string }).id;
}

/**
 * Who is on call: Aeration has a primary and a secondary, Storage only a primary, Digestion nobody.
 * The seeded demo rota and area engineers go first (this database is the file's own).
 */
async function setUpRota(): Promise<void> {
  await db('oncall_shifts').del();
  await db('area_engineers').del();
  const [second] = await db('users')
    .insert({ email: SECOND, name: 'Sami Lindqvist' })
    .returning<{ id: string }[]>('id');
  await db('user_roles').insert({ user_id: second.id, role: 'oncall' });
  const day = 86_400_000;
  const shift = { starts_at: new Date(Date.now() - day), ends_at: new Date(Date.now() + day) };
  const oncall = await userId(ONCALL);
  await db('oncall_shifts').insert([
    { ...shift, user_id: oncall, area_id: 'aeration', position: 'primary' },
    { ...shift, user_id: second.id, area_id: 'aeration', position: 'secondary' },
    { ...shift, user_id: oncall, area_id: 'storage', position: 'primary' },
  ]);
  await db('area_engineers').insert({ area_id: 'aeration', user_id: await userId(ENGINEER) });
}

/** What the rule evaluation does on a raise: a loop of its own, the alert, its event and its mail. */
async function raiseAlert(area: string, minutesAgo = 0): Promise<{ id: string; tag: string; queued: number }> {
  const tag = `MAIL-${randomBytes(3).toString('hex').toUpperCase()}`;
  const raisedAt = new Date(Date.now() - minutesAgo * 60_000);
  const signal = [{ name: 'Level', unit: 'm' }];
  return db.transaction(async (trx) => {
    const [loop] = await trx('loops')
      .insert({
        tag,
        name: 'Mail test tank',
        area_id: area,
        sample_period_s: 1,
        time_zone: 'Europe/London',
        inputs: JSON.stringify([{ name: 'Pump', unit: '%' }]),
        states: JSON.stringify(signal),
        outputs: JSON.stringify(signal),
      })
      .returning<{ id: string }[]>('id');
    const [alert] = await trx('alerts')
      .insert({
        loop_id: loop.id,
        area_id: area,
        rule_kind: 'band',
        rule_version: 1,
        priority: 2,
        raised_at: raisedAt,
        summary: 'Level residual stayed above its band for 5 samples.',
        detail: JSON.stringify({
          statistic: '|residual| / limit',
          value: 2.5,
          limit: 1,
          signals: [{ name: 'Level', unit: 'm', measured: 2.5, predicted: 2, residual: 0.5, limit: 0.2 }],
        }),
        direction: JSON.stringify({
          signals: [],
          modes: [],
          points: 'sensor',
          hint: 'Level drifts alone: check its transmitter.',
        }),
      })
      .returning<{ id: string }[]>('id');
    await trx('alert_events').insert({ alert_id: alert.id, at: raisedAt, kind: 'raised', to_state: 'unacknowledged' });
    return { id: alert.id, tag, queued: await enqueueAlertMail(trx, alert.id, 'raised') };
  });
}

const outbox = async (alertId: string, reason?: string) =>
  (await db('mail_outbox')
    .where({ alert_id: alertId })
    .modify((q) => {
      if (reason) q.where({ reason });
    })
    .orderBy('id')) as OutboxRow[];

const captured = async (messageId: string) =>
  (await db('dev_mail').where({ message_id: messageId }).select('to_addresses', 'subject', 'text')) as Captured[];

async function allSent(alertIds: string[], timeoutMs = 10_000): Promise<OutboxRow[]> {
  return eventually(
    async () => {
      const rows = (await db('mail_outbox').whereIn('alert_id', alertIds).orderBy('id')) as OutboxRow[];
      return rows.every((r) => r.sent_at) ? rows : undefined;
    },
    'every queued message sent',
    timeoutMs,
  );
}

/** Every message of these alerts reached the capture exactly once and was recorded as sent once. */
async function expectDeliveredOnce(rows: OutboxRow[]): Promise<void> {
  for (const row of rows) {
    expect(await captured(row.message_id)).toHaveLength(1);
    const notified = await db('alert_events')
      .where({ kind: 'notified' })
      .whereRaw(`details->>'messageId' = ?`, [row.message_id]);
    expect(notified).toHaveLength(1);
  }
}

beforeAll(async () => {
  if (!adminUrl) throw new Error('SHADOWLOOP_TEST_PG_URL is not set: run this file with `npm test -- <file>`.');
  await ensureDatabase(adminUrl, dbName);
  databaseUrl = withDatabase(adminUrl, dbName);
  await migrateAndSeed(databaseUrl, { seed: true });
  db = createDb(databaseUrl, 8);
  mailPort = await freePort();
  await mailUp();
  config = senderConfig();
  configureAlertMail({ publicUrl: PUBLIC_URL, secret: SECRET });
  await setUpRota();
});

afterAll(async () => {
  await mailDown();
  await db?.destroy();
  if (adminUrl) await dropDatabase(adminUrl, dbName);
});

describe('alert mail through the outbox', () => {
  it('queues the message with the raise and keeps it through an SMTP outage; it arrives once', async () => {
    await mailDown();
    const alert = await raiseAlert('aeration');
    expect(alert.queued).toBe(1);
    const sender = startMailSender({ db, config, logger });
    let sent: OutboxRow;
    try {
      const failing = await eventually(async () => {
        const [row] = await outbox(alert.id);
        return row.attempts >= 2 ? row : undefined;
      }, 'two failed attempts');
      expect(failing.sent_at).toBeNull();
      expect((await db('mail_outbox').where({ id: failing.id }).first('last_error')).last_error).toMatch(
        /ECONNREFUSED/,
      );
      await mailUp();
      [sent] = await allSent([alert.id]);
    } finally {
      await sender.stop();
    }
    expect(sent.attempts).toBeGreaterThan(2);
    expect(sent.to_address).toBe(ONCALL);
    await expectDeliveredOnce([sent]);
    expect(repeatsDropped()).toBe(0);

    const [message] = await captured(sent.message_id);
    expect(message.to_addresses).toEqual([ONCALL]);
    expect(message.subject).toBe(`[Shadowloop P2] ${alert.tag} diverged — band rule`);
    expect(message.text).toContain(`Loop:     ${alert.tag} — Mail test tank`);
    expect(message.text).toContain('Area:     Aeration');
    expect(message.text).toContain('Level: measured 2.5 m, predicted 2 m, residual 0.5 m, limit 0.2 m');
    expect(message.text).toContain('Level drifts alone: check its transmitter.');
    expect(message.text).toContain(`${PUBLIC_URL}/alerts/${alert.id}`);
    expect(message.text).toMatch(new RegExp(`${PUBLIC_URL}/a/[A-Za-z0-9_-]+\\.[A-Za-z0-9_-]+`));
    expect(message.text).toContain('Shadowloop is an advisory monitoring tool. It is not a safety instrumented system');
    expect(message.text).toContain("Act on this alert only within the site's procedures");
    const events = await db('alerts').where({ id: alert.id }).first('notified_at');
    expect(events.notified_at).toBeInstanceOf(Date);
  });

  it('tells everyone with the on-call role when nobody is on call for the area, and says so', async () => {
    const alert = await raiseAlert('digestion');
    const rows = await outbox(alert.id);
    const holders = (await db('user_roles as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where('r.role', 'oncall')
      .pluck('u.email')) as string[];
    expect(rows.map((r) => r.to_address).sort()).toEqual([...holders].sort());
    expect(rows.length).toBeGreaterThanOrEqual(3);
    const text = (await db('mail_outbox').where({ id: rows[0].id }).first('text')).text as string;
    expect(text).toContain(
      'Nobody is on call for Digestion right now, so this goes to everyone who holds the on-call role.',
    );
    const sender = startMailSender({ db, config, logger });
    try {
      await expectDeliveredOnce(await allSent([alert.id]));
    } finally {
      await sender.stop();
    }
  });
});

describe('restarts and several senders', () => {
  it('a sender stopped mid-retry and a new one started: each message once', async () => {
    await mailDown();
    const alert = await raiseAlert('digestion');
    const first = startMailSender({ db, config, logger });
    await eventually(
      async () => ((await outbox(alert.id)).every((r) => r.attempts >= 1) ? true : undefined),
      'a try each',
    );
    await first.stop();
    expect((await outbox(alert.id)).every((r) => r.sent_at === null)).toBe(true);
    await mailUp();
    const dropped = repeatsDropped();
    const second = startMailSender({ db, config, logger });
    try {
      const rows = await allSent([alert.id]);
      expect(rows.every((r) => r.attempts >= 2)).toBe(true);
      await expectDeliveredOnce(rows);
    } finally {
      await second.stop();
    }
    expect(repeatsDropped()).toBe(dropped);
  });

  it('a sender stopped while mail is pending leaves the rest to the next one, none twice', async () => {
    await mailUp();
    const alerts = [await raiseAlert('digestion'), await raiseAlert('digestion'), await raiseAlert('digestion')];
    const ids = alerts.map((a) => a.id);
    const dropped = repeatsDropped();
    const first = startMailSender({ db, config, logger });
    await eventually(
      async () =>
        (await db('mail_outbox').whereIn('alert_id', ids).whereNotNull('sent_at').first('id')) ? true : undefined,
      'a first message sent',
    );
    await first.stop();
    const second = startMailSender({ db, config, logger });
    try {
      await expectDeliveredOnce(await allSent(ids));
    } finally {
      await second.stop();
    }
    expect(repeatsDropped()).toBe(dropped);
  });

  it('two senders at once never send one message twice', async () => {
    await mailUp();
    const alerts = await Promise.all([0, 1, 2, 3].map(() => raiseAlert('digestion')));
    const ids = alerts.map((a) => a.id);
    const dropped = repeatsDropped();
    const slow = senderConfig({ MAIL_POLL_INTERVAL_MS: '60000' });
    const senders: MailSender[] = [
      startMailSender({ db, config: slow, logger }),
      startMailSender({ db, config: slow, logger }),
    ];
    try {
      await Promise.all(senders.flatMap((s) => [s.drainOnce(), s.drainOnce()]));
      const rows = await allSent(ids);
      expect(rows.length).toBeGreaterThanOrEqual(12);
      expect(rows.every((r) => r.attempts === 1)).toBe(true);
      await expectDeliveredOnce(rows);
    } finally {
      await Promise.all(senders.map((s) => s.stop()));
    }
    expect(repeatsDropped()).toBe(dropped);
  });

  it('a crash after the relay accepted but before the commit resends with the same Message-ID, stored once', async () => {
    await mailUp();
    const alert = await raiseAlert('aeration');
    const [row] = await outbox(alert.id);
    const full = await db('mail_outbox').where({ id: row.id }).first();
    // What the dead process got through before it could mark the row sent.
    const relay = nodemailer.createTransport({ host: '127.0.0.1', port: mailPort, secure: false, ignoreTLS: true });
    await relay.sendMail({
      from: config.MAIL_FROM,
      to: full.to_address,
      subject: full.subject,
      text: full.text,
      messageId: full.message_id,
    });
    const dropped = repeatsDropped();
    const sender = startMailSender({ db, config, logger });
    try {
      const [sent] = await allSent([alert.id]);
      expect(sent.attempts).toBe(1);
    } finally {
      await sender.stop();
    }
    expect(repeatsDropped()).toBe(dropped + 1);
    expect(await captured(row.message_id)).toHaveLength(1);
  });
});

/** Follows a link as a browser would: through sign-in at the provider and back, until it lands on a page. */
async function followThroughSignIn(client: SessionClient, start: string, email: string): Promise<string> {
  let url = start;
  let init: RequestInit = {};
  let credentialsSent = false;
  for (let hop = 0; hop < 20; hop++) {
    const response = await client.raw(url, init);
    init = {};
    const location = response.headers.get('location');
    if (response.status >= 300 && response.status < 400 && location) {
      url = new URL(location, url).toString();
      if (url.startsWith(client.baseUrl) && new URL(url).pathname.startsWith('/alerts')) return url;
      continue;
    }
    const html = await response.text();
    const login = /action="([^"]*\/login)"/.exec(html);
    const confirm = /action="([^"]*\/confirm)"/.exec(html);
    if (login && !credentialsSent) {
      credentialsSent = true;
      url = new URL(login[1], url).toString();
      const body = new URLSearchParams({ email, password: 'shadowloop-demo' }).toString();
      init = { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body };
    } else if (confirm) {
      url = new URL(confirm[1], url).toString();
      init = { method: 'POST' };
    } else throw new Error(`the sign-in stopped at ${url} with ${response.status}`);
  }
  throw new Error('the link did not land within 20 redirects');
}

describe('the one-click acknowledge link', () => {
  let api: RunningApi;
  let oncall: SessionClient;
  const key = ackLinkKey(SECRET);

  beforeAll(async () => {
    await mailUp();
    api = await startApi({ ...stack, databaseUrl, smtpPort: mailPort }, { ALERT_WORKERS: 'false' });
    configureAlertMail({ publicUrl: PUBLIC_URL, secret: SECRET });
  });
  afterAll(async () => {
    await api?.close();
  });

  /** Raises an alert in Aeration, sends its mail, and reads the on-call's link out of the message. */
  async function mailedLink(): Promise<{ alertId: string; token: string }> {
    const alert = await raiseAlert('aeration');
    const sender = startMailSender({ db, config, logger });
    const rows = await allSent([alert.id]).finally(() => sender.stop());
    const [message] = await captured(rows[0].message_id);
    const token = /\/a\/([A-Za-z0-9_-]+\.[A-Za-z0-9_-]+)/.exec(message.text)?.[1];
    if (!token) throw new Error(`no acknowledge link in:\n${message.text}`);
    return { alertId: alert.id, token };
  }
  async function open(client: SessionClient | null, token: string): Promise<{ status: number; location: string }> {
    const url = `${api.url}/a/${token}`;
    const response = client ? await client.raw(url) : await fetch(url, { redirect: 'manual' });
    return { status: response.status, location: response.headers.get('location') ?? '' };
  }
  const stateOf = async (alertId: string) => (await db('alerts').where({ id: alertId }).first('state')).state as string;
  const linkOf = (alertId: string) => db('alert_ack_links').where({ alert_id: alertId }).first('used_at', 'used_by');

  it('asks for sign-in first, then acknowledges once, with the timeline event and the audit entry', async () => {
    const { alertId, token } = await mailedLink();
    const anonymous = await open(null, token);
    expect(anonymous.status).toBe(302);
    expect(anonymous.location).toBe(`/auth/login?returnTo=${encodeURIComponent(`/a/${token}`)}`);

    oncall = new SessionClient(api.url);
    const landed = await followThroughSignIn(oncall, `${api.url}${anonymous.location}`, ONCALL);
    expect(landed).toBe(`${api.url}/alerts/${alertId}?ack=done`);
    const oncallId = await userId(ONCALL);
    expect(await db('alerts').where({ id: alertId }).first('state', 'acknowledged_by')).toEqual({
      state: 'acknowledged',
      acknowledged_by: oncallId,
    });
    const event = await db('alert_events').where({ alert_id: alertId, kind: 'acknowledged' }).first();
    expect(event).toMatchObject({ actor_id: oncallId, from_state: 'unacknowledged', to_state: 'acknowledged' });
    expect(event.details).toMatchObject({ via: 'mail_link' });
    const audit = await db('audit_log').where({ action: 'alert.acknowledged', target_id: alertId }).first();
    expect(audit).toMatchObject({ actor_email: ONCALL });
    expect(await linkOf(alertId)).toMatchObject({ used_by: oncallId });

    expect(await open(oncall, token)).toEqual({ status: 302, location: `/alerts/${alertId}?ack=used` });
    expect(await db('alert_events').where({ alert_id: alertId, kind: 'acknowledged' })).toHaveLength(1);
  });

  it('acknowledges once when the link is opened twice at the same moment', async () => {
    const { alertId, token } = await mailedLink();
    const both = await Promise.all([open(oncall, token), open(oncall, token)]);
    expect(both.map((r) => r.location).sort()).toEqual([`/alerts/${alertId}?ack=done`, `/alerts/${alertId}?ack=used`]);
    expect(await db('alert_events').where({ alert_id: alertId, kind: 'acknowledged' })).toHaveLength(1);
  });

  it('refuses an expired link and leaves the alert as it was', async () => {
    const { alertId, token } = await mailedLink();
    await db('alert_ack_links')
      .where({ alert_id: alertId })
      .update({ expires_at: db.raw(`now() - interval '1 minute'`) });
    expect(await open(oncall, token)).toEqual({ status: 302, location: `/alerts/${alertId}?ack=expired` });
    expect(await stateOf(alertId)).toBe('unacknowledged');
    expect(await linkOf(alertId)).toMatchObject({ used_at: null });
  });

  it('refuses a tampered, unknown or malformed token', async () => {
    const { alertId, token } = await mailedLink();
    const [payload, signature] = token.split('.');
    const flipped = (at: number) =>
      `${payload}.${signature.slice(0, at)}${signature[at] === 'A' ? 'B' : 'A'}${signature.slice(at + 1)}`;
    const unknown = signAckToken(key, '00000000-0000-4000-8000-000000000000', new Date(Date.now() + 3_600_000));
    for (const bad of [flipped(5), flipped(signature.length - 1), unknown, 'not-a-token', `${payload}.`]) {
      expect(await open(oncall, bad)).toEqual({ status: 302, location: '/alerts?ack=invalid' });
    }
    expect(await stateOf(alertId)).toBe('unacknowledged');
    expect(await open(oncall, token)).toEqual({ status: 302, location: `/alerts/${alertId}?ack=done` });
  });

  it('acts only for the person it was mailed to: another on-call engineer is sent to the app', async () => {
    const { alertId, token } = await mailedLink();
    const other = new SessionClient(api.url);
    await other.signIn('admin@quillmere.example');
    expect(await open(other, token)).toEqual({ status: 302, location: `/alerts/${alertId}?ack=someone_else` });
    expect(await stateOf(alertId)).toBe('unacknowledged');
    expect(await linkOf(alertId)).toMatchObject({ used_at: null });
  });

  it('refuses people without the on-call role and keeps the link for someone who has it', async () => {
    const { alertId, token } = await mailedLink();
    const operator = new SessionClient(api.url);
    await operator.signIn('operator@quillmere.example');
    expect(await open(operator, token)).toEqual({ status: 302, location: `/alerts/${alertId}?ack=forbidden` });
    expect(await stateOf(alertId)).toBe('unacknowledged');
    expect(await linkOf(alertId)).toMatchObject({ used_at: null });
  });

  it('says so when someone acknowledged in the app first, and leaves the link unused', async () => {
    const { alertId, token } = await mailedLink();
    const oncallUser = { id: await userId(ONCALL), email: ONCALL, name: 'Dara Okafor', roles: ['oncall' as const] };
    await acknowledgeAlert(db, oncallUser, alertId, 'seen on the floor');
    expect(await open(oncall, token)).toEqual({ status: 302, location: `/alerts/${alertId}?ack=already` });
    expect(await linkOf(alertId)).toMatchObject({ used_at: null });
  });
});

describe('escalation', () => {
  /** Moves an alert's raise (and its events) back in time, as if it had waited that long. */
  async function backdate(alertId: string, minutes: number): Promise<void> {
    const shift = db.raw(`make_interval(mins => ?)`, [minutes]);
    await db('alerts')
      .where({ id: alertId })
      .update({ raised_at: db.raw('raised_at - ?', [shift]) });
    await db('alert_events')
      .where({ alert_id: alertId })
      .update({ at: db.raw('at - ?', [shift]) });
  }
  const escalated = async (alertId: string) =>
    (await escalateDueAlerts(db)).some((c) => c.alertId === alertId && c.type === 'updated');
  const levelOf = async (alertId: string) =>
    (await db('alerts').where({ id: alertId }).first('escalation_level')).escalation_level as number;

  it('goes to the secondary after secondary_after_min, then to the area engineers, each once', async () => {
    const { secondary_after_min: secondMin, area_after_min: areaMin } = await db('alert_settings').first();
    const alert = await raiseAlert('aeration');
    await backdate(alert.id, secondMin - 1);
    expect(await escalated(alert.id)).toBe(false);

    await backdate(alert.id, 2);
    expect(await escalated(alert.id)).toBe(true);
    expect(await levelOf(alert.id)).toBe(1);
    expect((await outbox(alert.id, 'escalated_secondary')).map((r) => r.to_address)).toEqual([SECOND]);
    const event = await db('alert_events').where({ alert_id: alert.id, kind: 'escalated' }).first();
    expect(event.note).toBe('Escalated to Sami Lindqvist, secondary on call.');
    expect(await escalated(alert.id)).toBe(false);

    await backdate(alert.id, areaMin - secondMin);
    expect(await escalated(alert.id)).toBe(true);
    expect(await levelOf(alert.id)).toBe(2);
    const area = await outbox(alert.id, 'escalated_area');
    expect(area.map((r) => r.to_address)).toEqual([ENGINEER]);
    expect(await escalated(alert.id)).toBe(false);

    await mailUp();
    const sender = startMailSender({ db, config, logger });
    const rows = await allSent([alert.id]).finally(() => sender.stop());
    await expectDeliveredOnce(rows);
    const [toSecond] = await captured((await outbox(alert.id, 'escalated_secondary'))[0].message_id);
    expect(toSecond.subject).toBe(`[Shadowloop P2] Escalated: ${alert.tag} diverged — band rule`);
    expect(toSecond.text).toContain('it comes to you as the secondary on call');
    expect(toSecond.text).toMatch(/\/a\/[A-Za-z0-9_-]+\./);
    const [toEngineer] = await captured(area[0].message_id);
    expect(toEngineer.text).toContain('it comes to you as an engineer of Aeration');
    expect(toEngineer.text).toContain('Acknowledging needs the on-call role');
    expect(toEngineer.text).toContain('not a safety instrumented system');
  });

  it('with nobody secondary on call, waits for the area step and says the secondary was skipped', async () => {
    const { secondary_after_min: secondMin, area_after_min: areaMin } = await db('alert_settings').first();
    const alert = await raiseAlert('storage');
    await backdate(alert.id, secondMin + 1);
    expect(await escalated(alert.id)).toBe(false);
    expect(await levelOf(alert.id)).toBe(0);

    await backdate(alert.id, areaMin - secondMin);
    expect(await escalated(alert.id)).toBe(true);
    expect(await levelOf(alert.id)).toBe(2);
    const event = await db('alert_events').where({ alert_id: alert.id, kind: 'escalated' }).first();
    expect(event.note).toBe("Nobody was secondary on call, so it went straight to the area's engineers.");
    expect(event.details).toMatchObject({ skippedSecondary: true, level: 2 });
    const engineers = (await db('user_roles as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where('r.role', 'engineer')
      .pluck('u.email')) as string[];
    const rows = await outbox(alert.id, 'escalated_area');
    expect(rows.map((r) => r.to_address).sort()).toEqual([...engineers].sort());
    const text = (await db('mail_outbox').where({ id: rows[0].id }).first('text')).text as string;
    expect(text).toContain('Storage has no engineers assigned, so this goes to every engineer.');
  });

  it('leaves acknowledged alerts alone, and starts a new round when one comes back after acknowledgement', async () => {
    const { secondary_after_min: secondMin, area_after_min: areaMin } = await db('alert_settings').first();
    const alert = await raiseAlert('aeration');
    await backdate(alert.id, areaMin + 1);
    expect(await escalated(alert.id)).toBe(true);
    expect(await escalated(alert.id)).toBe(true);
    expect(await levelOf(alert.id)).toBe(2);

    const oncallUser = { id: await userId(ONCALL), email: ONCALL, name: 'Dara Okafor', roles: ['oncall' as const] };
    await acknowledgeAlert(db, oncallUser, alert.id, '');
    expect(await escalated(alert.id)).toBe(false);

    // The condition comes back after the acknowledgement (as the alert life cycle records it).
    await db('alerts')
      .where({ id: alert.id })
      .update({ state: 'unacknowledged', acknowledged_at: null, acknowledged_by: null });
    await db('alert_events').insert({
      alert_id: alert.id,
      kind: 'reactivated',
      from_state: 'acknowledged',
      to_state: 'unacknowledged',
    });
    expect(await escalated(alert.id)).toBe(false);
    await backdate(alert.id, secondMin + 1);
    expect(await escalated(alert.id)).toBe(true);
    expect(await levelOf(alert.id)).toBe(1);
    expect(await outbox(alert.id, 'escalated_secondary')).toHaveLength(2);
  });
});
