/**
 * A small HTTP client for the Seamwright API as a browser would use it: a cookie jar (session and
 * CSRF cookies), the `X-CSRF-Token` header on state-changing requests, JSON in and out, and a
 * timeout on every request so a hanging server fails the test instead of stalling it.
 */

export interface ApiResponse<T = any> {
  status: number;
  headers: Headers;
  /** Parsed JSON body, or undefined when the body is not JSON. */
  json: T;
  text: string;
  contentType: string;
}

export interface RequestOptions {
  /** A JSON body (serialised with JSON.stringify). */
  json?: unknown;
  /** A raw body (string, bytes or FormData); `headers` should then name its content type. */
  body?: string | Uint8Array | FormData | Blob;
  headers?: Record<string, string>;
  /** Send the CSRF header (default: true for POST, PUT, PATCH, DELETE). */
  csrf?: boolean;
  /** Send the cookie jar (default true). */
  cookies?: boolean;
  timeoutMs?: number;
}

export interface Credentials {
  email: string;
  password: string;
  displayName: string;
  role: 'designer' | 'quilter';
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export class ApiClient {
  readonly cookies = new Map<string, string>();
  csrfToken: string | undefined;
  user: { id: string; email: string; displayName: string; role: string } | undefined;

  constructor(readonly baseUrl: string) {}

  /** The Cookie header value the jar would send. */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  private keepCookies(headers: Headers) {
    for (const line of headers.getSetCookie()) {
      const [pair, ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      if (eq < 0) continue;
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expires = attrs.map((a) => a.trim()).find((a) => /^expires=/i.test(a));
      const maxAge = attrs.map((a) => a.trim()).find((a) => /^max-age=/i.test(a));
      const gone =
        value === '' ||
        (maxAge !== undefined && Number(maxAge.split('=')[1]) <= 0) ||
        (expires !== undefined && Date.parse(expires.slice(8)) < Date.now());
      if (gone) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async request<T = any>(method: string, path: string, options: RequestOptions = {}): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
    let body: RequestInit['body'];
    if (options.json !== undefined) {
      headers['content-type'] ??= 'application/json';
      body = JSON.stringify(options.json);
    } else if (options.body !== undefined) {
      body = options.body as RequestInit['body'];
    }
    const wantsCsrf = options.csrf ?? STATE_CHANGING.has(method.toUpperCase());
    if (wantsCsrf) {
      if (!this.csrfToken) await this.fetchCsrf();
      headers['x-csrf-token'] = this.csrfToken ?? '';
    }
    // After the token fetch: it sets the CSRF cookie that must travel with the header.
    if ((options.cookies ?? true) && this.cookies.size > 0) headers['cookie'] = this.cookieHeader();
    const res = await fetch(this.baseUrl + path, {
      method,
      headers,
      body,
      redirect: 'manual',
      signal: AbortSignal.timeout(options.timeoutMs ?? 15_000),
    });
    this.keepCookies(res.headers);
    const text = await res.text();
    const contentType = res.headers.get('content-type') ?? '';
    let json: any;
    if (contentType.includes('json')) {
      try {
        json = JSON.parse(text);
      } catch {
        json = undefined;
      }
    }
    if (json && typeof json === 'object' && typeof json.csrfToken === 'string') this.csrfToken = json.csrfToken;
    return { status: res.status, headers: res.headers, json, text, contentType };
  }

  get<T = any>(path: string, options?: RequestOptions) {
    return this.request<T>('GET', path, options);
  }
  post<T = any>(path: string, json?: unknown, options?: RequestOptions) {
    return this.request<T>('POST', path, { ...options, json: json ?? {} });
  }
  put<T = any>(path: string, json?: unknown, options?: RequestOptions) {
    return this.request<T>('PUT', path, { ...options, json: json ?? {} });
  }
  patch<T = any>(path: string, json?: unknown, options?: RequestOptions) {
    return this.request<T>('PATCH', path, { ...options, json: json ?? {} });
  }
  delete<T = any>(path: string, options?: RequestOptions) {
    return this.request<T>('DELETE', path, options);
  }

  async fetchCsrf(): Promise<string> {
    const res = await this.request('GET', '/api/auth/csrf', { csrf: false });
    if (res.status !== 200 || typeof res.json?.csrfToken !== 'string') {
      throw new Error(`GET /api/auth/csrf answered ${res.status}: ${res.text.slice(0, 200)}`);
    }
    return res.json.csrfToken as string;
  }

  /** Signs up; throws unless the server answers 201. */
  async signUp(c: Credentials) {
    const res = await this.post('/api/auth/sign-up', c);
    if (res.status !== 201) throw new Error(`sign-up of ${c.email} answered ${res.status}: ${res.text.slice(0, 300)}`);
    this.user = res.json.user;
    return res;
  }

  async signIn(email: string, password: string) {
    const res = await this.post('/api/auth/sign-in', { email, password });
    if (res.status === 200) this.user = res.json.user;
    return res;
  }

  async signOut() {
    const res = await this.post('/api/auth/sign-out');
    this.user = undefined;
    return res;
  }
}

let counter = 0;
/** Credentials for a new test account with a unique address. */
export function newCredentials(role: 'designer' | 'quilter' = 'designer', name: string = role): Credentials {
  counter++;
  const tag = `${Date.now().toString(36)}${counter}${Math.random().toString(36).slice(2, 6)}`;
  return {
    email: `${name}-${tag}@faults.example`,
    password: `correct-horse-${tag}`,
    displayName: `${name} ${counter}`,
    role,
  };
}

/** Signs up a fresh account and returns its signed-in client. */
export async function signedInClient(baseUrl: string, role: 'designer' | 'quilter' = 'designer', name?: string) {
  const client = new ApiClient(baseUrl);
  const credentials = newCredentials(role, name);
  await client.signUp(credentials);
  return { client, credentials };
}
