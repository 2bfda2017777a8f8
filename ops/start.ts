import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './idp/demo-accounts.js';
import { ensureDatabase, migrateAndSeed, withDatabase } from './lib/database.js';
import { rotateDemoIngestSource } from './lib/demo-ingest-source.js';
import { takeLock } from './lib/lock.js';
import { isListening } from './lib/ports.js';
import { startCluster, type Cluster } from './lib/postgres.js';
import { startService, stopServices, waitForHttp, type Service } from './lib/processes.js';
import { localSecrets } from './lib/secrets.js';
import { ensureWebBuild } from './lib/web-build.js';

/** npm start: PostgreSQL, migrations and demo seed, then every service under one supervisor. */
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dataDir = path.join(root, '.data');
const port = Number(process.env.PORT ?? 4600);
const pgPort = Number(process.env.PG_PORT ?? 5433);
const idpPort = Number(process.env.IDP_PORT ?? 4601);
const smtpPort = Number(process.env.SMTP_PORT ?? 4625);
const url = `http://127.0.0.1:${port}`;
const log = (line: string) => console.log(`[start] ${line}`);

fs.mkdirSync(dataDir, { recursive: true });
const lock = takeLock(path.join(dataDir, 'start.lock'), url);
if (lock.heldBy) {
  console.error(
    `Shadowloop is already running from this folder (${lock.heldBy}). Stop it (Ctrl-C in its terminal) before starting another.`,
  );
  process.exit(1);
}
for (const [name, p] of [
  ['PORT', port],
  ['IDP_PORT', idpPort],
  ['SMTP_PORT', smtpPort],
  ['PG_PORT', pgPort],
] as const) {
  if (await isListening(p)) {
    lock.release();
    console.error(`Port ${p} (${name}) is already in use by another program. Stop it or set ${name} to a free port.`);
    process.exit(1);
  }
}

let cluster: Cluster | undefined;
let services: Service[] = [];
let stopping = false;

/** A service that exits while we are not stopping takes everything down with it. */
function supervise(service: Service): void {
  service.child.once('exit', (code, signal) => {
    if (stopping) return;
    console.error(`[start] ${service.name} exited unexpectedly (${signal ?? `code ${code}`}); stopping everything.`);
    void shutdown(1);
  });
}

async function shutdown(code: number): Promise<never> {
  if (stopping) return new Promise(() => undefined);
  stopping = true;
  log('stopping services');
  await stopServices(services, 8000);
  try {
    cluster?.stop();
  } catch (error) {
    console.error(`[start] PostgreSQL did not stop cleanly: ${(error as Error).message}`);
  }
  lock.release();
  log('stopped');
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  log(`PostgreSQL on 127.0.0.1:${pgPort} (data in .data/pg)`);
  cluster = startCluster(path.join(dataDir, 'pg'), pgPort, { durable: true });
  await ensureDatabase(cluster.adminUrl(), 'shadowloop');
  const databaseUrl = withDatabase(cluster.adminUrl(), 'shadowloop');
  const applied = await migrateAndSeed(databaseUrl, { seed: process.env.SEED_DEMO !== 'false' });
  log(applied.length ? `applied migrations: ${applied.join(', ')}` : 'database schema is up to date');
  ensureWebBuild(root, log);

  const secrets = localSecrets(path.join(dataDir, 'secrets.json'));
  const common = {
    DATABASE_URL: databaseUrl,
    OIDC_CLIENT_ID: 'shadowloop',
    OIDC_CLIENT_SECRET: secrets.oidcClientSecret,
  };
  services = [
    startService('idp', 'ops/idp/main.ts', { ...common, IDP_PORT: String(idpPort) }, root),
    startService('mail', 'ops/mail/main.ts', { ...common, SMTP_PORT: String(smtpPort) }, root),
    startService(
      'api',
      'api/src/index.ts',
      {
        ...common,
        PORT: String(port),
        PUBLIC_URL: url,
        SESSION_SECRET: secrets.sessionSecret,
        OIDC_ISSUER: `http://127.0.0.1:${idpPort}`,
        SMTP_PORT: String(smtpPort),
        DEV_MAILBOX: 'true',
        LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
      },
      root,
    ),
    startService('simulator', 'simulator/src/index.ts', common, root),
  ];
  services.forEach(supervise);
  await waitForHttp(`${url}/api/health`, 60_000);
  if (process.env.DEMO_PLANT !== 'false') {
    // the demo plant posts through the real ingest API, so it starts once the api answers
    const source = await rotateDemoIngestSource(databaseUrl);
    const demo = startService(
      'demo-plant',
      'simulator/src/demo-plant/main.ts',
      {
        DATABASE_URL: databaseUrl,
        API_URL: url,
        DEMO_PLANT_TOKEN: source.token,
        DEMO_SPEED: process.env.DEMO_SPEED ?? '1',
      },
      root,
    );
    services.push(demo);
    supervise(demo);
    log(`demo plant playing ${source.loops} Quillmere loops (DEMO_PLANT=false turns it off)`);
  }
  console.log(`
  Shadowloop is running at ${url}
  Sign in with a demo account (password "${DEMO_PASSWORD}"):
${DEMO_ACCOUNTS.map((a) => `    ${a.email.padEnd(30)} ${a.roles.join(', ')}`).join('\n')}
  Advisory monitoring only: not a safety system. Press Ctrl-C to stop everything.
`);
} catch (error) {
  console.error(`[start] could not start: ${(error as Error).message}`);
  await shutdown(1);
}
