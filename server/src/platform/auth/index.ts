/**
 * Sign-in over OpenID Connect (passport + passport-openidconnect), sessions in
 * MariaDB (express-session + express-mysql-session), CSRF protection for
 * cookie-authenticated state changes (csrf-sync), a rate limit on sign-in.
 */
import express, { type Express, type Request } from 'express';
import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import mysql from 'mysql2';
import { Passport } from 'passport';
import { Strategy as OidcStrategy } from 'passport-openidconnect';
import { csrfSync } from 'csrf-sync';
import { rateLimit } from 'express-rate-limit';
import type { Knex } from 'knex';
import type { AppConfig } from '../config';
import { HttpError, sendError } from '../errors';
import { recordAudit } from '../audit';
import { InactiveAccountError, recordSignIn } from '../../modules/session/service';
import { findUserById, siteRolesOf } from '../../modules/session/repo';
import type { OidcEndpoints } from './discovery';

interface OidcProfile {
  id: string;
  displayName?: string;
  emails?: { value: string }[];
  name?: { givenName?: string; familyName?: string };
  _json?: { email_verified?: unknown };
}

/** One claim of the ID token (already checked by the strategy: issuer, audience, expiry, nonce). */
function idTokenClaim(idToken: string, claim: string): unknown {
  try {
    return JSON.parse(Buffer.from(idToken.split('.')[1], 'base64url').toString('utf8'))[claim];
  } catch {
    return undefined;
  }
}

export interface AuthDeps {
  db: Knex;
  databaseUrl: string;
  config: AppConfig;
  oidc: OidcEndpoints;
}

export interface AuthHandles {
  csrfProtection: express.RequestHandler;
  generateCsrfToken: (req: Request) => string;
  close(): Promise<void>;
}

/** A returnTo target must be a path on this site. */
export function safeReturnTo(value: unknown): string {
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
  return value.slice(0, 500);
}

