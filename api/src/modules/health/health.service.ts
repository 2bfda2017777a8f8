import net from 'node:net';
import type { Config } from '../../config/config.js';
import type { Db } from '../../db/knex.js';

export interface Check {
  ok: boolean;
  detail?: string;
  lastBeatAt?: string | null;
}

const withTimeout = <T>(promise: Promise<T>, ms: number, what: string) =>
  Promise.race([
    promise,
    new Promise<never>((_, reject) =>
      setTimeout(() => reject(new Error(`${what} did not answer within ${ms} ms`)), ms),
    ),
  ]);

async function checkDatabase(db: Db): Promise<Check> {
  await withTimeout(db.raw('select 1'), 2000, 'the database');
  return { ok: true };
}

/** Reads the SMTP greeting: a 220 line means the mail server accepts connections. */
function checkMail(config: Config): Promise<Check> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: config.SMTP_HOST, port: config.SMTP_PORT });
    const done = (check: Check) => {
      socket.destroy();
      resolve(check);
    };
    socket.setTimeout(1500, () => done({ ok: false, detail: 'no greeting within 1.5 s' }));
    socket.once('data', (data) =>
      done(data.toString().startsWith('220') ? { ok: true } : { ok: false, detail: 'unexpected greeting' }),
    );
    socket.once('error', (error) => done({ ok: false, detail: error.message }));
  });
}

async function checkIdentityProvider(config: Config): Promise<Check> {
  const url = `${config.OIDC_ISSUER.replace(/\/$/, '')}/.well-known/openid-configuration`;
  const response = await fetch(url, { signal: AbortSignal.timeout(1500) });
  return response.ok ? { ok: true } : { ok: false, detail: `discovery answered ${response.status}` };
}

async function checkSimulator(db: Db, maxAgeS: number): Promise<Check> {
  const row = await db('service_heartbeats')
    .where({ service: 'simulator' })
    .max<{ beat: Date | null }>('beat_at as beat')
    .first();
  const beat = row?.beat ?? null;
  const ageS = beat ? (Date.now() - beat.getTime()) / 1000 : Infinity;
  return {
    ok: ageS <= maxAgeS,
    lastBeatAt: beat ? beat.toISOString() : null,
    ...(ageS > maxAgeS ? { detail: beat ? `last heartbeat ${Math.round(ageS)} s ago` : 'no heartbeat yet' } : {}),
  };
}

const settle = (p: Promise<Check>): Promise<Check> => p.catch((e: Error) => ({ ok: false, detail: e.message }));

/** 200 with status "ok" or "degraded" while the database answers; 503 when it does not. */
export async function healthReport(config: Config, db: Db) {
  const [database, mail, identityProvider] = await Promise.all([
    settle(checkDatabase(db)),
    settle(checkMail(config)),
    settle(checkIdentityProvider(config)),
  ]);
  const simulator = database.ok
    ? await settle(checkSimulator(db, config.SIMULATOR_HEARTBEAT_MAX_AGE_S))
    : { ok: false, detail: 'database unavailable' };
  const checks = { database, mail, identityProvider, simulator };
  const allOk = Object.values(checks).every((c) => c.ok);
  return {
    httpStatus: database.ok ? 200 : 503,
    body: { status: allOk ? 'ok' : database.ok ? 'degraded' : 'down', checks },
  };
}
