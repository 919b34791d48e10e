/** Stock and recipe fixtures for API tests: valid bodies, and records made through the services. */
import type { Knex } from 'knex';
import type { MachineBody, MaterialBody, WheelBody } from '../../../shared/schemas/stock';
import { NO_MOTION_SETTINGS, type CreateRecipeBody } from '../../../shared/schemas/recipe';
import type { MachineRecord, MaterialRecord, WheelRecord } from '../../../shared/stock-types';
import type { Actor } from '../../../server/services/actor';
import { createStock } from '../../../server/services/stock/stock';
import { MACHINES, MATERIALS, WHEELS } from '../../../server/services/stock/records';

export const materialInput = (over: Partial<MaterialBody> = {}): MaterialBody => ({
  name: 'C45 carbon steel',
  designation: 'EN 1.0503',
  group: 'plain-low-alloy-steel',
  condition: 'normalised',
  hardness: { value: 200, scale: 'HBW' },
  coated: false,
  coatingHardness: null,
  caseHardened: false,
  caseDepthMm: null,
  heatSensitive: false,
  hazardousDust: false,
  combustibleFines: false,
  notes: '',
  ...over,
});

/**
 * The lab uses its 250 mm wheels down to 200 mm, so the set's recipe (Ø60 bar) is still cut
 * through by a worn wheel: (200 − 70)/2 − 5 = 60 mm. A wheel of another size gets none (the
 * lab's default share).
 */
export const wheelInput = (over: Partial<WheelBody> = {}): WheelBody => ({
  name: 'Alumina 250 hard',
  kind: 'bonded',
  specification: 'A60P5B',
  diameterMm: 250,
  thicknessMm: 1.5,
  boreMm: 32,
  maxSpeedMarkedIn: 'm/s',
  maxSpeedMs: 63,
  maxSpeedRpm: null,
  dryAllowed: false,
  restrictions: [],
  minUsableDiameterMm: over.diameterMm === undefined || over.diameterMm === 250 ? 200 : null,
  notes: '',
  ...over,
});

export const machineInput = (over: Partial<MachineBody> = {}): MachineBody => ({
  name: 'Bench saw',
  machineClass: 'bench-abrasive',
  wheelDiameterMinMm: 230,
  wheelDiameterMaxMm: 250,
  flangeDiameterMm: 70,
  rpmMin: 1000,
  rpmMax: 3000,
  feedMinMmS: 0.02,
  feedMaxMmS: 1.5,
  feedControl: 'automatic',
  feedDirection: 'wheel-down',
  spindleLimitRpm: null,
  spindleLimitSetBy: '',
  // As the demo bench saw: the recipe below then draws about half of it (the cutting power check stays quiet).
  motorPowerKw: 2.2,
  cutMotions: ['straight-plunge', 'pulsed-plunge'],
  clampingMethods: ['vise-backstop', 'top-clamp'],
  notes: '',
  ...over,
});

const SETUP: Actor = { userId: null, name: 'test set-up', clientAddress: '' };

export interface StockSet {
  material: MaterialRecord;
  wheel: WheelRecord;
  machine: MachineRecord;
}

export async function createStockSet(
  db: Knex,
  over: { material?: Partial<MaterialBody>; wheel?: Partial<WheelBody>; machine?: Partial<MachineBody> } = {},
): Promise<StockSet> {
  return {
    material: await createStock(db, SETUP, MATERIALS, materialInput(over.material)),
    wheel: await createStock(db, SETUP, WHEELS, wheelInput(over.wheel)),
    machine: await createStock(db, SETUP, MACHINES, machineInput(over.machine)),
  };
}

/** A blocker-free recipe for the set: C45 bar Ø20–60 on a 250 mm wheel (capacity 85 mm), 39.3 m/s; 36 mm³/s × 30 J/mm³ = 1.08 kW at the peak. */
export function recipeInput(
  stock: StockSet,
  over: { title?: string; scope?: object; cutting?: object; clamping?: object; coolant?: object; instructionsMd?: string } = {},
): CreateRecipeBody {
  return {
    title: over.title ?? 'C45 bar, transverse',
    content: {
      scope: {
        materialId: stock.material.id,
        group: stock.material.group,
        hardness: { min: 170, max: 230, scale: 'HV' },
        shape: 'round-bar',
        sizeMinMm: 20,
        sizeMaxMm: 60,
        widthMm: null,
        wallMm: null,
        orientation: 'transverse',
        orientationNote: '',
        ...over.scope,
      },
      cutting: {
        machineId: stock.machine.id,
        wheelId: stock.wheel.id,
        wheelRpm: 3000,
        feedMmS: 0.4,
        entryFeedMmS: null,
        entryLengthMm: null,
        cutMotion: 'straight-plunge',
        passes: null,
        ...NO_MOTION_SETTINGS,
        ...over.cutting,
      },
      clamping: {
        method: 'vise-backstop',
        placement: 'Both sides, 10 mm from the cut.',
        bothSides: true,
        softInserts: false,
        supportBlocks: false,
        orientationRule: '',
        wheelPath: null,
        ...over.clamping,
      },
      coolant: { type: 'water-soluble', concentrationPct: 4, flowLMin: 8, ...over.coolant },
      instructionsMd: over.instructionsMd ?? '1. Clamp.\n2. Cut.',
      acceptanceMd: '- No burn marks.',
      cautionsMd: '',
      changeReason: '',
    },
  } as CreateRecipeBody;
}
