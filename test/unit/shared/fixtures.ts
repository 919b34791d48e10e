/** Small, invented stock and recipe fixtures for the shared computation and check specs. */
import { markedSpeedPair } from '../../../shared/peripheral-speed';
import type { RecipeContext } from '../../../shared/recipe-context';
import { NO_MOTION_SETTINGS, type RecipeContent } from '../../../shared/schemas/recipe';
import { NO_LAB_LIMITS, type LabLimits, type MachineRecord, type MaterialRecord, type WheelRecord } from '../../../shared/stock-types';

const stored = { archived: false, updatedAt: '2025-01-01T00:00:00Z', notes: '' };

/** A wheel record; its speed in rpm follows from the (possibly overridden) m/s and diameter, as the server stores it. */
export function wheel(over: Partial<WheelRecord> = {}): WheelRecord {
  const w: Omit<WheelRecord, 'maxSpeedRpm'> & Partial<WheelRecord> = {
    id: 1,
    name: 'Alumina 250',
    kind: 'bonded',
    specification: 'A60K5BF',
    diameterMm: 250,
    thicknessMm: 1.5,
    boreMm: 32,
    maxSpeedMarkedIn: 'm/s',
    maxSpeedMs: 80,
    dryAllowed: false,
    restrictions: [],
    minUsableDiameterMm: null,
    ...stored,
    ...over,
  };
  return { maxSpeedRpm: markedSpeedPair(w.diameterMm, 'm/s', w.maxSpeedMs).maxSpeedRpm, ...w };
}

export function rimWheel(over: Partial<WheelRecord> = {}): WheelRecord {
  return wheel({
    id: 2,
    name: 'Diamond rim 150',
    kind: 'rim',
    specification: 'D126M',
    diameterMm: 150,
    thicknessMm: 0.5,
    boreMm: 12.7,
    maxSpeedMs: 40,
    ...over,
  });
}

export function machine(over: Partial<MachineRecord> = {}): MachineRecord {
  return {
    id: 1,
    name: 'Bench saw',
    machineClass: 'bench-abrasive',
    wheelDiameterMinMm: 200,
    wheelDiameterMaxMm: 250,
    flangeDiameterMm: 80,
    rpmMin: 1000,
    rpmMax: 4000,
    feedMinMmS: 0.02,
    feedMaxMmS: 2,
    feedControl: 'automatic',
    feedDirection: 'wheel-down',
    spindleLimitRpm: null,
    spindleLimitSetBy: '',
    motorPowerKw: null,
    cutMotions: ['straight-plunge', 'pulsed-plunge', 'rocking'],
    clampingMethods: ['vise-backstop', 'v-block'],
    ...stored,
    ...over,
  };
}

export function precisionMachine(over: Partial<MachineRecord> = {}): MachineRecord {
  return machine({
    id: 2,
    name: 'Precision saw',
    machineClass: 'precision',
    wheelDiameterMinMm: 75,
    wheelDiameterMaxMm: 200,
    flangeDiameterMm: 40,
    rpmMin: 100,
    rpmMax: 5000,
    feedMinMmS: 0.005,
    feedMaxMmS: 0.5,
    cutMotions: ['straight-plunge', 'turning-specimen'],
    clampingMethods: ['adhesive-wax-mount', 'small-part-gripper'],
    ...over,
  });
}

export function material(over: Partial<MaterialRecord> = {}): MaterialRecord {
  return {
    id: 1,
    name: 'Q&T alloy steel bar',
    designation: 'EN 1.7225',
    group: 'plain-low-alloy-steel',
    condition: 'quenched and tempered',
    hardness: { value: 30, scale: 'HRC' },
    coated: false,
    coatingHardness: null,
    caseHardened: false,
    caseDepthMm: null,
    heatSensitive: false,
    hazardousDust: false,
    combustibleFines: false,
    ...stored,
    ...over,
  };
}

/** A recipe with every check passing on the bench saw with the alumina wheel. */
export function content(
  over: {
    scope?: Partial<RecipeContent['scope']>;
    cutting?: Partial<RecipeContent['cutting']>;
    clamping?: Partial<RecipeContent['clamping']>;
    coolant?: Partial<RecipeContent['coolant']>;
  } = {},
): RecipeContent {
  return {
    scope: {
      materialId: 1,
      group: 'plain-low-alloy-steel',
      hardness: null,
      shape: 'round-bar',
      sizeMinMm: 10,
      sizeMaxMm: 40,
      widthMm: null,
      wallMm: null,
      orientation: 'transverse',
      orientationNote: '',
      ...over.scope,
    },
    cutting: {
      machineId: 1,
      wheelId: 1,
      wheelRpm: 3000,
      feedMmS: 0.5,
      entryFeedMmS: null,
      entryLengthMm: null,
      cutMotion: 'straight-plunge',
      passes: null,
      ...NO_MOTION_SETTINGS,
      ...over.cutting,
    },
    clamping: {
      method: 'vise-backstop',
      placement: 'both sides of the cut',
      bothSides: true,
      softInserts: false,
      supportBlocks: false,
      orientationRule: '',
      wheelPath: null,
      ...over.clamping,
    },
    coolant: { type: 'water-soluble', concentrationPct: 4, flowLMin: 10, ...over.coolant },
    instructionsMd: '',
    acceptanceMd: '',
    cautionsMd: '',
    changeReason: '',
  };
}

/** The lab's limits: Kerfbook's defaults (as the migrations leave them for the worn wheel, kerf and power share), no ceilings, no cutting energies. */
export function limits(over: Partial<LabLimits> = {}): LabLimits {
  return { ...NO_LAB_LIMITS, ...over };
}

export function ctx(over: Partial<RecipeContext> = {}): RecipeContext {
  return { material: material(), wheel: wheel(), machine: machine(), limits: limits(), selectionRows: [], ...over };
}
