/**
 * Numbers as people type them. Labs write decimals with a point or with a comma (ISO 80000-1
 * allows both as the decimal sign), and browsers of one locale read the other sign as a
 * thousands separator and drop it: "0,3" became 3. Here either sign is the decimal sign, and
 * anything that might be a thousands separator is refused with a message, never guessed.
 */

/** What was typed: a number, nothing (null), or a refusal with the reason. */
export type DecimalText = { ok: true; value: number | null } | { ok: false; message: string };

const PLAIN = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/;

/**
 * Reads a typed number. `groupSeparator` is the thousands separator of the person's locale
 * (',' in English, '.' in German): one such sign followed by exactly three digits, after 1–3
 * digits other than a lone 0, reads as a thousands separator there ("1,500" in English) and
 * as a decimal sign elsewhere, so it is refused. Every other single point or comma is the
 * decimal sign.
 */
export function parseDecimalText(text: string, groupSeparator = ','): DecimalText {
  const typed = text.trim();
  if (typed === '') return { ok: true, value: null };
  const signs = typed.match(/[.,]/g) ?? [];
  if (signs.length > 1) {
    return { ok: false, message: `"${typed}" has more than one point or comma. Type the number without thousands separators, e.g. 1000.5 or 1000,5.` };
  }
  if (!PLAIN.test(typed)) return { ok: false, message: `"${typed}" is not a number. Type digits with a point or comma for decimals, e.g. 0.3 or 0,3.` };
  const sign = signs[0];
  if (sign !== undefined && sign === groupSeparator) {
    const [whole, fraction] = typed.replace(/^[+-]/, '').split(sign) as [string, string];
    if (fraction.length === 3 && /^[1-9]\d{0,2}$/.test(whole)) {
      const decimalSign = sign === ',' ? '.' : ',';
      return {
        ok: false,
        message: `"${typed}" could mean ${whole}${fraction} or ${whole}${decimalSign}${fraction}. Type ${whole}${fraction} for the first or ${whole}${decimalSign}${fraction} for the second.`,
      };
    }
  }
  const value = Number(typed.replace(',', '.'));
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `"${typed}" is not a number.` };
}

/** A stored number as text with the person's decimal sign, never with thousands separators. */
export function formatDecimalText(value: number | null | undefined, decimalSign = '.'): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  const text = String(value);
  return decimalSign === ',' ? text.replace('.', ',') : text;
}
