/**
 * Sets the scene through the API, as a second person at another desk would: signs in with
 * its own cookies and CSRF token. Journeys use it for steps that are not what they test.
 */
import { type APIRequestContext, request } from 'playwright-core';
import { BASE_URL } from './browser';

export interface ApiSession {
  get<T>(path: string): Promise<T>;
  post<T>(path: string, body?: unknown): Promise<T>;
  put<T>(path: string, body: unknown): Promise<T>;
  /** A multipart upload: text fields and one file in the field "file". */
  upload<T>(path: string, fields: Record<string, string>, file: { name: string; mimeType: string; buffer: Buffer }): Promise<T>;
  close(): Promise<void>;
}

async function json<T>(context: APIRequestContext, method: 'get' | 'post' | 'put', path: string, csrf: string, body?: unknown): Promise<T> {
  const res = await context.fetch(`${BASE_URL}${path}`, {
    method: method.toUpperCase(),
    headers: { 'x-csrf-token': csrf, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    ...(body === undefined ? {} : { data: JSON.stringify(body) }),
  });
  const text = await res.text();
  if (!res.ok()) throw new Error(`${method.toUpperCase()} ${path} → ${res.status()}: ${text.slice(0, 500)}`);
  return (text ? JSON.parse(text) : null) as T;
}

export async function apiSignIn(username: string, password: string): Promise<ApiSession> {
  const context = await request.newContext({ baseURL: BASE_URL });
  const { csrfToken: anonymous } = await json<{ csrfToken: string }>(context, 'get', '/api/session/csrf', '');
  const { csrfToken } = await json<{ csrfToken: string }>(context, 'post', '/api/session', anonymous, { username, password });
  return {
    get: (path) => json(context, 'get', path, csrfToken),
    post: (path, body) => json(context, 'post', path, csrfToken, body ?? {}),
    put: (path, body) => json(context, 'put', path, csrfToken, body),
    upload: async (path, fields, file) => {
      const res = await context.fetch(`${BASE_URL}${path}`, { method: 'POST', headers: { 'x-csrf-token': csrfToken }, multipart: { ...fields, file } });
      const text = await res.text();
      if (!res.ok()) throw new Error(`POST ${path} → ${res.status()}: ${text.slice(0, 500)}`);
      return JSON.parse(text) as never;
    },
    close: () => context.dispose(),
  };
}
