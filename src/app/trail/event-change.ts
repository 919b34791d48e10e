/** How many changed keys a trail row shows before "and N more". */
const SHOWN_LINES = 3;
/** A value longer than this is cut in the row; the detail shows it whole. */
const VALUE_CHARS = 40;
/** A SHA-256 (or similar) in hex: its first characters are enough to tell it apart in a row. */
const HEX_DIGEST = /^[0-9a-f]{32,}$/i;

/** A before → after pair of one event, cut down to a few lines for the table. */
export interface ChangeSummary {
  kind: 'changed' | 'created' | 'removed' | 'none';
  lines: string[];
  /** Changed keys not shown in `lines`. */
  more: number;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** A value as a short piece of text: arrays as lists, objects as JSON, long values cut. */
export function shortValue(value: unknown): string {
  let text: string;
  if (value === undefined || value === null || value === '') text = '—';
  else if (Array.isArray(value)) text = value.every((v) => typeof v !== 'object') ? value.join(', ') || '—' : JSON.stringify(value);
  else if (typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>);
    // A flat object (a hardness range, a size) reads better as its pairs than as JSON.
    text = entries.every(([, v]) => v === null || typeof v !== 'object') ? entries.map(([k, v]) => `${k} ${v ?? '—'}`).join(', ') : JSON.stringify(value);
  } else text = String(value);
  if (HEX_DIGEST.test(text)) return `${text.slice(0, 12)}…`;
  return text.length > VALUE_CHARS ? `${text.slice(0, VALUE_CHARS - 1)}…` : text;
}

function cut(lines: string[]): Pick<ChangeSummary, 'lines' | 'more'> {
  return { lines: lines.slice(0, SHOWN_LINES), more: Math.max(0, lines.length - SHOWN_LINES) };
}

/** The keys whose value differs between before and after, in the order they first appear. */
export function summariseChange(before: unknown, after: unknown): ChangeSummary {
  const empty = (v: unknown) => v === null || v === undefined;
  if (empty(before) && empty(after)) return { kind: 'none', lines: [], more: 0 };
  if (empty(before)) {
    const lines = isRecord(after) ? Object.entries(after).map(([key, value]) => `${key}: ${shortValue(value)}`) : [shortValue(after)];
    return { kind: 'created', ...cut(lines) };
  }
  if (empty(after)) {
    const lines = isRecord(before) ? Object.entries(before).map(([key, value]) => `${key}: ${shortValue(value)}`) : [shortValue(before)];
    return { kind: 'removed', ...cut(lines) };
  }
  if (!isRecord(before) || !isRecord(after)) {
    return { kind: 'changed', lines: [`${shortValue(before)} → ${shortValue(after)}`], more: 0 };
  }
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])];
  const lines = keys
    .filter((key) => JSON.stringify(before[key]) !== JSON.stringify(after[key]))
    .flatMap((key) => {
      const [from, to] = [shortValue(before[key]), shortValue(after[key])];
      if (from !== to) return [`${key}: ${from} → ${to}`];
      // Absent and empty read the same in a row; a long value cut the same way is still a change.
      return from === '—' ? [] : [`${key}: changed (see the detail)`];
    });
  return { kind: lines.length ? 'changed' : 'none', ...cut(lines) };
}

/** Pretty JSON for the detail view; "(nothing)" for an empty side. */
export function fullJson(value: unknown): string {
  return value === null || value === undefined ? '(nothing)' : JSON.stringify(value, null, 2);
}
