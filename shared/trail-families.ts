/**
 * Which event types make up each trail family, as code prefixes ("user.") and single codes.
 * Prefixes let a family take in event types added later without a change here.
 */
import type { TrailFamily } from './vocabulary';

export interface TrailFamilyRule {
  prefixes: readonly string[];
  types: readonly string[];
}

/** The types an electronic signature (name and password) stands behind. */
const SIGNED_TYPES = ['recipe.version_approved', 'recipe.version_withdrawn'];

/** Signatures refused for a wrong password, and the limit those refusals reach. */
const REFUSED_SIGNING_TYPES = ['user.signature_password_wrong', 'user.wrong_password_limit_reached'];

export const TRAIL_FAMILY_RULES: Record<TrailFamily, TrailFamilyRule> = {
  recipes: { prefixes: ['recipe.', 'attachment.'], types: [] },
  signatures: { prefixes: [], types: [...SIGNED_TYPES, ...REFUSED_SIGNING_TYPES] },
  'shop-floor': { prefixes: ['sheet.', 'cut.'], types: ['recipe.version_acknowledged'] },
  stock: { prefixes: ['material.', 'wheel.', 'machine.', 'selection_row.'], types: [] },
  people: { prefixes: ['user.'], types: [] },
  'sign-ins': { prefixes: ['session.'], types: [] },
  settings: { prefixes: ['settings.', 'lab_settings.'], types: [] },
};

/** True when an event type belongs to a family. */
export function inTrailFamily(type: string, family: TrailFamily): boolean {
  const rule = TRAIL_FAMILY_RULES[family];
  return rule.types.includes(type) || rule.prefixes.some((p) => type.startsWith(p));
}
