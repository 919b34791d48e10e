import { type QuantityKind, formatQuantity } from '@shared/units';

/** A field hint with the imperial value, for people who asked to see both; '' for everyone else. */
export function imperialHint(value: number | null, kind: QuantityKind, imperial: boolean): string {
  return imperial && value !== null && Number.isFinite(value) ? `= ${formatQuantity(value, kind, 'metric+imperial')}` : '';
}