export function mountAuth(app: Express, deps: AuthDeps): AuthHandles {
  const { db, config, oidc } = deps;
  const secure = config.publicUrl.startsWith('https://');

  const MySQLStore = MySQLStoreFactory(session as never);
  const pool = mysql.createPool({ uri: deps.databaseUrl, connectionLimit: 5, charset: 'utf8mb4' });
  const store = new MySQLStore({ createDatabaseTable: false, clearExpired: true, checkExpirationInterval: 15 * 60_000 }, pool as never);

  app.use(
    session({
      name: 'bondmark.sid',
      secret: config.sessionSecret,
      store: store as unknown as session.Store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      proxy: config.trustProxy,
      cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: config.sessionMaxAgeMs },
    }),
  );

  const passport = new Passport();
  passport.use(
    'oidc',
    new OidcStrategy(
      {
        issuer: oidc.issuer,
        authorizationURL: oidc.authorization_endpoint,
        tokenURL: oidc.token_endpoint,
        userInfoURL: oidc.userinfo_endpoint,
        clientID: config.oidc.clientId,
        clientSecret: config.oidc.clientSecret,
        callbackURL: `${config.publicUrl}/auth/callback`,
        scope: config.oidc.scope.split(/\s+/).filter((s) => s !== 'openid'),
        nonce: 'true',
        skipUserProfile: false,
        passReqToCallback: true,
      } as never,
      // arity 10: (req, issuer, userinfo profile, ID-token profile, context, idToken, accessToken, refreshToken, params, done);
      // only the userinfo profile carries the raw claims (email_verified)
      ((req: Request, issuer: string, uiProfile: OidcProfile | undefined, idProfile: OidcProfile, _context: unknown, idToken: string, _accessToken: unknown, _refreshToken: unknown, _params: unknown, done: (err: unknown, user?: Express.User | false, info?: unknown) => void) => {
        const profile: OidcProfile = { ...idProfile, ...(uiProfile ?? {}) };
        const email = profile.emails?.[0]?.value;
        if (!email) return done(null, false, { message: 'The identity provider did not send an e-mail address.' });
        const displayName = profile.displayName || [profile.name?.givenName, profile.name?.familyName].filter(Boolean).join(' ') || email;
        const verifiedClaim = uiProfile?._json?.email_verified ?? idTokenClaim(idToken, 'email_verified');
        const emailVerified = verifiedClaim === true || verifiedClaim === 'true';
        recordSignIn(db, { issuer, subject: profile.id, email, emailVerified, displayName }, config.adminEmails)
          .then(async (user) => {
            (req as Request & { oidcIdToken?: string }).oidcIdToken = idToken;
            const roles = await siteRolesOf(db, user.id);
            done(null, { id: user.id, isAdmin: roles.includes('admin') });
          })
          .catch((err) => {
            if (err instanceof InactiveAccountError) return done(null, false, { message: err.message });
            done(err);
          });
      }) as never,
    ),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: number, done) => {
    Promise.all([findUserById(db, id), siteRolesOf(db, id)])
      .then(([user, roles]) => done(null, user && user.active ? { id: user.id, isAdmin: roles.includes('admin') } : false))
      .catch(done);
  });
  app.use(passport.initialize());
  app.use(passport.session());

  const { csrfSynchronisedProtection, generateToken } = csrfSync({
    getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
  });
  const csrfProtection: express.RequestHandler = (req, res, next) => {
    csrfSynchronisedProtection(req, res, (err?: unknown) => {
      if (err) return sendError(res, new HttpError(403, 'csrf_failed', 'The security token for this form is missing or out of date. Reload the page and try again.'));
      next();
    });
  };

  const signInLimiter = rateLimit({
    windowMs: 60_000,
    limit: config.signinRateLimitPerMinute,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, res) => sendError(res, new HttpError(429, 'rate_limited', 'Too many sign-in attempts from this address. Wait a minute and try again.')),
  });

  app.get('/auth/login', signInLimiter, (req, res, next) => {
    const s = req.session as session.Session & { returnTo?: string };
    s.returnTo = safeReturnTo(req.query.returnTo);
    s.save(() => passport.authenticate('oidc')(req, res, next));
  });

  app.get('/auth/callback', signInLimiter, (req, res, next) => {
    const returnTo = safeReturnTo((req.session as session.Session & { returnTo?: string }).returnTo);
    passport.authenticate('oidc', (err: unknown, user: Express.User | false, info: { message?: string } | undefined) => {
      if (err) return next(err);
      if (!user) {
        const why = encodeURIComponent(info?.message ?? 'Sign-in was not completed.');
        return res.redirect(`/signin?error=${why}`);
      }
      const idToken = (req as Request & { oidcIdToken?: string }).oidcIdToken;
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        (req.session as session.Session & { idToken?: string }).idToken = idToken;
        req.session.save(() => res.redirect(returnTo));
      });
    })(req, res, next);
  });

  app.post('/auth/logout', csrfProtection, (req, res, next) => {
    const s = req.session as session.Session & { idToken?: string };
    const idToken = s.idToken;
    const userId = req.user?.id ?? null;
    const after = `${config.publicUrl}/signin?signedOut=1`;
    let redirect = after;
    if (oidc.end_session_endpoint) {
      const u = new URL(oidc.end_session_endpoint);
      if (idToken) u.searchParams.set('id_token_hint', idToken);
      u.searchParams.set('client_id', config.oidc.clientId);
      u.searchParams.set('post_logout_redirect_uri', after);
      redirect = u.toString();
    }
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy(async (destroyErr) => {
        if (destroyErr) return next(destroyErr);
        if (userId) await recordAudit(db, { actorId: userId, action: 'session.signed_out', entityType: 'user', entityId: userId }).catch(() => {});
        res.clearCookie('bondmark.sid');
        res.json({ redirect });
      });
    });
  });

  return {
    csrfProtection,
    generateCsrfToken: (req) => generateToken(req),
    async close() {
      await (store as unknown as { close(): Promise<void> }).close();
      await new Promise<void>((resolve) => pool.end(() => resolve()));
    },
  };
}
