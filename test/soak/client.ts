/**
 * One simulated person over plain HTTP (Node's fetch), as the browser talks to the app:
 * a cookie jar of its own, the CSRF token of its session on every write (the same steps as
 * test/perf/load/http-session.ts, but every answer is kept — status, time, error code — instead of
 * thrown, because the soak counts failures rather than stopping at the first one).
 */
import { CSRF_HEADER } from '../../shared/api-types';

/** One request as the soak saw it. Times are ms since the run started. */
export interface RequestRecord {
  kind: string;
  method: string;
  status: number;
  /** The API error code of a failure (e.g. DATABASE_UNAVAILABLE); 'NETWORK' or 'TIMEOUT' when no answer came. */
  code: string | null;
  startMs: number;
  endMs: number;
  /** Why no answer came (the network error's cause), for the report. */
  error?: string;
}

export interface Answer<T> {
  status: number;
  body: T;
  ok: boolean;
}

/** No answer within this long counts as a hung request. */
export const REQUEST_TIMEOUT_MS = 30_000;

export class SoakClient {
  private readonly jar = new Map<string, string>();
  private csrf = '';

  constructor(
    private readonly baseUrl: () => string,
    private readonly sink: (r: RequestRecord) => void,
    private readonly clock: () => number,
  ) {}

  private cookie(): string {
    return [...this.jar].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  private keepCookies(res: Response): void {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair!.indexOf('=');
      if (eq > 0) this.jar.set(pair!.slice(0, eq).trim(), pair!.slice(eq + 1).trim());
    }
  }

  /** Any request; `kind` names it in the summary. JSON answers are parsed, others read as bytes. */
  async call<T = unknown>(kind: string, method: string, path: string, body?: unknown): Promise<Answer<T>> {
    const startMs = this.clock();
    let status = 0;
    let code: string | null = null;
    let error: string | undefined;
    try {
      const res = await fetch(`${this.baseUrl()}${path}`, {
        method,
        headers: {
          cookie: this.cookie(),
          ...(method === 'GET' ? {} : { [CSRF_HEADER]: this.csrf }),
          ...(body === undefined ? {} : { 'content-type': 'application/json' }),
        },
        ...(body === undefined ? {} : { body: JSON.stringify(body) }),
        signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
      });
      this.keepCookies(res);
      status = res.status;
      const isJson = (res.headers.get('content-type') ?? '').includes('application/json');
      const parsed = isJson ? ((await res.json()) as T) : ((await res.arrayBuffer(), null) as T);
      if (!res.ok) code = (parsed as { code?: string } | null)?.code ?? null;
      return { status, body: parsed, ok: res.ok };
    } catch (err) {
      // No answer, or one cut off inside its body (the app killed while answering): nothing usable came.
      status = 0;
      code = (err as Error).name === 'TimeoutError' ? 'TIMEOUT' : 'NETWORK';
      const cause = (err as { cause?: { code?: string; message?: string } }).cause;
      error = `${path}: ${cause?.code ?? ''} ${cause?.message ?? (err as Error).message}`.slice(0, 200);
      return { status: 0, body: null as T, ok: false };
    } finally {
      this.sink({ kind, method, status, code, startMs, endMs: this.clock(), ...(error ? { error } : {}) });
    }
  }

  /** Anonymous CSRF token, then sign-in; the token changes at sign-in. True when signed in. */
  async signIn(username: string, password: string): Promise<boolean> {
    const first = await this.call<{ csrfToken: string }>('sign-in', 'GET', '/api/session/csrf');
    if (!first.ok) return false;
    this.csrf = first.body.csrfToken;
    const res = await this.call<{ csrfToken: string }>('sign-in', 'POST', '/api/session', { username, password });
    if (!res.ok) return false;
    this.csrf = res.body.csrfToken;
    return true;
  }
}
