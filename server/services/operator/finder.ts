/**
 * The finder, the operator's home screen: what the operator has in hand → the current approved recipes that
 * cover it, best first, each with its reasons in plain words.
 *
 * A recipe covers the part when every criterion the operator gave holds:
 * - material: the recipe is for that material, or covers the material's whole group (no
 *   material of its own). With only a group given, any recipe of that group covers it.
 * - hardness: the value lies in the recipe's hardness window. Values on another scale are
 *   converted with shared/hardness.ts (ASTM E140, steels only); where no conversion applies
 *   the part must be measured on the window's own scale. A group-wide recipe without a
 *   window covers any hardness; a material recipe without a window covers the material's
 *   typical hardness ± TYPICAL_HARDNESS_TOLERANCE (on the material's own scale).
 * - shape, size (within the size window) and machine: equal, or inside.
 *
 * Score: the exact material counts most (100), then a group match (50), hardness (20),
 * shape, size and machine (10 each), plus up to 10 for a tight size window (a recipe
 * written for 20–30 mm fits a 25 mm part better than one for 5–300 mm).
 */
import type { Knex } from 'knex';
import { convertHardness, roundHardness } from '../../../shared/hardness';
import type { FinderHit } from '../../../shared/recipe-types';
import type { FinderQuery } from '../../../shared/schemas/operator';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { MATERIAL_GROUP_LABELS, SHAPE_LABELS, type HardnessScale, type MaterialGroup, type Shape } from '../../../shared/vocabulary';
import { AppError } from '../../app-error';
import { listFinderCandidates, type FinderCandidateRow } from '../../data/finder';
import { fromJsonColumn } from '../../data/json-column';
import { findStockRow, type StockRowBase } from '../../data/stock';
import { toRecipeSummary } from '../recipes/recipe-dto';

/**
 * A material recipe without a hardness window covers its material's typical hardness ±10 %
 * (common practice: the spread of one grade in one supply condition; our choice).
 */
export const TYPICAL_HARDNESS_TOLERANCE = 0.1;

export const FINDER_SCORES = { material: 100, group: 50, hardness: 20, shape: 10, size: 10, sizeTightness: 10, machine: 10 } as const;

interface MaterialRow extends StockRowBase {
  name: string;
  designation: string;
  material_group: MaterialGroup;
}

interface HardnessWindow {
  min: number;
  max: number;
  scale: HardnessScale;
}

const fmt = (n: number) => String(Number.isInteger(n) ? n : Math.round(n * 10) / 10);
const materialWords = (name: string, designation: string | null) => (designation ? `${name} (${designation})` : name);

/** "30 HRC (≈ 302 HV)", or the value alone when it is on the window's scale. */
function partHardnessWords(value: number, scale: HardnessScale, converted: number, to: HardnessScale): string {
  return scale === to ? `${fmt(value)} ${scale}` : `${fmt(value)} ${scale} (≈ ${roundHardness(converted)} ${to})`;
}

/** The part's hardness on the window's scale, or null when no conversion applies. */
function onScale(value: number, scale: HardnessScale, to: HardnessScale, group: MaterialGroup): number | null {
  if (scale === to) return value;
  const c = convertHardness(value, scale, to, group);
  return c.ok ? c.value : null;
}

interface Match {
  score: number;
  reasons: string[];
}

function matchHardness(
  q: FinderQuery & { hardnessValue: number; hardnessScale: HardnessScale },
  row: FinderCandidateRow,
  content: RecipeContent,
): Match | null {
  const group = content.scope.group;
  const scopeWindow = content.scope.hardness;
  let window: HardnessWindow;
  let note = '';
  if (scopeWindow) window = scopeWindow;
  else if (row.material_id === null)
    return { score: FINDER_SCORES.hardness, reasons: [`Hardness ${fmt(q.hardnessValue)} ${q.hardnessScale}: the recipe covers any hardness of the group`] };
  else if (row.material_hardness_value !== null && row.material_hardness_scale !== null) {
    const typical = row.material_hardness_value;
    window = {
      min: typical * (1 - TYPICAL_HARDNESS_TOLERANCE),
      max: typical * (1 + TYPICAL_HARDNESS_TOLERANCE),
      scale: row.material_hardness_scale as HardnessScale,
    };
    note = ` (the material's typical ${fmt(typical)} ${window.scale} ± ${TYPICAL_HARDNESS_TOLERANCE * 100} %)`;
  } else return null; // no window and no typical hardness: nothing to check the part against
  const value = onScale(q.hardnessValue, q.hardnessScale, window.scale, group);
  if (value === null || value < window.min || value > window.max) return null;
  return {
    score: FINDER_SCORES.hardness,
    reasons: [
      `Hardness ${partHardnessWords(q.hardnessValue, q.hardnessScale, value, window.scale)} within ${fmt(window.min)}–${fmt(window.max)} ${window.scale}${note}`,
    ],
  };
}

