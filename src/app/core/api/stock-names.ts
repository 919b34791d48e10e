import { type Signal, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { type Observable, catchError, forkJoin, of } from 'rxjs';
import type { RecipeContent } from '@shared/schemas/recipe';
import type { MachineRecord, MaterialRecord, WheelRecord } from '@shared/stock-types';
import { latestValue } from './latest-value';
import { StockApi } from './stock-api';

/** The stock records a recipe version names, fetched by id; null while loading or when missing. */
export interface StockNames {
  material: MaterialRecord | null;
  wheel: WheelRecord | null;
  machine: MachineRecord | null;
}

export const NO_STOCK_NAMES: StockNames = { material: null, wheel: null, machine: null };

type StockIds = { materialId: number | null; wheelId: number; machineId: number };

const sameIds = (a: StockIds | undefined, b: StockIds | undefined) =>
  a?.materialId === b?.materialId && a?.wheelId === b?.wheelId && a?.machineId === b?.machineId;

/** Shown by the error interceptor; the page still shows what it has, with the id for the rest. */
function orNull<T>(request: Observable<T>): Observable<T | null> {
  return request.pipe(catchError(() => of(null)));
}

/**
 * Names and figures of the stock a version's content uses, fetched again only when the ids
 * change. `withMaterial: false` leaves the material out (pages that only show machine and
 * wheel). Call in an injection context.
 */
export function stockNamesOf(content: () => RecipeContent | null | undefined, options: { withMaterial: boolean } = { withMaterial: true }): Signal<StockNames> {
  const api = inject(StockApi);
  const ids = computed<StockIds | undefined>(
    () => {
      const c = content();
      return c ? { materialId: options.withMaterial ? c.scope.materialId : null, wheelId: c.cutting.wheelId, machineId: c.cutting.machineId } : undefined;
    },
    { equal: sameIds },
  );
  const names = rxResource({
    params: ids,
    stream: ({ params }) =>
      forkJoin({
        material: params.materialId ? orNull(api.materials.get(params.materialId)) : of(null),
        wheel: orNull(api.wheels.get(params.wheelId)),
        machine: orNull(api.machines.get(params.machineId)),
      }),
  });
  return latestValue(names, NO_STOCK_NAMES);
}
