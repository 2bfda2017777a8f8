import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts.js';
import { startIdentityProvider } from './provider.js';

/** The local identity provider as its own process (started by npm start). */
const port = Number(process.env.IDP_PORT ?? 4601);
const idp = await startIdentityProvider({
  port,
  client: {
    clientId: process.env.OIDC_CLIENT_ID ?? 'shadowloop',
    clientSecret: process.env.OIDC_CLIENT_SECRET ?? 'shadowloop-local-secret',
    redirectUris: ['http://127.0.0.1/auth/callback', 'http://localhost/auth/callback'],
  },
  accounts: DEMO_ACCOUNTS.map((a) => ({ ...a, password: DEMO_PASSWORD })),
});
console.log(`identity provider listening at ${idp.issuer}`);

const stop = () => void idp.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
