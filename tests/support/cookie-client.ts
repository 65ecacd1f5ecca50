/**
 * A tiny HTTP client with a cookie jar for loopback tests: follows redirects
 * by hand so that every hop of a sign-in can be checked. All test servers run
 * on 127.0.0.1, and cookies ignore ports, so one jar serves them all.
 */
export interface HopResponse {
  url: string;
  status: number;
  headers: Headers;
  body: string;
}

export class CookieClient {
  readonly cookies = new Map<string, string>();

  private store(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair, ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attrs.some((a) => {
        const [k, v] = a.trim().split('=');
        if (k.toLowerCase() === 'max-age') return Number(v) <= 0;
        if (k.toLowerCase() === 'expires') return new Date(v).getTime() < Date.now();
        return false;
      });
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  private cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  /** One request, no redirect following. */
  async request(url: string, init: RequestInit = {}): Promise<HopResponse> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    const res = await fetch(url, { ...init, headers, redirect: 'manual' });
    this.store(res);
    return { url, status: res.status, headers: res.headers, body: await res.text() };
  }

  /** Follows redirects (303/302 turn POST into GET), returning every hop. */
  async follow(url: string, init: RequestInit = {}, maxHops = 20): Promise<HopResponse[]> {
    const hops: HopResponse[] = [];
    let current = url;
    let currentInit = init;
    for (let i = 0; i < maxHops; i++) {
      const hop = await this.request(current, currentInit);
      hops.push(hop);
      const location = hop.headers.get('location');
      if (hop.status < 300 || hop.status >= 400 || !location) return hops;
      current = new URL(location, current).toString();
      currentInit = hop.status === 307 || hop.status === 308 ? currentInit : {};
    }
    throw new Error(`more than ${maxHops} redirects from ${url}`);
  }

  async json<T = unknown>(url: string, init: RequestInit = {}): Promise<{ status: number; body: T }> {
    const hop = await this.request(url, init);
    return { status: hop.status, body: (hop.body ? JSON.parse(hop.body) : null) as T };
  }
}
