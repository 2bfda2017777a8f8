import { Passport } from 'passport';
import { Strategy as OpenIdConnectStrategy, type Profile, type VerifyFunction } from 'passport-openidconnect';
import type { Config } from '../config/config.js';
import { ROLES, type Role } from '../contracts/roles.js';
import type { Db } from '../db/knex.js';
import { recordAudit } from '../modules/audit/audit.repository.js';
import { findUserById, recordSignIn } from '../modules/users/users.repository.js';

/** Maps the provider's groups claim ("shadowloop:engineer") to roles for a first sign-in. */
export function rolesFromGroups(groups: unknown, prefix: string): Role[] {
  if (!Array.isArray(groups)) return [];
  const names = groups
    .filter((g): g is string => typeof g === 'string' && g.startsWith(prefix))
    .map((g) => g.slice(prefix.length));
  return ROLES.filter((role) => names.includes(role));
}

/**
 * passport with the OpenID Connect strategy. The strategy calls the userinfo endpoint only when
 * the verify callback takes nine arguments; the claims then arrive in profile._json.
 */
export function createPassport(config: Config, db: Db) {
  const passport = new Passport();
  const issuer = config.OIDC_ISSUER.replace(/\/$/, '');
  passport.use(
    'oidc',
    new OpenIdConnectStrategy(
      {
        issuer,
        authorizationURL: `${issuer}/auth`,
        tokenURL: `${issuer}/token`,
        userInfoURL: `${issuer}/me`,
        clientID: config.OIDC_CLIENT_ID,
        clientSecret: config.OIDC_CLIENT_SECRET,
        callbackURL: '/auth/callback',
        scope: ['profile', 'email', 'groups'],
      },
      // The strategy dispatches on arity: nine arguments means "call the userinfo endpoint".
      ((
        _iss: string,
        userInfo: Profile,
        _idProfile: Profile,
        _context: object,
        _idToken: string,
        _accessToken: string,
        _refreshToken: string,
        _params: object,
        done: (err: Error | null, user?: Express.User | false) => void,
      ) => {
        void signIn(userInfo).then(
          (user) => done(null, user),
          (err: Error) => done(err),
        );
      }) as unknown as VerifyFunction, // the typings omit the nine-argument form the strategy supports
    ),
  );

  async function signIn(profile: Profile): Promise<Express.User | false> {
    const claims = (profile as Profile & { _json?: Record<string, unknown> })._json ?? {};
    const email = typeof claims.email === 'string' ? claims.email : profile.emails?.[0]?.value;
    if (!email) return false;
    const name = typeof claims.name === 'string' ? claims.name : profile.displayName || email;
    const { id, created } = await recordSignIn(
      db,
      { subject: profile.id, email, name },
      rolesFromGroups(claims.groups, config.OIDC_ROLE_GROUP_PREFIX),
    );
    await recordAudit(db, {
      actor: { id, email },
      action: created ? 'user.provisioned' : 'user.signed_in',
      targetType: 'user',
      targetId: id,
    });
    const user = await findUserById(db, id);
    return user ? { id: user.id, email: user.email, name: user.name, roles: user.roles } : false;
  }

  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: string, done) => {
    findUserById(db, id).then(
      (user) => done(null, user ? { id: user.id, email: user.email, name: user.name, roles: user.roles } : false),
      (err: Error) => done(err),
    );
  });
  return passport;
}
