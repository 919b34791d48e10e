/**
 * Canonical JSON: object keys sorted recursively, no whitespace, so the same content always
 * gives the same text — and the same SHA-256 once a version is submitted. Arrays keep their
 * order; `undefined` members are dropped, as JSON.stringify does.
 */
function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) {
      const member = (value as Record<string, unknown>)[key];
      if (member !== undefined) out[key] = sortKeys(member);
    }
    return out;
  }
  if (typeof value === 'number' && !Number.isFinite(value)) throw new Error('Canonical JSON cannot hold NaN or Infinity.');
  return value;
}

export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value));
}
