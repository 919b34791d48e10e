import { z } from 'zod';

/**
 * A measured quantity: a finite number inside a plausible window for its unit, so that
 * zero, negative, NaN, huge and non-numeric values get a clear message naming the unit.
 */
export function quantity(label: string, unit: string, min: number, max: number, options: { inclusiveMin?: boolean } = {}) {
  const base = z.number({ error: `${label} must be a number (${unit}).` }).refine(Number.isFinite, `${label} must be a finite number.`);
  const lower = options.inclusiveMin
    ? base.refine((n) => n >= min, `${label} must be at least ${min} ${unit}.`)
    : base.refine((n) => n > min, `${label} must be more than ${min} ${unit}.`);
  return lower.refine((n) => n <= max, `${label} must be at most ${max} ${unit}.`);
}

/** Optional text with a cap. */
export function text(label: string, max: number) {
  return z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, `${label} must be at most ${max} characters.`);
}

/** Required text with a cap. */
export function requiredText(label: string, max: number) {
  return text(label, max).min(1, `${label} is required.`);
}

/** Positive integer id in a body. */
export const refId = (label: string) =>
  z
    .number({ error: `${label} must be chosen.` })
    .int(`${label} must be a whole number.`)
    .positive(`${label} must be chosen.`);
