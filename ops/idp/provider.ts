import { generateKeyPairSync, randomBytes, scryptSync, timingSafeEqual } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { createRequire } from 'node:module';
import express from 'express';
import { rateLimit } from 'express-rate-limit';
import Provider from 'oidc-provider';
import { consentPage, loginPage } from './pages.js';
import type { DemoAccount } from './demo-accounts.js';

export interface IdpClient {
  clientId: string;
  clientSecret: string;
  /** Loopback callback URLs; any port is accepted for them (RFC 8252 §7.3, native clients). */
  redirectUris: string[];
}

export interface IdpAccount extends DemoAccount {
  password: string;
}

export interface IdentityProvider {
  issuer: string;
  close(): Promise<void>;
}

const require = createRequire(import.meta.url);
const fontDir = path.join(path.dirname(require.resolve('@fontsource/roboto-condensed/package.json')), 'files');

function passwordChecker(accounts: IdpAccount[]) {
  const salt = randomBytes(16);
  const hashes = new Map(accounts.map((a) => [a.email, scryptSync(a.password, salt, 32)]));
  return (email: string, password: string): boolean => {
    const expected = hashes.get(email.toLowerCase());
    const given = scryptSync(password, salt, 32);
    return expected !== undefined && timingSafeEqual(expected, given);
  };
}

function createProvider(issuer: string, client: IdpClient, accounts: IdpAccount[]): Provider {
  const byEmail = new Map(accounts.map((a) => [a.email, a]));
  const jwk = generateKeyPairSync('rsa', { modulusLength: 2048 }).privateKey.export({ format: 'jwk' });
  return new Provider(issuer, {
    clients: [
      {
        client_id: client.clientId,
        client_secret: client.clientSecret,
        client_name: 'Shadowloop',
        application_type: 'native',
        redirect_uris: client.redirectUris,
        grant_types: ['authorization_code'],
        response_types: ['code'],
        token_endpoint_auth_method: 'client_secret_basic',
      },
    ],
    findAccount: (_ctx, id) => {
      const account = byEmail.get(id);
      if (!account) return undefined;
      return {
        accountId: id,
        claims: () => ({
          sub: id,
          email: account.email,
          email_verified: true,
          name: account.name,
          groups: account.roles.map((r) => `shadowloop:${r}`),
        }),
      };
    },
    claims: { openid: ['sub'], email: ['email', 'email_verified'], profile: ['name'], groups: ['groups'] },
    scopes: ['openid', 'email', 'profile', 'groups'],
    features: { devInteractions: { enabled: false } },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    cookies: { keys: [randomBytes(32).toString('base64url')] },
    jwks: { keys: [jwk as never] },
    pkce: { required: () => false },
    ttl: {
      Interaction: 15 * 60,
      Session: 12 * 3600,
      Grant: 12 * 3600,
      AccessToken: 10 * 60,
      IdToken: 10 * 60,
      AuthorizationCode: 60,
    },
  });
}

/** Starts the local OpenID Connect provider on 127.0.0.1:port (0 picks a free port). */
export async function startIdentityProvider(options: {
  port: number;
  client: IdpClient;
  accounts: IdpAccount[];
  issuerHost?: string;
  /** Password attempts per minute per address (default 30). */
  loginAttemptsPerMinute?: number;
}): Promise<IdentityProvider> {
  const app = express();
  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(options.port, '127.0.0.1', resolve));
  const issuer = `http://${options.issuerHost ?? '127.0.0.1'}:${(server.address() as AddressInfo).port}`;
  const provider = createProvider(issuer, options.client, options.accounts);
  const checkPassword = passwordChecker(options.accounts);
  const form = express.urlencoded({ extended: false });
  const loginLimit = rateLimit({
    windowMs: 60_000,
    limit: options.loginAttemptsPerMinute ?? 30,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
  });

  app.use('/fonts', express.static(fontDir, { maxAge: '1d' }));
  app.get('/interaction/:uid', async (req, res) => {
    const { uid, prompt, params } = await provider.interactionDetails(req, res);
    res.type('html');
    if (prompt.name === 'login') return res.send(loginPage(uid));
    const scopes = String(params.scope ?? '')
      .split(' ')
      .filter((s) => s !== 'openid');
    return res.send(consentPage(uid, 'Shadowloop', ['your identity (subject)', ...scopes]));
  });
  app.post('/interaction/:uid/login', loginLimit, form, async (req, res) => {
    const { uid } = await provider.interactionDetails(req, res);
    const email = String(req.body?.email ?? '')
      .trim()
      .toLowerCase();
    if (!checkPassword(email, String(req.body?.password ?? ''))) {
      return res
        .status(401)
        .type('html')
        .send(loginPage(uid, { email, error: 'That e-mail and password do not match an account.' }));
    }
    await provider.interactionFinished(req, res, { login: { accountId: email } }, { mergeWithLastSubmission: false });
  });
  app.post('/interaction/:uid/confirm', async (req, res) => {
    const details = await provider.interactionDetails(req, res);
    const { prompt, params, session } = details;
    const grant = details.grantId
      ? await provider.Grant.find(details.grantId)
      : new provider.Grant({ accountId: session?.accountId, clientId: String(params.client_id) });
    if (!grant) throw new Error('grant vanished during the interaction');
    const missing = prompt.details as { missingOIDCScope?: string[]; missingOIDCClaims?: string[] };
    if (missing.missingOIDCScope) grant.addOIDCScope(missing.missingOIDCScope.join(' '));
    if (missing.missingOIDCClaims) grant.addOIDCClaims(missing.missingOIDCClaims);
    const grantId = await grant.save();
    await provider.interactionFinished(
      req,
      res,
      { consent: details.grantId ? {} : { grantId } },
      { mergeWithLastSubmission: true },
    );
  });
  app.post('/interaction/:uid/abort', async (req, res) => {
    await provider.interactionFinished(
      req,
      res,
      { error: 'access_denied', error_description: 'The user cancelled sign-in.' },
      { mergeWithLastSubmission: false },
    );
  });
  app.use(provider.callback());

  return {
    issuer,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
