/**
 * Recipe checks (design 5.9): rules run on every change, in the editor and on the server.
 * Types first; the rules follow below.
 */
import type { RecipeContext } from './recipe-context';
import type { RecipeContent } from './schemas/recipe';

/** blocker: cannot be submitted; warning: the approver must acknowledge it; note: for information. */
export type CheckSeverity = 'blocker' | 'warning' | 'note';

export interface CheckResult {
  /** Stable rule id, e.g. "wheel-overspeed". */
  id: string;
  severity: CheckSeverity;
  /** Plain words, with the numbers that triggered it. */
  message: string;
  /** Why the rule exists, with its source (standard, or "common practice"). */
  reason: string;
  /** Dotted path of the field to fix in the content, e.g. "cutting.wheelRpm"; null for the whole recipe. */
  path: string | null;
}

export declare function runChecks(content: RecipeContent, ctx: RecipeContext): CheckResult[];
