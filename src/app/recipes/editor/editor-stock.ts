import { catchError, firstValueFrom, forkJoin, of } from 'rxjs';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { type LabLimits, type MachineRecord, type MaterialRecord, NO_LAB_LIMITS, type SelectionRow, type WheelRecord } from '@shared/stock-types';
import type { RecipeEditorApi } from './recipe-editor-api';

/** The stock the editor offers and checks against, with the lab's limits. */
export interface EditorStock {
  materials: MaterialRecord[];
  machines: MachineRecord[];
  wheels: WheelRecord[];
  rows: SelectionRow[];
  limits: LabLimits;
}

export const EMPTY_STOCK: EditorStock = { materials: [], machines: [], wheels: [], rows: [], limits: NO_LAB_LIMITS };

/**
 * Everything the editor needs before it shows the form: the stock in use and, for an existing
 * recipe, its newest version. Archived stock that version still names is fetched by id, so it
 * shows by name and is checked. The selection table and the limits are optional: without them
 * there are no suggestions, no table checks and no feed limits, and the worn wheel and kerf use Kerfbook's
 * defaults.
 */
export async function loadEditorStart(api: RecipeEditorApi, recipeId: number | null): Promise<{ stock: EditorStock; latest: RecipeVersionDto | null }> {
  const [stock, versions] = await firstValueFrom(
    forkJoin([
      forkJoin({
        materials: api.materials(),
        machines: api.machines(),
        wheels: api.wheels(),
        rows: api.selectionRows().pipe(catchError(() => of<SelectionRow[]>([]))),
        limits: api.limits().pipe(catchError(() => of<LabLimits>(NO_LAB_LIMITS))),
      }),
      recipeId === null ? of(null) : api.versions(recipeId),
    ]),
  );
  const latest = versions?.[0] ?? null;
  return { stock: latest ? await withReferencedStock(api, stock, latest) : stock, latest };
}

async function withReferencedStock(api: RecipeEditorApi, stock: EditorStock, version: RecipeVersionDto): Promise<EditorStock> {
  const { scope, cutting } = version.content;
  const missing = <T extends { id: number }>(list: T[], id: number | null) => id !== null && !list.some((r) => r.id === id);
  const [material, machine, wheel] = await Promise.all([
    missing(stock.materials, scope.materialId) ? firstValueFrom(api.material(scope.materialId!)).catch(() => null) : null,
    missing(stock.machines, cutting.machineId) ? firstValueFrom(api.machine(cutting.machineId)).catch(() => null) : null,
    missing(stock.wheels, cutting.wheelId) ? firstValueFrom(api.wheel(cutting.wheelId)).catch(() => null) : null,
  ]);
  return {
    ...stock,
    materials: material ? [...stock.materials, material] : stock.materials,
    machines: machine ? [...stock.machines, machine] : stock.machines,
    wheels: wheel ? [...stock.wheels, wheel] : stock.wheels,
  };
}
