/**
 * What the lab's selection table (material group × hardness band → wheel) says about a
 * recipe's wheel: which abrasives it gives the group, and which bond grades it gives the
 * hardness. The recipe checks read it on the server and live in the editor, from the same
 * rows, so both must be built with selectionRowsWithWheels.
 */
import { hardestBandRows, overlapsBand } from './hardness-bands';
import type { HardnessWindow } from './schemas/stock';
import type { SelectionRow, SelectionRowWheel, WheelRecord } from './stock-types';
import type { MaterialGroup, WheelKind } from './vocabulary';
import { abrasiveFamily, gradeBand, parseWheelSpec, type AbrasiveFamily, type GradeBand } from './wheel-spec';

/** The table's rows with the kind and marking of their wheel; rows whose wheel is archived or unknown are left out, as the suggestion leaves them out. */
export function selectionRowsWithWheels(
  rows: readonly SelectionRow[],
  wheels: readonly Pick<WheelRecord, 'id' | 'kind' | 'specification' | 'archived'>[],
): SelectionRowWheel[] {
  const byId = new Map(wheels.filter((w) => !w.archived).map((w) => [w.id, w]));
  return rows.flatMap((row) => {
    const w = byId.get(row.wheelId);
    return w ? [{ ...row, wheel: { kind: w.kind, specification: w.specification } }] : [];
  });
}

/** Abrasive families the table gives `group` on wheels of `kind` (any hardness), in the table's order. */
export function tableAbrasives(rows: readonly SelectionRowWheel[], group: MaterialGroup, kind: WheelKind): AbrasiveFamily[] {
  const out: AbrasiveFamily[] = [];
  for (const r of rows) {
    if (r.group !== group || r.wheel.kind !== kind) continue;
    const family = abrasiveFamily(r.wheel.specification);
    if (family && !out.includes(family)) out.push(family);
  }
  return out;
}

export const GRADE_ORDER: Record<GradeBand, number> = { soft: 0, medium: 1, hard: 2 };

/** The grade band of a bonded conventional wheel's marking, or null (superabrasive, rim or unreadable). */
export function conventionalGradeBand(specification: string): GradeBand | null {
  const parsed = parseWheelSpec(specification);
  return parsed.ok && parsed.spec.type === 'conventional' ? gradeBand(parsed.spec.grade) : null;
}

/**
 * Bonded rows of the group that apply to `hardness`: a row without a band always; a banded
 * row where the band overlaps (or cannot be compared: it is not ruled out). Without a
 * hardness every bonded row of the group applies.
 */
function applyingRows(rows: readonly SelectionRowWheel[], group: MaterialGroup, hardness: HardnessWindow | null): SelectionRowWheel[] {
  return rows.filter((r) => r.group === group && (r.hardness === null || hardness === null || overlapsBand(hardness, r.hardness, group) !== false));
}

export interface TableGrades {
  /** Softest and hardest grade band the table gives, or null when it gives none. */
  softest: GradeBand;
  hardest: GradeBand;
  /** The bonded rows that gave them. */
  rows: SelectionRowWheel[];
}

/**
 * Grade bands the table gives bonded wheels of the group at the substrate's hardness and,
 * for a coated part, at the coating's (a coating above every band takes the hardest band):
 * the wheel must cut both layers, so a bond the table gives either layer is accepted.
 * Null when no bonded row with a readable conventional grade applies.
 */
export function tableGrades(
  rows: readonly SelectionRowWheel[],
  group: MaterialGroup,
  hardness: HardnessWindow | null,
  coating: HardnessWindow | null = null,
): TableGrades | null {
  const bonded = rows.filter((r) => r.wheel.kind === 'bonded' && conventionalGradeBand(r.wheel.specification) !== null);
  const picked = new Set(applyingRows(bonded, group, hardness));
  if (coating) {
    const forCoating = bonded.filter((r) => r.group === group && r.hardness !== null && overlapsBand(coating, r.hardness, group) === true);
    for (const r of forCoating.length > 0 ? forCoating : hardestBandRows(bonded, group, coating)) picked.add(r);
  }
  const list = bonded.filter((r) => picked.has(r));
  if (list.length === 0) return null;
  const bands = list.map((r) => conventionalGradeBand(r.wheel.specification)!);
  const by = (pick: (a: number, b: number) => boolean) => bands.reduce((a, b) => (pick(GRADE_ORDER[b], GRADE_ORDER[a]) ? b : a));
  return { softest: by((b, a) => b < a), hardest: by((b, a) => b > a), rows: list };
}
