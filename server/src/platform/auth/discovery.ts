/** OpenID Connect discovery (OpenID Connect Discovery 1.0, §4). */
export interface OidcEndpoints {
  issuer: string;
  authorization_endpoint: string;
  token_endpoint: string;
  userinfo_endpoint?: string;
  end_session_endpoint?: string;
}

export async function discoverOidc(issuer: string, attempts = 20): Promise<OidcEndpoints> {
  const url = `${issuer.replace(/\/$/, '')}/.well-known/openid-configuration`;
  let lastError: unknown;
  for (let i = 0; i < attempts; i++) {
    try {
      const res = await fetch(url);
      if (!res.ok) throw new Error(`${url} answered ${res.status}`);
      const doc = (await res.json()) as OidcEndpoints;
      if (!doc.authorization_endpoint || !doc.token_endpoint) throw new Error(`${url} lacks authorization/token endpoints`);
      return doc;
    } catch (err) {
      lastError = err;
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  throw new Error(`OpenID Connect discovery failed for ${issuer}: ${(lastError as Error)?.message}`);
}
