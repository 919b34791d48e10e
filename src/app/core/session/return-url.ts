/**
 * A returnUrl from the query string, kept only if it is a path inside this app
 * (an absolute or protocol-relative URL would send the user elsewhere after sign-in).
 */
export function safeReturnUrl(value: string | null | undefined, fallback = '/today'): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  if (value.startsWith('/sign-in')) return fallback;
  return value;
}
