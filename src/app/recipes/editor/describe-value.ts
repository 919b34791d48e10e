import type { UnitPreference } from '@shared/api-types';
import { formatQuantity } from '@shared/units';
import {
  CLAMPING_METHOD_LABELS,
  COOLANT_TYPE_LABELS,
  CUT_MOTION_LABELS,
  CUT_ORIENTATION_LABELS,
  MATERIAL_GROUP_LABELS,
  SHAPE_LABELS,
  WHEEL_PATH_LABELS,
} from '@shared/vocabulary';
import type { EditorStock } from './editor-stock';
import { FIELD_INFO } from './recipe-form';

const CHOICE_LABELS: Record<string, Record<string, string>> = {
  'scope.group': MATERIAL_GROUP_LABELS,
  'scope.shape': SHAPE_LABELS,
  'scope.orientation': CUT_ORIENTATION_LABELS,
  'cutting.cutMotion': CUT_MOTION_LABELS,
  'clamping.method': CLAMPING_METHOD_LABELS,
  'clamping.wheelPath': WHEEL_PATH_LABELS,
  'coolant.type': COOLANT_TYPE_LABELS,
};

/** A value as the conflict dialog shows it: names for ids, labels for choices, units for quantities. */
export function describeValue(path: string, value: unknown, stock: EditorStock, units: UnitPreference): string {
  if (value === null || value === undefined || value === '') return '—';
  switch (path) {
    case 'scope.materialId':
      return stock.materials.find((m) => m.id === value)?.name ?? `Material #${value}`;
    case 'cutting.machineId':
      return stock.machines.find((m) => m.id === value)?.name ?? `Machine #${value}`;
    case 'cutting.wheelId':
      return stock.wheels.find((w) => w.id === value)?.name ?? `Wheel #${value}`;
    case 'scope.hardness': {
      const w = value as { min: number; max: number; scale: string };
      return `${w.min}–${w.max} ${w.scale}`;
    }
  }
  const choices = CHOICE_LABELS[path];
  if (choices) return choices[String(value)] ?? String(value);
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  const info = FIELD_INFO[path];
  if (typeof value === 'number' && info?.kind) return formatQuantity(value, info.kind, units);
  if (typeof value === 'number' && info?.unit) return `${value} ${info.unit}`;
  return String(value);
}
