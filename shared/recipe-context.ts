/** What the computations and checks need besides the recipe content itself. */
import type { LabLimits, MachineRecord, MaterialRecord, SelectionRowWheel, WheelRecord } from './stock-types';

export interface RecipeContext {
  /** The scope's material, or null for a group-wide recipe. */
  material: MaterialRecord | null;
  /** The chosen wheel and machine, or null while the author has not chosen them. */
  wheel: WheelRecord | null;
  machine: MachineRecord | null;
  limits: LabLimits;
  /** The lab's selection table with each row's wheel (selectionRowsWithWheels): the abrasive and bond checks read it. */
  selectionRows: readonly SelectionRowWheel[];
}
