/**
 * Script-injection vectors for the browser tests. Each one, if it ever ran, calls
 * `xssHit(n)` (a function the test exposes in every frame) or opens an alert.
 *
 * Source: OWASP XSS Filter Evasion Cheat Sheet,
 * https://cheatsheetseries.owasp.org/cheatsheets/XSS_Filter_Evasion_Cheat_Sheet.html
 * (payloads adapted to call xssHit instead of alert('XSS')); the last two are not from it:
 * Markdown link/image schemes (marked's own security notes) and an Angular template
 * expression (client-side template injection).
 */

const b64 = (s: string) => Buffer.from(s).toString('base64');

export interface Vector {
  name: string;
  text: string;
}

export const VECTORS: readonly Vector[] = [
  { name: 'basic script', text: '<script>xssHit(1)</script>' },
  { name: 'external script', text: '<SCRIPT SRC=http://xss.invalid/xss.js></SCRIPT>' },
  { name: 'image javascript: source', text: '<IMG SRC="javascript:xssHit(3);">' },
  { name: 'mixed case', text: '<IMG SRC=JaVaScRiPt:xssHit(4)>' },
  { name: 'decimal entities', text: '<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;xssHit(5)>' },
  { name: 'hex entities', text: '<a href="&#x6A;&#x61;&#x76;&#x61;&#x73;&#x63;&#x72;&#x69;&#x70;&#x74;&#x3A;xssHit(6)">hex link</a>' },
  { name: 'embedded encoded tab', text: '<a href="jav&#x09;ascript:xssHit(7)">tab link</a>' },
  { name: 'image onerror', text: '<img src=x onerror="xssHit(8)">' },
  { name: 'svg onload', text: '<svg/onload=xssHit(9)>' },
  { name: 'malformed image tag', text: '<IMG """><SCRIPT>xssHit(10)</SCRIPT>">' },
  { name: 'extraneous open brackets', text: '<<SCRIPT>xssHit(11);//<</SCRIPT>' },
  { name: 'half-open tag', text: '<IMG SRC="javascript:xssHit(12)"' },
  { name: 'body onload', text: '<BODY ONLOAD=xssHit(13)>' },
  { name: 'iframe srcdoc', text: '<iframe srcdoc="<script>parent.xssHit(14)</script>"></iframe>' },
  { name: 'iframe javascript:', text: '<IFRAME SRC="javascript:parent.xssHit(15);"></IFRAME>' },
  { name: 'data: URL object', text: `<object data="data:text/html;base64,${b64('<script>parent.xssHit(16)</script>')}"></object>` },
  { name: 'style url()', text: '<DIV STYLE="background-image: url(javascript:xssHit(17))">styled</DIV>' },
  { name: 'style expression()', text: '<DIV STYLE="width: expression(xssHit(18));">expr</DIV>' },
  { name: 'meta refresh', text: '<META HTTP-EQUIV="refresh" CONTENT="0;url=javascript:xssHit(19);">' },
  { name: 'autofocus onfocus', text: '<input autofocus onfocus=xssHit(20)>' },
  { name: 'details ontoggle', text: '<details open ontoggle=xssHit(21)>' },
  { name: 'attribute breakout', text: '"><script>xssHit(22)</script>' },
  { name: 'alert in onerror', text: '<img src=y onerror=alert(23)>' },
  { name: 'Markdown javascript: link', text: '[md link](javascript:xssHit(24))' },
  { name: 'Markdown javascript: image', text: '![md image](javascript:xssHit(25))' },
  { name: 'Markdown data: link', text: `[data link](data:text/html;base64,${b64('<script>xssHit(26)</script>')})` },
  { name: 'Angular template expression', text: "{{constructor.constructor('xssHit(27)')()}}" },
];

/** All vectors, one paragraph each, for the long text fields. */
export function allVectors(marker: string): string {
  return [marker, ...VECTORS.map((v) => v.text)].join('\n\n');
}

/** The vectors by name, for the short fields. */
export function vector(name: string): string {
  const found = VECTORS.find((v) => v.name === name);
  if (!found) throw new Error(`no vector named ${name}`);
  return found.text;
}

/** Whitespace-free, for comparing text that a page or a PDF may wrap differently. */
export function compact(text: string): string {
  return text.replace(/\s+/g, '');
}
