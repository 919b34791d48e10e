import { Injectable, type Signal, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { catchError, of, shareReplay } from 'rxjs';
import { DEFAULT_POWER_WARNING_PCT } from '@shared/cutting-power';
import type { LabLimits } from '@shared/stock-types';
import { KERFBOOK_KERF_ALLOWANCE_MM, KERFBOOK_WORN_DIAMETER_SHARE } from '@shared/worn-wheel';
import { StockApi } from './stock-api';

/**
 * Kerfbook's own defaults, where the lab's limits cannot be had: no feed ceilings, a wheel
 * used down to 70 % of its new diameter, a 0.2 mm kerf allowance, no cutting energies (so no
 * power figures) and the usual power warning share.
 */
export const KERFBOOK_LAB_LIMITS: LabLimits = {
  feedCeilingsMmS: {},
  wornDiameterShare: KERFBOOK_WORN_DIAMETER_SHARE,
  kerfAllowanceMm: KERFBOOK_KERF_ALLOWANCE_MM,
  specificEnergyJMm3: {},
  powerWarningPct: DEFAULT_POWER_WARNING_PCT,
};

/** The lab's limits, asked for once per session (they change rarely); a failed request is asked again next time. */
@Injectable({ providedIn: 'root' })
export class LabLimitsCache {
  readonly limits$ = inject(StockApi).limits().pipe(shareReplay(1));
}

/**
 * The lab's limits, fetched once `wanted()` turns true: null until they arrive, Kerfbook's
 * defaults if the request fails. Call in an injection context.
 */
export function labLimitsWhen(wanted: () => boolean): Signal<LabLimits | null> {
  const cache = inject(LabLimitsCache);
  const limits = rxResource({
    params: () => (wanted() ? true : undefined),
    stream: () => cache.limits$.pipe(catchError(() => of(KERFBOOK_LAB_LIMITS))),
  });
  return computed(() => (limits.hasValue() ? limits.value() : null));
}

/** The lab's limits as soon as they arrive, Kerfbook's defaults until then. Call in an injection context. */
export function labLimits(): Signal<LabLimits> {
  const limits = labLimitsWhen(() => true);
  return computed(() => limits() ?? KERFBOOK_LAB_LIMITS);
}
