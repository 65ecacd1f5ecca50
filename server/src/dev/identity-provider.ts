/**
 * The local stand-in for a university's identity provider: a standard OpenID
 * Connect provider (the oidc-provider package) on loopback, with a sign-in page
 * of ours that lists the demo accounts. Development, demo and tests only: it
 * refuses to start when NODE_ENV=production.
 */
import express from 'express';
import Provider, { type Configuration } from 'oidc-provider';
import { generateKeyPairSync, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { MemoryAdapter } from './oidc-memory-adapter';

export interface StandInAccount {
  /** the login name typed on the sign-in page; also the OIDC subject */
  login: string;
  email: string;
  givenName: string;
  familyName: string;
  /** shown on the sign-in page as a hint (e.g. "lecturer") */
  hint?: string;
  /** whether the provider vouches for the address (default true) */
  emailVerified?: boolean;
}

export interface StandInClient {
  clientId: string;
  clientSecret: string;
  redirectUris: string[];
  postLogoutRedirectUris: string[];
}

export interface StandInOptions {
  port: number;
  host?: string;
  accounts: StandInAccount[];
  clients: StandInClient[];
  /** list the accounts on the sign-in page (the demo does; tests may) */
  listAccounts?: boolean;
  /** accounts shown as one-click buttons; the rest are reachable by login name */
  featuredLogins?: string[];
}

export interface RunningStandIn {
  issuer: string;
  port: number;
  close(): Promise<void>;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{margin:0;font:16px/1.5 system-ui,sans-serif;background:#eef0ea;color:#1d2433}
main{max-width:30rem;margin:4rem auto;background:#fff;border:1px solid #c9ccc0;padding:2rem}
h1{font-size:1.3rem;margin:0 0 .25rem}.who{color:#4c5566;margin:0 0 1.5rem}
label{display:block;font-weight:600;margin:.75rem 0 .25rem}input[type=text]{width:100%;box-sizing:border-box;padding:.5rem;border:1px solid #8a8f9c;font:inherit}
button{font:inherit;padding:.5rem 1rem;border:1px solid #24406e;background:#24406e;color:#fff;cursor:pointer;margin-top:1rem}
button.acct{display:block;width:100%;text-align:left;background:#fff;color:#1d2433;border-color:#c9ccc0;margin:.4rem 0}
button:focus-visible{outline:3px solid #c07a00;outline-offset:2px}.err{color:#a0301c;font-weight:600}.note{font-size:.85rem;color:#4c5566}
</style></head><body><main>${body}</main></body></html>`;
}

export async function startIdentityProvider(opts: StandInOptions): Promise<RunningStandIn> {
  if (process.env.NODE_ENV === 'production') {
    throw new Error('The local identity provider is a development stand-in and refuses to run with NODE_ENV=production. Set OIDC_ISSUER, OIDC_CLIENT_ID and OIDC_CLIENT_SECRET to your university\'s provider.');
  }
  const host = opts.host ?? '127.0.0.1';
  const accounts = new Map(opts.accounts.map((a) => [a.login, a]));

  // Listen first so that the issuer URL carries the real port (port 0 picks a free one).
  const app = express();
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(opts.port, host, () => resolve(s));
  });
  const port = (server.address() as AddressInfo).port;
  const issuer = `http://${host}:${port}`;

  const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const jwk = { ...privateKey.export({ format: 'jwk' }), use: 'sig', alg: 'RS256', kid: randomBytes(6).toString('hex') };

  const configuration: Configuration = {
    adapter: MemoryAdapter as never,
    clients: opts.clients.map((c) => ({
      client_id: c.clientId,
      client_secret: c.clientSecret,
      redirect_uris: c.redirectUris,
      post_logout_redirect_uris: c.postLogoutRedirectUris,
      grant_types: ['authorization_code'],
      response_types: ['code'],
      token_endpoint_auth_method: 'client_secret_post',
    })),
    async findAccount(_ctx, id) {
      const a = accounts.get(id);
      if (!a) return undefined;
      return {
        accountId: id,
        async claims() {
          return { sub: id, email: a.email, email_verified: a.emailVerified ?? true, name: `${a.givenName} ${a.familyName}`, given_name: a.givenName, family_name: a.familyName };
        },
      };
    },
    claims: { openid: ['sub'], email: ['email', 'email_verified'], profile: ['name', 'given_name', 'family_name'] },
    cookies: { keys: [randomBytes(32).toString('hex')] },
    jwks: { keys: [jwk as never] },
    pkce: { required: () => false, methods: ['S256'] },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    ttl: { AccessToken: 3600, AuthorizationCode: 600, IdToken: 3600, Interaction: 3600, Session: 12 * 3600, Grant: 12 * 3600 },
    features: {
      devInteractions: { enabled: false },
      rpInitiatedLogout: {
        enabled: true,
        async logoutSource(ctx, form) {
          // The relying party has already ended its own session; finish ours without asking.
          ctx.body = page(
            'Signing out',
            `<h1>Signing you out…</h1>${form}<input type="hidden" form="op.logoutForm" name="logout" value="yes">
<button type="submit" form="op.logoutForm">Continue</button>
<script>document.getElementById('op.logoutForm').submit()</script>`,
          );
        },
        async postLogoutSuccessSource(ctx) {
          ctx.body = page('Signed out', '<h1>You are signed out.</h1>');
        },
      },
    },
    async renderError(ctx, out) {
      ctx.type = 'html';
      ctx.body = page('Sign-in error', `<h1>Sign-in error</h1><p class="err">${escapeHtml(String(out.error))}: ${escapeHtml(String(out.error_description ?? ''))}</p>`);
    },
  };
  const provider = new Provider(issuer, configuration);

  const loginPage = (uid: string, error?: string) => {
    const featured = (opts.featuredLogins ?? []).map((l) => accounts.get(l)).filter(Boolean) as StandInAccount[];
    const buttons =
      opts.listAccounts === false
        ? ''
        : `<p class="note">Demo accounts (local stand-in, no password):</p>
${featured
  .map(
    (a) =>
      `<form method="post" action="/interaction/${uid}/login"><input type="hidden" name="login" value="${escapeHtml(a.login)}"><button class="acct" type="submit">${escapeHtml(a.givenName)} ${escapeHtml(a.familyName)}${a.hint ? ` — ${escapeHtml(a.hint)}` : ''}</button></form>`,
  )
  .join('\n')}`;
    return page(
      'Aldermere University sign-in',
      `<h1>Aldermere University sign-in</h1><p class="who">Local stand-in identity provider for development and demos.</p>
${error ? `<p class="err" role="alert">${escapeHtml(error)}</p>` : ''}
<form method="post" action="/interaction/${uid}/login">
<label for="login">University login</label><input id="login" name="login" type="text" autocomplete="username" autofocus required>
<button type="submit">Sign in</button></form>${buttons}`,
    );
  };

  app.disable('x-powered-by');
  app.get('/interaction/:uid', async (req, res, next) => {
    try {
      const details = await provider.interactionDetails(req, res);
      if (details.prompt.name === 'login') {
        res.type('html').send(loginPage(details.uid));
        return;
      }
      // consent: the university's own applications are pre-approved
      const accountId = details.session?.accountId;
      const clientId = details.params.client_id as string;
      const grant = details.grantId ? await provider.Grant.find(details.grantId) : new provider.Grant({ accountId, clientId });
      if (!grant) throw new Error('grant vanished');
      const missing = details.prompt.details as { missingOIDCScope?: string[]; missingOIDCClaims?: string[] };
      if (missing.missingOIDCScope) grant.addOIDCScope(missing.missingOIDCScope.join(' '));
      if (missing.missingOIDCClaims) grant.addOIDCClaims(missing.missingOIDCClaims);
      const grantId = await grant.save();
      await provider.interactionFinished(req, res, { consent: { grantId } }, { mergeWithLastSubmission: true });
    } catch (err) {
      next(err);
    }
  });
  app.post('/interaction/:uid/login', express.urlencoded({ extended: false }), async (req, res, next) => {
    try {
      const details = await provider.interactionDetails(req, res);
      const login = String(req.body?.login ?? '').trim();
      if (!accounts.has(login)) {
        res.status(400).type('html').send(loginPage(details.uid, `No account "${login}" at this stand-in.`));
        return;
      }
      await provider.interactionFinished(req, res, { login: { accountId: login } }, { mergeWithLastSubmission: false });
    } catch (err) {
      next(err);
    }
  });
  app.use(provider.callback());

  return {
    issuer,
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
