import { HttpClient } from '@angular/common/http';
import { type Signal, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { catchError, of } from 'rxjs';
import { DEFAULT_POWER_WARNING_PCT } from '@shared/cutting-power';
import type { LabLimits } from '@shared/stock-types';
import { latestValue } from './latest-value';

/** Limits without any lab setting: no feed ceilings, no cutting energies (so no power figures), the usual warning share. */
export const NO_LAB_LIMITS: LabLimits = { feedCeilingsMmS: {}, specificEnergyJMm3: {}, powerWarningPct: DEFAULT_POWER_WARNING_PCT };

/**
 * The lab's limits (GET /api/settings/limits) as a signal: NO_LAB_LIMITS while loading and
 * when the call fails (the error interceptor has said so). Call in an injection context;
 * the request goes out when the caller is created.
 */
export function labLimits(): Signal<LabLimits> {
  const http = inject(HttpClient);
  const limits = rxResource({ stream: () => http.get<LabLimits>('/api/settings/limits').pipe(catchError(() => of(NO_LAB_LIMITS))) });
  return latestValue(limits, NO_LAB_LIMITS);
}
