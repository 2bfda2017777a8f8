import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient } from '../helpers/session-client.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

const stack = inject('stack');
let api: RunningApi;
const db = createPgPool(stack.databaseUrl, 2);
type Health = { status: string; checks: Record<string, { ok: boolean; detail?: string }> };

beforeAll(async () => {
  api = await startApi(stack);
});
afterAll(async () => {
  await api.close();
  await db.end();
});

describe('health', () => {
  it('reports every dependency, degraded while the simulator has not beaten', async () => {
    await db.query("DELETE FROM service_heartbeats WHERE service = 'simulator'");
    const response = await fetch(`${api.url}/api/health`);
    const body = (await response.json()) as Health;
    expect(response.status).toBe(200);
    expect(body.checks.database.ok).toBe(true);
    expect(body.checks.mail.ok).toBe(true);
    expect(body.checks.identityProvider.ok).toBe(true);
    expect(body.checks.simulator).toMatchObject({ ok: false, detail: 'no heartbeat yet' });
    expect(body.status).toBe('degraded');
  });

  it('is ok once the simulator beats', async () => {
    await db.query(
      "INSERT INTO service_heartbeats (service, instance, beat_at, started_at) VALUES ('simulator', 'test', now(), now())",
    );
    const body = (await (await fetch(`${api.url}/api/health`)).json()) as Health;
    expect(body.status).toBe('ok');
  });

  it('keeps serving after the database server closes its idle connections', async () => {
    // a signed-in request fills the session pool; a database restart or an administrator's terminate
    // then closes those connections, and an unhandled pool error would end the api process
    const admin = new SessionClient(api.url);
    await admin.signIn('admin@quillmere.example');
    expect((await admin.request('GET', '/api/v1/me')).status).toBe(200);
    const ended = await db.query(
      "SELECT count(*)::int AS n FROM (SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_type = 'client backend') t",
    );
    expect(ended.rows[0].n).toBeGreaterThan(0);
    await new Promise((resolve) => setTimeout(resolve, 200));
    const response = await fetch(`${api.url}/api/health`);
    expect(response.status).toBe(200);
    expect((await admin.request('GET', '/api/v1/me')).status).toBe(200);
  });

  it('answers 503 when the database does not', async () => {
    const broken = await startApi(stack, { DATABASE_URL: stack.databaseUrl.replace(/:\d+\//, ':1/') });
    try {
      const response = await fetch(`${broken.url}/api/health`);
      expect(response.status).toBe(503);
      expect(((await response.json()) as Health).checks.database.ok).toBe(false);
    } finally {
      await broken.close();
    }
  });
});

describe('development mailbox', () => {
  it('shows admins what the local mail server captured', async () => {
    const transport = nodemailer.createTransport({
      host: '127.0.0.1',
      port: stack.smtpPort,
      secure: false,
      ignoreTLS: true,
    });
    await transport.sendMail({
      from: 'shadowloop@quillmere.example',
      to: 'oncall@quillmere.example',
      subject: 'Mailbox check',
      text: 'captured',
    });
    const admin = new SessionClient(api.url);
    await admin.signIn('admin@quillmere.example');
    const mail = await admin.request<{ to: string[]; subject: string; text: string }[]>('GET', '/api/v1/dev/mail');
    expect(mail.body[0]).toMatchObject({ to: ['oncall@quillmere.example'], subject: 'Mailbox check' });
    expect(mail.body[0].text.trim()).toBe('captured');
  });
});
