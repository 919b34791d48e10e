/**
 * The three stock kinds (materials, wheels, machines): how a row becomes the record the
 * API returns, how a validated body becomes a row, which columns may sort a list and which
 * are searched. The stock service is written once against these descriptors.
 */
import type { HardnessScale, MaterialGroup } from '../../../shared/vocabulary';
import type { MachineBody, MaterialBody, WheelBody } from '../../../shared/schemas/stock';
import { markedSpeedPair } from '../../../shared/peripheral-speed';
import type { MachineRecord, MaterialRecord, WheelRecord } from '../../../shared/stock-types';
import { fromJsonColumn } from '../../data/json-column';
import type { StockRowBase, StockTable } from '../../data/stock';
import { TRAIL_EVENTS, type TrailEntityType, type TrailEventType } from '../trail/event-types';

export interface MaterialRow extends StockRowBase {
  name: string;
  designation: string;
  material_group: MaterialGroup;
  condition: string;
  hardness_value: number | null;
  hardness_scale: HardnessScale | null;
  coated: number | boolean;
  coating_hardness_value: number | null;
  coating_hardness_scale: HardnessScale | null;
  case_hardened: number | boolean;
  case_depth_mm: number | null;
  heat_sensitive: number | boolean;
  hazardous_dust: number | boolean;
  combustible_fines: number | boolean;
  notes: string;
}

export interface WheelRow extends StockRowBase {
  name: string;
  kind: WheelBody['kind'];
  specification: string;
  diameter_mm: number;
  thickness_mm: number;
  bore_mm: number;
  max_speed_ms: number;
  max_speed_rpm: number;
  max_speed_marked_in: WheelBody['maxSpeedMarkedIn'];
  dry_allowed: number | boolean;
  restrictions: unknown;
  min_usable_diameter_mm: number | null;
  notes: string;
}

export interface MachineRow extends StockRowBase {
  name: string;
  machine_class: MachineBody['machineClass'];
  wheel_diameter_min_mm: number;
  wheel_diameter_max_mm: number;
  flange_diameter_mm: number;
  rpm_min: number;
  rpm_max: number;
  feed_min_mm_s: number;
  feed_max_mm_s: number;
  feed_control: MachineBody['feedControl'];
  feed_direction: MachineBody['feedDirection'];
  spindle_limit_rpm: number | null;
  spindle_limit_set_by: string;
  motor_power_kw: number | null;
  cut_motions: unknown;
  clamping_methods: unknown;
  notes: string;
}

function stored(row: StockRowBase) {
  return { id: row.id, archived: Boolean(row.archived), updatedAt: new Date(row.updated_at).toISOString() };
}

export function toMaterialRecord(row: MaterialRow): MaterialRecord {
  return {
    name: row.name,
    designation: row.designation,
    group: row.material_group,
    condition: row.condition,
    hardness: row.hardness_value === null || row.hardness_scale === null ? null : { value: row.hardness_value, scale: row.hardness_scale },
    coated: Boolean(row.coated),
    coatingHardness:
      row.coating_hardness_value === null || row.coating_hardness_scale === null
        ? null
        : { value: row.coating_hardness_value, scale: row.coating_hardness_scale },
    caseHardened: Boolean(row.case_hardened),
    caseDepthMm: row.case_depth_mm,
    heatSensitive: Boolean(row.heat_sensitive),
    hazardousDust: Boolean(row.hazardous_dust),
    combustibleFines: Boolean(row.combustible_fines),
    notes: row.notes,
    ...stored(row),
  };
}

export function materialValues(body: MaterialBody): Record<string, unknown> {
  return {
    name: body.name,
    designation: body.designation,
    material_group: body.group,
    condition: body.condition,
    hardness_value: body.hardness?.value ?? null,
    hardness_scale: body.hardness?.scale ?? null,
    coated: body.coated,
    coating_hardness_value: body.coatingHardness?.value ?? null,
    coating_hardness_scale: body.coatingHardness?.scale ?? null,
    case_hardened: body.caseHardened,
    case_depth_mm: body.caseDepthMm,
    heat_sensitive: body.heatSensitive,
    hazardous_dust: body.hazardousDust,
    combustible_fines: body.combustibleFines,
    notes: body.notes,
  };
}

export function toWheelRecord(row: WheelRow): WheelRecord {
  return {
    name: row.name,
    kind: row.kind,
    specification: row.specification,
    diameterMm: row.diameter_mm,
    thicknessMm: row.thickness_mm,
    boreMm: row.bore_mm,
    maxSpeedMarkedIn: row.max_speed_marked_in,
    maxSpeedMs: row.max_speed_ms,
    maxSpeedRpm: row.max_speed_rpm,
    dryAllowed: Boolean(row.dry_allowed),
    restrictions: fromJsonColumn<WheelRecord['restrictions']>(row.restrictions),
    minUsableDiameterMm: row.min_usable_diameter_mm,
    notes: row.notes,
    ...stored(row),
  };
}

export function wheelValues(body: WheelBody): Record<string, unknown> {
  // The schema guarantees the marked figure; the other one follows from the diameter.
  const marked = body.maxSpeedMarkedIn === 'm/s' ? body.maxSpeedMs! : body.maxSpeedRpm!;
  const speed = markedSpeedPair(body.diameterMm, body.maxSpeedMarkedIn, marked);
  return {
    name: body.name,
    kind: body.kind,
    specification: body.specification,
    diameter_mm: body.diameterMm,
    thickness_mm: body.thicknessMm,
    bore_mm: body.boreMm,
    max_speed_marked_in: body.maxSpeedMarkedIn,
    max_speed_ms: speed.maxSpeedMs,
    max_speed_rpm: speed.maxSpeedRpm,
    dry_allowed: body.dryAllowed,
    restrictions: JSON.stringify(body.restrictions),
    min_usable_diameter_mm: body.minUsableDiameterMm,
    notes: body.notes,
  };
}

