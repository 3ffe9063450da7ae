/** A small HTTP client for the API tests: real requests to the built server, one cookie jar each. */
export const BASE_URL = process.env.BONDMAP_TEST_URL ?? '';
if (!BASE_URL) throw new Error('BONDMAP_TEST_URL is not set: run the server tests through `npm test`.');

export interface ApiResponse<T = any> {
  status: number;
  headers: Headers;
  body: T;
  text: string;
}

/**
 * Each client speaks from its own address (the test server trusts X-Forwarded-For), as people on
 * their own devices do: the sign-in throttle's per-address block then counts one client's failures,
 * not every test file's at once from the loopback address. Tests of the throttle name their own.
 */
const clientAddress = () => `198.19.${Math.floor(Math.random() * 256)}.${1 + Math.floor(Math.random() * 254)}`;

export class Client {
  private cookies = new Map<string, string>();
  private readonly address = clientAddress();

  constructor(readonly baseUrl = BASE_URL) {}

  async request<T = any>(method: string, path: string, options: { json?: unknown; body?: string | Uint8Array<ArrayBuffer>; headers?: Record<string, string> } = {}): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { 'x-forwarded-for': this.address, ...options.headers };
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    let body = options.body;
    if (options.json !== undefined) {
      body = JSON.stringify(options.json);
      headers['content-type'] ??= 'application/json';
    }
    const response = await fetch(this.baseUrl + path, { method, headers, body, redirect: 'manual' });
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq);
      const value = pair.slice(eq + 1);
      if (value === '' || /max-age=0/i.test(cookie)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await response.text();
    let parsed: unknown = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      // not JSON: keep the text
    }
    return { status: response.status, headers: response.headers, body: parsed as T, text };
  }

  get<T = any>(path: string) {
    return this.request<T>('GET', path);
  }
  post<T = any>(path: string, json?: unknown) {
    return this.request<T>('POST', path, { json: json ?? {} });
  }
  put<T = any>(path: string, json: unknown) {
    return this.request<T>('PUT', path, { json });
  }
  patch<T = any>(path: string, json: unknown) {
    return this.request<T>('PATCH', path, { json });
  }

  /** Posts an HTML form (urlencoded) from the app's own origin, as a browser on its page would. */
  form<T = any>(path: string, fields: Record<string, string>) {
    return this.request<T>('POST', path, { body: new URLSearchParams(fields).toString(), headers: { origin: new URL(this.baseUrl).origin, 'content-type': 'application/x-www-form-urlencoded' } });
  }

  /** A GET whose body is not JSON (photos, PDFs): the raw response, with this client's cookies. */
  getRaw(path: string): Promise<Response> {
    const cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    return fetch(this.baseUrl + path, { headers: cookie ? { cookie } : {} });
  }

  async signIn(email: string, password: string): Promise<this> {
    const response = await this.post('/api/auth/login', { email, password });
    if (response.status !== 200) throw new Error(`sign-in of ${email} failed: ${response.status} ${response.text}`);
    return this;
  }

  hasSession(): boolean {
    return this.cookies.has('bondmap_session');
  }
}

export async function signedIn(email: string, password: string): Promise<Client> {
  return new Client().signIn(email, password);
}
