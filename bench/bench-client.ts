/** A tiny cookie-keeping HTTP client with the CSRF header, for benchmarks (no supertest in the loop). */
export class BenchClient {
  private cookie = '';
  private csrf = '';

  constructor(private readonly base: string) {}

  /** The same session against another server (another process sharing the database). */
  at(base: string): BenchClient {
    const other = new BenchClient(base);
    other.cookie = this.cookie;
    other.csrf = this.csrf;
    return other;
  }

  async token(): Promise<string> {
    if (!this.csrf) this.csrf = ((await this.get('/api/auth/csrf')).body as { csrfToken: string }).csrfToken;
    return this.csrf;
  }

  async get(path: string): Promise<{ status: number; body: unknown }> {
    return this.send('GET', path);
  }

  async post(path: string, body: unknown): Promise<{ status: number; body: unknown }> {
    const token = await this.token();
    const res = await this.send('POST', path, body, token);
    if (path === '/api/auth/login') this.csrf = '';
    return res;
  }

  private async send(
    method: string,
    path: string,
    body?: unknown,
    token?: string,
  ): Promise<{ status: number; body: unknown }> {
    const res = await fetch(this.base + path, {
      method,
      headers: {
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...(token ? { 'x-csrf-token': token } : {}),
        ...(body ? { 'content-type': 'application/json' } : {}),
      },
      body: body ? JSON.stringify(body) : undefined,
    });
    const set = res.headers.get('set-cookie');
    if (set) this.cookie = set.split(';')[0];
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      // not JSON: keep the text
    }
    return { status: res.status, body: parsed };
  }
}
