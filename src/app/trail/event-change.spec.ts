import { fullJson, shortValue, summariseChange } from './event-change';

describe('summariseChange', () => {
  it('lists only the keys whose value changed, old → new', () => {
    expect(summariseChange({ revision: 3, status: 'returned', title: 'Bar' }, { revision: 4, status: 'draft', title: 'Bar' })).toEqual({
      kind: 'changed',
      lines: ['revision: 3 → 4', 'status: returned → draft'],
      more: 0,
    });
  });

  it('shows three lines and counts the rest', () => {
    const before = { a: 1, b: 1, c: 1, d: 1, e: 1 };
    const after = { a: 2, b: 2, c: 2, d: 2, e: 2 };
    const summary = summariseChange(before, after);
    expect(summary.lines).toEqual(['a: 1 → 2', 'b: 1 → 2', 'c: 1 → 2']);
    expect(summary.more).toBe(2);
  });

  it('describes a created and a removed record by their values', () => {
    expect(summariseChange(null, { number: 'KB-0012', roles: ['author', 'approver'] })).toEqual({
      kind: 'created',
      lines: ['number: KB-0012', 'roles: author, approver'],
      more: 0,
    });
    expect(summariseChange({ active: true }, null)).toEqual({ kind: 'removed', lines: ['active: true'], more: 0 });
    expect(summariseChange(null, null)).toEqual({ kind: 'none', lines: [], more: 0 });
  });

  it('skips a key that went from absent to empty, and names a change hidden by cutting', () => {
    const long = 'x'.repeat(60);
    const summary = summariseChange({ note: `${long}a` }, { acknowledged: [], note: `${long}b` });
    expect(summary.lines).toEqual(['note: changed (see the detail)']);
  });

  it('cuts digests and long values short', () => {
    expect(shortValue('ab12'.repeat(16))).toBe('ab12ab12ab12…');
    expect(shortValue('y'.repeat(50))).toHaveLength(40);
    expect(shortValue('')).toBe('—');
    expect(shortValue({ min: 45, max: 68, scale: 'HRC' })).toBe('min 45, max 68, scale HRC');
    expect(shortValue({ a: { b: 1 } })).toBe('{"a":{"b":1}}');
    expect(fullJson(undefined)).toBe('(nothing)');
    expect(fullJson({ a: 1 })).toBe('{\n  "a": 1\n}');
  });
});
