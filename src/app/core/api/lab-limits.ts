import { Injectable, type Signal, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { catchError, of, shareReplay } from 'rxjs';
import { type LabLimits, NO_LAB_LIMITS } from '@shared/stock-types';
import { StockApi } from './stock-api';

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
    stream: () => cache.limits$.pipe(catchError(() => of(NO_LAB_LIMITS))),
  });
  return computed(() => (limits.hasValue() ? limits.value() : null));
}

/** The lab's limits as soon as they arrive, Kerfbook's defaults until then. Call in an injection context. */
export function labLimits(): Signal<LabLimits> {
  const limits = labLimitsWhen(() => true);
  return computed(() => limits() ?? NO_LAB_LIMITS);
}