function match(q: FinderQuery, partGroup: MaterialGroup | undefined, row: FinderCandidateRow): Match | null {
  const content = fromJsonColumn<RecipeContent>(row.content_json);
  const out: Match = { score: 0, reasons: [] };
  const add = (m: Match | null) => {
    if (!m) return false;
    out.score += m.score;
    out.reasons.push(...m.reasons);
    return true;
  };

  if (q.materialId !== undefined) {
    if (row.material_id === q.materialId)
      add({ score: FINDER_SCORES.material, reasons: [`Material: ${materialWords(row.material_name ?? '', row.material_designation)}`] });
    else if (row.material_id === null && row.material_group === partGroup)
      add({ score: FINDER_SCORES.group, reasons: [`Group: ${MATERIAL_GROUP_LABELS[partGroup]} (the recipe covers the whole group)`] });
    else return null;
  } else if (partGroup !== undefined) {
    if (row.material_group !== partGroup) return null;
    add({
      score: FINDER_SCORES.group,
      reasons: [
        `Group: ${MATERIAL_GROUP_LABELS[partGroup]}${row.material_name ? ` (written for ${materialWords(row.material_name, row.material_designation)})` : ''}`,
      ],
    });
  }

  if (q.hardnessValue !== undefined && q.hardnessScale !== undefined) {
    if (!add(matchHardness({ ...q, hardnessValue: q.hardnessValue, hardnessScale: q.hardnessScale }, row, content))) return null;
  }

  if (q.shape !== undefined) {
    if (row.shape !== q.shape) return null;
    add({ score: FINDER_SCORES.shape, reasons: [`Shape: ${SHAPE_LABELS[q.shape as Shape].toLowerCase()}`] });
  }

  if (q.sizeMm !== undefined) {
    if (q.sizeMm < row.size_min_mm || q.sizeMm > row.size_max_mm) return null;
    const width = row.size_max_mm - row.size_min_mm;
    // 10 points for a window 10 mm wide or less, falling off as the window widens.
    const tightness = FINDER_SCORES.sizeTightness * Math.min(1, 10 / Math.max(width, 1));
    add({
      score: FINDER_SCORES.size + Math.round(tightness * 10) / 10,
      reasons: [`Size ${fmt(q.sizeMm)} mm within ${fmt(row.size_min_mm)}–${fmt(row.size_max_mm)} mm`],
    });
  }

  if (q.machineId !== undefined) {
    if (row.machine_id !== q.machineId) return null;
    add({ score: FINDER_SCORES.machine, reasons: [`On ${row.machine_name}`] });
  }
  return out;
}

export async function findRecipes(db: Knex, q: FinderQuery): Promise<FinderHit[]> {
  if (q.hardnessValue !== undefined && q.hardnessScale === undefined)
    throw AppError.validation([{ path: 'hardnessScale', message: 'Give the scale the hardness was measured on.' }]);
  if (q.hardnessScale !== undefined && q.hardnessValue === undefined)
    throw AppError.validation([{ path: 'hardnessValue', message: 'Give the hardness value for the scale.' }]);

  let partGroup: MaterialGroup | undefined = q.group;
  if (q.materialId !== undefined) {
    const material = await findStockRow<MaterialRow>(db, 'materials', q.materialId);
    if (!material) throw AppError.validation([{ path: 'materialId', message: `There is no material with id ${q.materialId}.` }]);
    if (q.group !== undefined && q.group !== material.material_group)
      throw AppError.validation([
        {
          path: 'group',
          message: `${material.name} is in the group ${MATERIAL_GROUP_LABELS[material.material_group]}, not ${MATERIAL_GROUP_LABELS[q.group]}.`,
        },
      ]);
    partGroup = material.material_group;
  }

  const candidates = await listFinderCandidates(db, { groups: partGroup ? [partGroup] : undefined });
  const hits: FinderHit[] = [];
  for (const row of candidates) {
    const m = match(q, partGroup, row);
    if (m) hits.push({ summary: toRecipeSummary(row), score: Math.round(m.score * 10) / 10, reasons: m.reasons });
  }
  // Best first; equal scores by recipe number (id order is number order).
  return hits.sort((a, b) => b.score - a.score || a.summary.id - b.summary.id);
}
