/**
 * Loads what the checks need besides the content (shared/recipe-context.ts) from the
 * database, and refuses content that points at stock that does not exist. Archived stock
 * is allowed here; the checks warn about it.
 */
import type { Knex } from 'knex';
import type { FieldError } from '../../../shared/api-error';
import type { RecipeContext } from '../../../shared/recipe-context';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { MATERIAL_GROUP_LABELS } from '../../../shared/vocabulary';
import { AppError } from '../../app-error';
import { findStockRow } from '../../data/stock';
import { getLabLimits } from '../stock/lab-limits';
import { listSelectionRowsWithWheels } from '../stock/selection-rows';
import { toMachineRecord, toMaterialRecord, toWheelRecord, type MachineRow, type MaterialRow, type WheelRow } from '../stock/records';

/** `prefix` is where the content sits in the request body ("content"). */
export async function loadRecipeContext(db: Knex, content: RecipeContent, prefix = 'content'): Promise<RecipeContext> {
  const { materialId } = content.scope;
  const { machineId, wheelId } = content.cutting;
  const [materialRow, machineRow, wheelRow, limits, selectionRows] = await Promise.all([
    materialId === null ? Promise.resolve(undefined) : findStockRow<MaterialRow>(db, 'materials', materialId),
    findStockRow<MachineRow>(db, 'machines', machineId),
    findStockRow<WheelRow>(db, 'wheels', wheelId),
    getLabLimits(db),
    listSelectionRowsWithWheels(db),
  ]);
  const errors: FieldError[] = [];
  if (materialId !== null && !materialRow) errors.push({ path: `${prefix}.scope.materialId`, message: `There is no material with id ${materialId}.` });
  if (materialRow && materialRow.material_group !== content.scope.group) {
    errors.push({
      path: `${prefix}.scope.group`,
      message: `The group must be the material's own group (${MATERIAL_GROUP_LABELS[materialRow.material_group]}).`,
    });
  }
  if (!machineRow) errors.push({ path: `${prefix}.cutting.machineId`, message: `There is no machine with id ${machineId}.` });
  if (!wheelRow) errors.push({ path: `${prefix}.cutting.wheelId`, message: `There is no wheel with id ${wheelId}.` });
  if (errors.length > 0) throw AppError.validation(errors);
  return {
    material: materialRow ? toMaterialRecord(materialRow) : null,
    machine: toMachineRecord(machineRow!),
    wheel: toWheelRecord(wheelRow!),
    limits,
    selectionRows,
  };
}
