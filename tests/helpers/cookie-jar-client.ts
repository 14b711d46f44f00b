/**
 * A tiny browser stand-in for HTTP-level sign-in tests: keeps cookies per origin and follows
 * redirects one at a time, so a test can stop at or tamper with any step.
 */
export class CookieJarClient {
  private readonly jars = new Map<string, Map<string, string>>();

  cookieHeader(url: string): string {
    const jar = this.jars.get(new URL(url).host);
    return jar ? [...jar].map(([name, value]) => `${name}=${value}`).join('; ') : '';
  }

  snapshot(): Map<string, Map<string, string>> {
    return new Map([...this.jars].map(([host, jar]) => [host, new Map(jar)]));
  }

  restore(snapshot: Map<string, Map<string, string>>): void {
    this.jars.clear();
    for (const [host, jar] of snapshot) this.jars.set(host, new Map(jar));
  }

  async fetch(url: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    const cookie = this.cookieHeader(url);
    if (cookie) headers.set('cookie', cookie);
    const response = await fetch(url, { ...init, headers, redirect: 'manual' });
    const host = new URL(url).host;
    const jar = this.jars.get(host) ?? new Map<string, string>();
    this.jars.set(host, jar);
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const [name, ...rest] = pair!.split('=');
      const expired = attributes.some((a) => /^\s*expires=Thu, 01 Jan 1970/i.test(a) || /^\s*max-age=0/i.test(a));
      if (expired) jar.delete(name!.trim());
      else jar.set(name!.trim(), rest.join('='));
    }
    return response;
  }

  /** Follows redirects until a page answers or `stopWhen` matches the next location. */
  async follow(url: string, stopWhen?: (location: string) => boolean): Promise<{ response: Response; url: string }> {
    let current = url;
    for (let hop = 0; hop < 12; hop++) {
      const response = await this.fetch(current);
      const location = response.headers.get('location');
      if (!location || response.status < 300 || response.status >= 400) return { response, url: current };
      const next = new URL(location, current).toString();
      if (stopWhen?.(next)) return { response, url: next };
      current = next;
    }
    throw new Error('Too many redirects');
  }
}
