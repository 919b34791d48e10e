import type { Signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { combineLatest, debounceTime, map, startWith } from 'rxjs';
import { type CheckResult, runChecks } from '@shared/recipe-checks';
import type { RecipeContext } from '@shared/recipe-context';
import { selectionRowsWithWheels } from '@shared/selection-table';
import { type RecipeComputed, computeRecipe } from '@shared/recipe-computations';
import type { EditorStock } from './editor-stock';
import { type RecipeForm, type RecipeFormValue, toContent } from './recipe-form';

/** The live panel recomputes this long after the last keystroke. */
export const LIVE_DEBOUNCE_MS = 250;

export interface LiveResults {
  computed: RecipeComputed;
  checks: CheckResult[];
  /** The form value they were computed for: while it differs from the current one, they lag behind. */
  at: RecipeFormValue;
}

/**
 * Computed values and checks of the form's content against the stock, LIVE_DEBOUNCE_MS after
 * the last change (null before the first). Call in an injection context.
 */
export function liveResults(form: RecipeForm, stock: Signal<EditorStock>, value: Signal<RecipeFormValue>): Signal<LiveResults | null> {
  return toSignal(
    combineLatest([
      form.valueChanges.pipe(
        startWith(null),
        debounceTime(LIVE_DEBOUNCE_MS),
        map(() => toContent(form.getRawValue().content)),
      ),
      toObservable(stock),
    ]).pipe(
      map(([content, s]) => {
        const ctx: RecipeContext = {
          material: s.materials.find((m) => m.id === content.scope.materialId) ?? null,
          machine: s.machines.find((m) => m.id === content.cutting.machineId) ?? null,
          wheel: s.wheels.find((w) => w.id === content.cutting.wheelId) ?? null,
          limits: s.limits,
          // Built as the server builds it, so the live checks say what the server will.
          selectionRows: selectionRowsWithWheels(s.rows, s.wheels),
        };
        const computed = computeRecipe(content, ctx);
        return { computed, checks: runChecks(content, ctx, computed), at: value() };
      }),
    ),
    { initialValue: null },
  );
}

/** Blockers and warnings by the section holding their field, so each section repeats its own. */
export function checksBySection(checks: readonly CheckResult[], sections: readonly { id: string; paths: readonly string[] }[]): Record<string, CheckResult[]> {
  const bySection: Record<string, CheckResult[]> = {};
  for (const check of checks) {
    if (check.severity === 'note' || !check.path) continue;
    const section = sections.find((s) => s.paths.some((p) => (p.endsWith('.') ? check.path!.startsWith(p) : check.path === p)));
    if (section) (bySection[section.id] ??= []).push(check);
  }
  return bySection;
}
