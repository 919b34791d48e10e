import type { RecipeSummary, RecipeVersionDto } from '@shared/recipe-types';
import { NO_MOTION_SETTINGS } from '@shared/schemas/recipe';
import { type LabLimits, type MachineRecord, type MaterialRecord, NO_LAB_LIMITS, type WheelRecord } from '@shared/stock-types';

/** Invented stock and recipes for the Stock, Library and Recipe specs; override what the test is about. */

export function aMaterial(overrides: Partial<MaterialRecord> = {}): MaterialRecord {
  return {
    id: 5,
    name: 'Tempered chromium-molybdenum steel',
    designation: 'EN 1.7225',
    group: 'plain-low-alloy-steel',
    condition: 'quenched and tempered',
    hardness: { value: 32, scale: 'HRC' },
    coated: false,
    coatingHardness: null,
    caseHardened: false,
    caseDepthMm: null,
    heatSensitive: false,
    hazardousDust: false,
    combustibleFines: false,
    notes: '',
    archived: false,
    updatedAt: '2026-10-02T09:00:00.000Z',
    ...overrides,
  };
}

export function aWheel(overrides: Partial<WheelRecord> = {}): WheelRecord {
  return {
    id: 2,
    name: 'Alumina 250 general steel',
    kind: 'bonded',
    specification: 'A60K5B',
    diameterMm: 250,
    thicknessMm: 1.5,
    boreMm: 32,
    maxSpeedMarkedIn: 'm/s',
    maxSpeedMs: 80,
    // 60 000 · 80 / (π · 250), computed by hand.
    maxSpeedRpm: 6111.55,
    dryAllowed: false,
    restrictions: [],
    minUsableDiameterMm: null,
    notes: '',
    archived: false,
    updatedAt: '2026-10-02T09:00:00.000Z',
    ...overrides,
  };
}

export function aMachine(overrides: Partial<MachineRecord> = {}): MachineRecord {
  return {
    id: 1,
    name: 'Bench saw B2',
    machineClass: 'bench-abrasive',
    wheelDiameterMinMm: 200,
    wheelDiameterMaxMm: 250,
    flangeDiameterMm: 80,
    rpmMin: 1500,
    rpmMax: 3500,
    feedMinMmS: 0.05,
    feedMaxMmS: 2,
    feedControl: 'automatic',
    feedDirection: 'wheel-down',
    spindleLimitRpm: null,
    spindleLimitSetBy: '',
    motorPowerKw: null,
    cutMotions: ['straight-plunge', 'pulsed-plunge'],
    clampingMethods: ['vise-backstop', 'top-clamp'],
    notes: '',
    archived: false,
    updatedAt: '2026-10-02T09:00:00.000Z',
    ...overrides,
  };
}

/** The lab's limits with no ceilings or cutting energies: wheels used down to 70 %, a 0.2 mm kerf allowance, power warned above 80 %. */
export function aLabLimits(overrides: Partial<LabLimits> = {}): LabLimits {
  return { ...NO_LAB_LIMITS, ...overrides };
}

export function aRecipeSummary(overrides: Partial<RecipeSummary> = {}): RecipeSummary {
  return {
    id: 3,
    number: 'KB-0003',
    title: 'Tempered bar, transverse',
    version: 2,
    status: 'approved',
    group: 'plain-low-alloy-steel',
    materialName: 'Tempered chromium-molybdenum steel',
    shape: 'round-bar',
    sizeMinMm: 10,
    sizeMaxMm: 40,
    machineName: 'Bench saw B2',
    wheelName: 'Alumina 250 general steel',
    worstCheck: null,
    updatedAt: '2026-11-20T10:00:00.000Z',
    reviewDueOn: null,
    reviewOverdue: false,
    ...overrides,
  };
}

export function aRecipeVersion(overrides: Partial<RecipeVersionDto> = {}): RecipeVersionDto {
  return {
    recipeId: 3,
    number: 'KB-0003',
    title: 'Tempered bar, transverse',
    version: 1,
    status: 'approved',
    revision: 4,
    content: {
      scope: {
        materialId: 5,
        group: 'plain-low-alloy-steel',
        hardness: null,
        shape: 'round-bar',
        sizeMinMm: 10,
        sizeMaxMm: 40,
        widthMm: null,
        wallMm: null,
        orientation: 'transverse',
        orientationNote: '',
      },
      cutting: {
        machineId: 1,
        wheelId: 2,
        wheelRpm: 3000,
        feedMmS: 0.5,
        entryFeedMmS: null,
        entryLengthMm: null,
        cutMotion: 'straight-plunge',
        passes: null,
        ...NO_MOTION_SETTINGS,
      },
      clamping: {
        method: 'vise-backstop',
        placement: 'Both sides of the cut',
        bothSides: true,
        softInserts: false,
        supportBlocks: false,
        orientationRule: '',
        wheelPath: null,
      },
      coolant: { type: 'water-soluble', concentrationPct: 5, flowLMin: 8 },
      instructionsMd: '1. Clamp the bar.\n2. Start the coolant.',
      acceptanceMd: 'No blue or brown tint on the face.',
      cautionsMd: '',
      changeReason: '',
    },
    contentHash: 'a'.repeat(64),
    checks: [],
    createdBy: { id: 7, name: 'Ragna Lindqvist' },
    updatedBy: { id: 7, name: 'Ragna Lindqvist' },
    createdAt: '2026-09-01T08:00:00.000Z',
    updatedAt: '2026-09-02T08:00:00.000Z',
    attachments: [],
    ...overrides,
  };
}
