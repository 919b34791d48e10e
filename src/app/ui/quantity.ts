import { Pipe, type PipeTransform } from '@angular/core';
import type { UnitPreference } from '@shared/api-types';
import { NO_VALUE, type QuantityKind, formatQuantity } from '@shared/units';

/** The metric units Kerfbook stores (every value is kept metric; imperial is only shown), as the templates name them. */
export type MetricUnit = 'mm' | 'm/s' | 'mm/s' | 'rpm' | 'mm³/s' | 's' | 'L/min' | '% v/v';

const KIND: Partial<Record<MetricUnit, QuantityKind>> = {
  mm: 'length',
  'm/s': 'speed',
  'mm/s': 'feed',
  rpm: 'rpm',
  'mm³/s': 'removal',
  s: 'time',
};

/** US gallons per litre (1 US gal = 3.785411784 L exactly). */
const US_GAL_PER_L = 1 / 3.785411784;

/**
 * A stored metric value with its unit, and the imperial value beside it for users who asked
 * for both (e.g. "250 mm (9.84 in)"), through shared/units.ts. Coolant flow and
 * concentration, which units.ts does not cover, are formatted here.
 */
export function formatMetric(value: number | null | undefined, unit: MetricUnit, pref: UnitPreference | undefined): string {
  const kind = KIND[unit];
  if (kind) return formatQuantity(value, kind, pref ?? 'metric');
  if (value === null || value === undefined || !Number.isFinite(value)) return NO_VALUE;
  const metric = `${Number(value.toFixed(1))} ${unit}`;
  if (unit === 'L/min' && pref === 'metric+imperial') return `${metric} (${(value * US_GAL_PER_L).toFixed(2)} US gal/min)`;
  return metric;
}

/** `{{ record.diameterMm | quantity: 'mm' : units() }}` */
@Pipe({ name: 'quantity' })
export class QuantityPipe implements PipeTransform {
  transform(value: number | null | undefined, unit: MetricUnit, pref: UnitPreference | undefined): string {
    return formatMetric(value, unit, pref);
  }
}
