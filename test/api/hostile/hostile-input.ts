/**
 * fast-check arbitraries for hostile requests: wrong types, huge strings, deep nesting,
 * prototype-pollution keys, awkward Unicode, numbers as strings, arrays for objects,
 * malformed JSON, wrong content types, odd query strings, odd headers and odd path values.
 * Sources for the shapes: OWASP Web Security Testing Guide 4.2 (WSTG-INPV: input
 * validation; WSTG-INPV-12 HTTP parameter pollution), OWASP "Prototype Pollution
 * Prevention Cheat Sheet", RFC 8259 (JSON) for what is and is not JSON.
 */
import fc from 'fast-check';

/** Under the 1 MB JSON limit, but far over every text field's maximum. */
export const HUGE = 'x'.repeat(200_000);
/** Over the 1 MB JSON limit (body-parsing.ts): must be 413. */
export const OVER_LIMIT = `{"notes":"${'y'.repeat(1_100_000)}"}`;

/** Keys that reach Object.prototype when code merges objects carelessly. */
export const POLLUTION_KEYS = ['__proto__', 'constructor', 'prototype', '__defineGetter__', 'hasOwnProperty', 'toString', 'valueOf'];

/** Field names the API's bodies and queries really use (shared/schemas), so some fuzz lands on real fields. */
export const FIELD_NAMES = [
  'username',
  'password',
  'currentPassword',
  'newPassword',
  'displayName',
  'email',
  'roles',
  'temporaryPassword',
  'machineIds',
  'units',
  'name',
  'designation',
  'group',
  'condition',
  'hardness',
  'notes',
  'kind',
  'specification',
  'diameterMm',
  'title',
  'content',
  'revision',
  'comment',
  'meaning',
  'acknowledgedWarnings',
  'reason',
  'fromVersion',
  'changeReason',
  'effectiveDate',
  'specimenId',
  'partRef',
  'quantity',
  'outcome',
  'role',
  'caption',
  'token',
  'wheelId',
  'note',
  'q',
  'page',
  'pageSize',
  'sort',
  'dir',
  'status',
  'limit',
  'from',
  'to',
  'type',
  'userId',
  'recipeId',
  'machineId',
];

/** Numbers written as text, and text that looks like numbers to a careless parser. */
const NUMBERS_AS_STRINGS = [
  '1',
  '-1',
  '0',
  '-0',
  '1.5',
  '1e3',
  '1e309',
  '-1e309',
  'NaN',
  'Infinity',
  '0x10',
  '0b1',
  '08',
  ' 1 ',
  '1_000',
  '9007199254740993',
  '99999999999999999999999',
];

/** Strings a database, a shell, a path or a template might treat specially. */
const NASTY_STRINGS = [
  "' OR '1'='1' -- ",
  '"; DROP TABLE users; --',
  '\\',
  '%',
  '_',
  '%00',
  '\u0000',
  'a\u0000b',
  '../../etc/passwd',
  '..\\..\\windows\\win.ini',
  '${7*7}',
  '{{7*7}}',
  '<script>alert(1)</script>',
  '\u202eevil',
  '\ufeffbom',
  'ＡＢＣ１２３',
  'e\u0301',
  '\ud83d\ude00',
  '\ud800',
  '   ',
  '',
  'null',
  'undefined',
  'true',
];

const unicodeString = fc.oneof(fc.string({ unit: 'grapheme', maxLength: 40 }), fc.string({ unit: 'binary', maxLength: 40 }), fc.string({ maxLength: 40 }));

/** One hostile leaf value. */
export const hostileLeaf: fc.Arbitrary<unknown> = fc.oneof(
  unicodeString,
  fc.constantFrom(...NASTY_STRINGS, ...NUMBERS_AS_STRINGS, ...POLLUTION_KEYS),
  fc.constant(HUGE),
  fc.integer(),
  fc.constantFrom(0, -1, 2 ** 31, 2 ** 53 + 2, -(2 ** 63), 1e308, -1e-308, 0.1 + 0.2),
  fc.double(), // NaN and ±Infinity become null in JSON
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.oneof(fc.integer(), fc.string({ maxLength: 5 })), { maxLength: 4 }),
  fc.dictionary(fc.string({ maxLength: 6 }), fc.integer(), { maxKeys: 3 }),
);

/** An object with real field names and polluting keys, holding hostile values. */
export const hostileObject: fc.Arbitrary<Record<string, unknown>> = fc.dictionary(
  fc.oneof(fc.constantFrom(...FIELD_NAMES, ...POLLUTION_KEYS), fc.string({ maxLength: 8 })),
  hostileLeaf,
  {
    maxKeys: 6,
  },
);

/** Any JSON value: objects, arrays for objects, scalars for objects, nested a little. */
export const hostileJson: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: hostileObject },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: fc.array(hostileObject, { maxLength: 3 }) },
  { weight: 1, arbitrary: hostileLeaf },
);

/** `depth` levels of nesting, as JSON text (a parser or a recursive walk may overflow). */
export function nested(depth: number, open = '{"a":', close = '}'): string {
  return open.repeat(depth) + '1' + close.repeat(depth);
}

/** A body that is not the JSON it claims to be, or JSON that tries to pollute prototypes. */
export const rawJsonPayload: fc.Arbitrary<string | Buffer> = fc.oneof(
  fc.constantFrom<string | Buffer>(
    '{',
    '{"a":',
    '}',
    '{"a":1,}',
    "{'a':1}",
    '{"a":undefined}',
    'NaN',
    '[1,2',
    '"unterminated',
    '\u0000',
    '\ufeff{}',
    '{"a":1}{"b":2}',
    '{"a":1,"a":2}',
    'null',
    'true',
    '0',
    '"text"',
    '[]',
    '{"__proto__":{"polluted":"yes"},"constructor":{"prototype":{"polluted":"yes"}}}',
    '{"constructor":{"prototype":{"isAdmin":true}}}',
    '{"roles":{"__proto__":["admin"]}}',
    nested(5_000),
    nested(5_000, '[', ']'),
    Buffer.from([0xff, 0xfe, 0xfd, 0x7b, 0x7d]),
    Buffer.from('{"name":"\xc3\x28"}', 'latin1'),
    OVER_LIMIT,
  ),
  fc.string({ maxLength: 30 }),
  hostileJson.map((v) => JSON.stringify(v) ?? 'null'),
);