export function toMachineRecord(row: MachineRow): MachineRecord {
  return {
    name: row.name,
    machineClass: row.machine_class,
    wheelDiameterMinMm: row.wheel_diameter_min_mm,
    wheelDiameterMaxMm: row.wheel_diameter_max_mm,
    flangeDiameterMm: row.flange_diameter_mm,
    rpmMin: row.rpm_min,
    rpmMax: row.rpm_max,
    feedMinMmS: row.feed_min_mm_s,
    feedMaxMmS: row.feed_max_mm_s,
    feedControl: row.feed_control,
    feedDirection: row.feed_direction,
    spindleLimitRpm: row.spindle_limit_rpm,
    spindleLimitSetBy: row.spindle_limit_set_by,
    motorPowerKw: row.motor_power_kw,
    cutMotions: fromJsonColumn<MachineRecord['cutMotions']>(row.cut_motions),
    clampingMethods: fromJsonColumn<MachineRecord['clampingMethods']>(row.clamping_methods),
    notes: row.notes,
    ...stored(row),
  };
}

export function machineValues(body: MachineBody): Record<string, unknown> {
  return {
    name: body.name,
    machine_class: body.machineClass,
    wheel_diameter_min_mm: body.wheelDiameterMinMm,
    wheel_diameter_max_mm: body.wheelDiameterMaxMm,
    flange_diameter_mm: body.flangeDiameterMm,
    rpm_min: body.rpmMin,
    rpm_max: body.rpmMax,
    feed_min_mm_s: body.feedMinMmS,
    feed_max_mm_s: body.feedMaxMmS,
    feed_control: body.feedControl,
    feed_direction: body.feedDirection,
    spindle_limit_rpm: body.spindleLimitRpm,
    spindle_limit_set_by: body.spindleLimitSetBy,
    motor_power_kw: body.motorPowerKw,
    cut_motions: JSON.stringify(body.cutMotions),
    clamping_methods: JSON.stringify(body.clampingMethods),
    notes: body.notes,
  };
}

export interface StockKind<Body, Rec extends { id: number; archived: boolean; updatedAt: string }> {
  table: StockTable;
  entityType: TrailEntityType;
  /** "material", for messages. */
  noun: string;
  toRecord(row: never): Rec;
  values(body: Body): Record<string, unknown>;
  /** API sort name → column; anything else is refused. */
  sortColumns: Record<string, string>;
  searchColumns: readonly string[];
  /** Whether the list takes the `group` filter. */
  groupFilter: boolean;
  events: { created: TrailEventType; updated: TrailEventType; archived: TrailEventType; unarchived: TrailEventType; deleted: TrailEventType };
}

export const MATERIALS: StockKind<MaterialBody, MaterialRecord> = {
  table: 'materials',
  entityType: 'material',
  noun: 'material',
  toRecord: toMaterialRecord as (row: never) => MaterialRecord,
  values: materialValues,
  sortColumns: { name: 'name', designation: 'designation', group: 'material_group', condition: 'condition', updatedAt: 'updated_at' },
  searchColumns: ['name', 'designation', 'condition'],
  groupFilter: true,
  events: {
    created: TRAIL_EVENTS.materialCreated,
    updated: TRAIL_EVENTS.materialUpdated,
    archived: TRAIL_EVENTS.materialArchived,
    unarchived: TRAIL_EVENTS.materialUnarchived,
    deleted: TRAIL_EVENTS.materialDeleted,
  },
};

export const WHEELS: StockKind<WheelBody, WheelRecord> = {
  table: 'wheels',
  entityType: 'wheel',
  noun: 'wheel',
  toRecord: toWheelRecord as (row: never) => WheelRecord,
  values: wheelValues,
  sortColumns: {
    name: 'name',
    kind: 'kind',
    specification: 'specification',
    diameterMm: 'diameter_mm',
    thicknessMm: 'thickness_mm',
    maxSpeedMs: 'max_speed_ms',
    updatedAt: 'updated_at',
  },
  searchColumns: ['name', 'specification'],
  groupFilter: false,
  events: {
    created: TRAIL_EVENTS.wheelCreated,
    updated: TRAIL_EVENTS.wheelUpdated,
    archived: TRAIL_EVENTS.wheelArchived,
    unarchived: TRAIL_EVENTS.wheelUnarchived,
    deleted: TRAIL_EVENTS.wheelDeleted,
  },
};

export const MACHINES: StockKind<MachineBody, MachineRecord> = {
  table: 'machines',
  entityType: 'machine',
  noun: 'machine',
  toRecord: toMachineRecord as (row: never) => MachineRecord,
  values: machineValues,
  sortColumns: { name: 'name', machineClass: 'machine_class', wheelDiameterMaxMm: 'wheel_diameter_max_mm', rpmMax: 'rpm_max', updatedAt: 'updated_at' },
  searchColumns: ['name', 'notes'],
  groupFilter: false,
  events: {
    created: TRAIL_EVENTS.machineCreated,
    updated: TRAIL_EVENTS.machineUpdated,
    archived: TRAIL_EVENTS.machineArchived,
    unarchived: TRAIL_EVENTS.machineUnarchived,
    deleted: TRAIL_EVENTS.machineDeleted,
  },
};
