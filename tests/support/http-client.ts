// A small cookie-keeping HTTP client for API tests and benchmarks: one instance is one browser (one session).

export interface Reply<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

export class TestClient {
  private cookies = new Map<string, string>();

  constructor(readonly baseUrl: string) {}

  async request<T = any>(method: string, path: string, body?: unknown, rawBody?: string): Promise<Reply<T>> {
    const headers: Record<string, string> = { origin: this.baseUrl };
    if (body !== undefined || rawBody !== undefined) headers['content-type'] = 'application/json';
    if (this.cookies.size > 0) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    const res = await fetch(this.baseUrl + path, {
      method,
      headers,
      body: rawBody ?? (body === undefined ? undefined : JSON.stringify(body)),
      redirect: 'manual',
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      if (value === '' || /max-age=0/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  /** The Cookie header this client would send (for websocket upgrades). */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  get = <T = any>(path: string) => this.request<T>('GET', path);
  post = <T = any>(path: string, body?: unknown) => this.request<T>('POST', path, body ?? {});
  patch = <T = any>(path: string, body?: unknown) => this.request<T>('PATCH', path, body ?? {});
  delete = <T = any>(path: string) => this.request<T>('DELETE', path);

  async signUp(email: string, password = 'correct-horse-battery', name = email.split('@')[0]) {
    const r = await this.post('/api/auth/sign-up/email', { email, password, name });
    if (r.status !== 200) throw new Error(`sign-up of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
    return r.body.user as { id: string; email: string; name: string };
  }

  async signIn(email: string, password = 'correct-horse-battery') {
    return this.post('/api/auth/sign-in/email', { email, password });
  }

  async signOut() {
    return this.post('/api/auth/sign-out', {});
  }
}