/** Content types the JSON API must refuse or read safely. */
export const contentType: fc.Arbitrary<string> = fc.constantFrom(
  'application/json',
  'application/json; charset=utf-8',
  'application/json; charset=utf-16',
  'application/json; charset=latin1',
  'application/json; charset=bogus',
  'application/JSON',
  'application/jsonx',
  'application/vnd.api+json',
  'application/merge-patch+json',
  'text/plain',
  'text/html',
  'application/xml',
  'application/x-www-form-urlencoded',
  'multipart/form-data',
  'multipart/form-data; boundary=----nothing-here',
  '*/*',
  'json',
  '',
);

/** Whole query strings, already URL-encoded (HTTP parameter pollution, WSTG-INPV-12). */
export const queryString: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    'page=1&page=2',
    'page[]=1&page[]=2',
    'q[a][b]=1',
    'q[]=',
    '__proto__[polluted]=yes',
    'constructor[prototype][polluted]=yes',
    '__proto__=x',
    'sort=constructor',
    'sort=__proto__',
    'sort=toString',
    'sort=valueOf',
    'sort=hasOwnProperty',
    'page=-1&pageSize=0',
    'page=1e309&pageSize=NaN',
    'pageSize=99999999999999999999',
    'limit=-5',
    'sort=password&dir=sideways',
    'sort=id%3B%20DROP%20TABLE%20users',
    'status=draft&status=approved&status=draft',
    'q=%25%25%25',
    'q=%E0%A4%A',
    'q=%',
    'q=%00',
    'q=%C0%AE%C0%AE%2F',
    'from=2026-13-45&to=yesterday',
    'from=0000-00-00',
    `q=${'a'.repeat(8_000)}`,
    'a=1&'.repeat(1_500),
    '&&&==&=',
    'q',
  ),
  fc
    .dictionary(
      fc.constantFrom(...FIELD_NAMES, ...POLLUTION_KEYS),
      fc.oneof(fc.string({ maxLength: 30 }), fc.constantFrom(...NUMBERS_AS_STRINGS, ...NASTY_STRINGS)),
      { maxKeys: 4 },
    )
    .map((q) =>
      Object.entries(q)
        .map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v.replace(/[\ud800-\udfff]/g, '?'))}`)
        .join('&'),
    ),
);

/** Odd request headers (only characters Node's client lets through). */
export const oddHeaders: fc.Arbitrary<Record<string, string>> = fc.oneof(
  fc.constant({}),
  fc.constantFrom<Record<string, string>>(
    { Accept: 'application/xml' },
    { Accept: '*/*;q=bogus, text/html;level=9' },
    { 'Accept-Encoding': 'gzip;q=bogus, br, identity;q=0' },
    { 'Accept-Language': 'zz-ZZ;q=2' },
    { 'If-None-Match': '*' },
    { 'If-None-Match': '"x", W/"y", ' + '"z",'.repeat(200) },
    { 'If-Modified-Since': 'not a date' },
    { Range: 'bytes=0-1,5-3,-0' },
    { 'X-Forwarded-For': '1.2.3.4, not-an-address, ::1' },
    { 'X-Forwarded-Proto': 'https' },
    { 'X-Forwarded-Host': 'evil.example' },
    { Host: 'evil.example:99999' },
    { Origin: 'https://evil.example' },
    { Referer: 'javascript:alert(1)' },
    { 'X-HTTP-Method-Override': 'DELETE' },
    { 'X-Method-Override': 'PUT' },
    { 'Content-Encoding': 'gzip' },
    { 'Content-Encoding': 'deflate' },
    { 'Content-Encoding': 'br' },
    { 'Content-Encoding': 'bogus' },
    { 'X-CSRF-Token': '' },
    { 'X-CSRF-Token': 'x'.repeat(4_000) },
    { 'User-Agent': 'x'.repeat(4_000) },
    { 'X-Large': 'h'.repeat(7_000) },
  ),
);

/**
 * Values for path parameters: not ids, too large, encoded traversal, polluting names. The
 * few that do read as an id (' 1', '0x1', '1e3') point at 1 or 1000 only.
 */
export const oddPathValue: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    '0',
    '-1',
    '1.5',
    '1e3',
    '0x1',
    ' 1',
    '%201',
    '1%00',
    '%00',
    '9'.repeat(30),
    '2147483648',
    '9007199254740993',
    'NaN',
    'Infinity',
    '__proto__',
    'constructor',
    'prototype',
    '%2e%2e',
    '..%2f..%2fetc%2fpasswd',
    '%2e%2e%2f%2e%2e%2fetc%2fpasswd',
    '..%5c..%5cwindows',
    '%c0%ae%c0%ae',
    '%',
    '%E0%A4%A',
    'ZZZZ-ZZZZ',
    'zzzz',
    'a'.repeat(300),
  ),
  // Random text, but never a number: a real id would let the fuzz deactivate or demote the callers themselves.
  fc
    .string({ maxLength: 12 })
    .filter((s) => !Number.isFinite(Number(s)))
    .map((s) => encodeURIComponent(s.replace(/[\ud800-\udfff]/g, '?')) || '%20'),
);
