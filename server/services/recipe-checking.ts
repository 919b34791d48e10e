/**
 * The server's run of the recipe checks (design 5.9) on save: the shared rules, plus a
 * warning for each archived stock record the content points at (archived records stay
 * usable for existing recipes, but someone decided the lab no longer uses them).
 */
import * as rules from '../../shared/recipe-checks';
import type { CheckResult, CheckSeverity } from '../../shared/recipe-checks';
import type { RecipeContext } from '../../shared/recipe-context';
import type { RecipeContent } from '../../shared/schemas/recipe';

const ORDER: Record<CheckSeverity, number> = { blocker: 0, warning: 1, note: 2 };

function archivedWarnings(ctx: RecipeContext): CheckResult[] {
  const found: CheckResult[] = [];
  const add = (what: string, name: string, path: string) =>
    found.push({
      id: 'stock-archived',
      severity: 'warning',
      message: `The ${what} "${name}" is archived: the lab no longer offers it for new recipes.`,
      reason: 'Archived stock stays readable so existing recipes keep their meaning; check that it is still at the saw before using this recipe.',
      path,
    });
  if (ctx.material?.archived) add('material', ctx.material.name, 'scope.materialId');
  if (ctx.machine?.archived) add('machine', ctx.machine.name, 'cutting.machineId');
  if (ctx.wheel?.archived) add('wheel', ctx.wheel.name, 'cutting.wheelId');
  return found;
}

export function checkRecipe(content: RecipeContent, ctx: RecipeContext): CheckResult[] {
  // TODO(shared): recipe-checks.ts only declares runChecks until its rules land; the guard
  // goes as soon as the function is real.
  const shared = typeof rules.runChecks === 'function' ? rules.runChecks(content, ctx) : [];
  const ours = archivedWarnings(ctx).filter((w) => !shared.some((s) => s.id === w.id && s.path === w.path));
  return [...shared, ...ours].sort((a, b) => ORDER[a.severity] - ORDER[b.severity]);
}

export function worstSeverity(checks: readonly CheckResult[]): CheckSeverity | null {
  let worst: CheckSeverity | null = null;
  for (const check of checks) if (worst === null || ORDER[check.severity] < ORDER[worst]) worst = check.severity;
  return worst;
}
