import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../ops/idp/demo-accounts.js';
import { startIdentityProvider } from '../../ops/idp/provider.js';
import { dropDatabase, ensureDatabase, migrateAndSeed, withDatabase } from '../../ops/lib/database.js';
import { startMailServer } from '../../ops/mail/server.js';
import { startApi } from './api-server.js';
import { NEWCOMER, type StackInfo } from './test-env.js';

/**
 * Global set-up of the integration and e2e projects: a throwaway database on the test cluster
 * (created and dropped per run), the local identity provider and mail server, and for e2e the api
 * serving the built web app.
 */
export default async function setup(project: TestProject) {
  const adminUrl = process.env.SHADOWLOOP_TEST_PG_URL;
  if (!adminUrl)
    throw new Error(
      'SHADOWLOOP_TEST_PG_URL is not set: run the suites with `npm test`, which starts the test cluster.',
    );
  const name = `shadowloop_${project.name}_${randomBytes(4).toString('hex')}`;
  await ensureDatabase(adminUrl, name);
  const databaseUrl = withDatabase(adminUrl, name);
  await migrateAndSeed(databaseUrl, { seed: true });

  const clientSecret = randomBytes(16).toString('hex');
  const idp = await startIdentityProvider({
    port: 0,
    client: { clientId: 'shadowloop-test', clientSecret, redirectUris: ['http://127.0.0.1/auth/callback'] },
    accounts: [...DEMO_ACCOUNTS, NEWCOMER].map((a) => ({ ...a, password: DEMO_PASSWORD })),
    // every suite signs in many times from one address; the limit itself is the provider's default
    loginAttemptsPerMinute: 10_000,
  });
  const mail = await startMailServer({ port: 0, databaseUrl });
  const outputDir = path.resolve('test-output', project.name);
  fs.mkdirSync(outputDir, { recursive: true });
  const stack: StackInfo = {
    databaseUrl,
    idpIssuer: idp.issuer,
    smtpPort: mail.port,
    clientId: 'shadowloop-test',
    clientSecret,
    outputDir,
  };
  const api = project.name === 'e2e' ? await startApi(stack) : undefined;
  project.provide('stack', { ...stack, appUrl: api?.url });

  return async () => {
    await api?.close();
    await mail.close();
    await idp.close();
    await dropDatabase(adminUrl, name);
  };
}
