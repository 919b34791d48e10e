/**
 * A signed-in session over plain HTTP, as the browser has one: session cookie plus CSRF
 * token (GET /api/session/csrf, then POST /api/session; the token changes at sign-in).
 */
export interface HttpSession {
  /** Value of the Cookie header to send. */
  cookie: string;
  csrfToken: string;
  get<T>(path: string): Promise<T>;
  /** GET answering the status and body size, without parsing (PDFs, failures). */
  fetchRaw(path: string): Promise<{ status: number; bytes: number; text: string }>;
  post<T>(path: string, body?: unknown): Promise<T>;
}

function cookiesOf(res: Response, jar: Map<string, string>): void {
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(';');
    const eq = pair!.indexOf('=');
    if (eq > 0) jar.set(pair!.slice(0, eq).trim(), pair!.slice(eq + 1).trim());
  }
}

export async function signIn(baseUrl: string, username: string, password: string): Promise<HttpSession> {
  const jar = new Map<string, string>();
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const call = async (method: string, path: string, token: string, body?: unknown): Promise<Response> => {
    const res = await fetch(`${baseUrl}${path}`, {
      method,
      headers: { cookie: cookie(), 'x-csrf-token': token, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
      ...(body === undefined ? {} : { body: JSON.stringify(body) }),
    });
    cookiesOf(res, jar);
    return res;
  };
  const expectOk = async (res: Response, what: string): Promise<string> => {
    const text = await res.text();
    if (!res.ok) throw new Error(`${what} → ${res.status}: ${text.slice(0, 300)}`);
    return text;
  };

  const first = JSON.parse(await expectOk(await call('GET', '/api/session/csrf', ''), 'GET /api/session/csrf')) as { csrfToken: string };
  const signedIn = JSON.parse(await expectOk(await call('POST', '/api/session', first.csrfToken, { username, password }), `sign in as ${username}`)) as {
    csrfToken: string;
  };
  const token = signedIn.csrfToken;
  return {
    get cookie() {
      return cookie();
    },
    csrfToken: token,
    get: async <T>(path: string) => JSON.parse(await expectOk(await call('GET', path, token), `GET ${path}`)) as T,
    fetchRaw: async (path) => {
      const res = await call('GET', path, token);
      const buf = Buffer.from(await res.arrayBuffer());
      return { status: res.status, bytes: buf.length, text: res.ok ? '' : buf.toString('utf8').slice(0, 300) };
    },
    post: async <T>(path: string, body?: unknown) => {
      const text = await expectOk(await call('POST', path, token, body ?? {}), `POST ${path}`);
      return (text ? JSON.parse(text) : null) as T;
    },
  };
}
