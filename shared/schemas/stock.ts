/**
 * Stock: the lab's materials, wheels, machines and wheel-selection table.
 * Authors and admins edit; everyone signed in reads. Stored values are metric.
 */
import { z } from 'zod';
import {
  CLAMPING_METHODS,
  CUT_MOTIONS,
  FEED_DIRECTIONS,
  HARDNESS_SCALES,
  MACHINE_CLASSES,
  MATERIAL_GROUPS,
  SPEED_MARKINGS,
  WHEEL_KINDS,
  WHEEL_RESTRICTIONS,
} from '../vocabulary';
import { quantity, refId, requiredText, text } from './numbers';

export const materialGroup = z.enum(MATERIAL_GROUPS, { error: 'Choose a material group.' });
export const hardnessScale = z.enum(HARDNESS_SCALES, { error: `Hardness scale must be one of ${HARDNESS_SCALES.join(', ')}.` });

/** A single hardness reading with its scale, e.g. 38 HRC. */
export const hardnessValue = z.strictObject({
  value: quantity('Hardness', 'on its scale', 0, 3000),
  scale: hardnessScale,
});
export type HardnessValue = z.infer<typeof hardnessValue>;

/** A hardness window on one scale, e.g. 30–45 HRC. */
export const hardnessWindow = z
  .strictObject({
    min: quantity('Lowest hardness', 'on its scale', 0, 3000),
    max: quantity('Highest hardness', 'on its scale', 0, 3000),
    scale: hardnessScale,
  })
  .refine((w) => w.min <= w.max, { path: ['max'], message: 'Highest hardness must not be below the lowest.' });
export type HardnessWindow = z.infer<typeof hardnessWindow>;

export const materialBody = z
  .strictObject({
    name: requiredText('Name', 120),
    /** Open-standard designation where one exists, e.g. EN 1.7225 or UNS G41400. */
    designation: text('Designation', 60).default(''),
    group: materialGroup,
    /** Heat-treatment or supply condition, e.g. "quenched and tempered". */
    condition: text('Condition', 120).default(''),
    hardness: hardnessValue.nullable().default(null),
    coated: z.boolean().default(false),
    /** Hardness of the coating of a coated material (e.g. 1150 HV for a sprayed carbide layer); null when not known or not coated. */
    coatingHardness: hardnessValue.nullable().default(null),
    caseHardened: z.boolean().default(false),
    /** Case depth in mm, when case-hardened. */
    caseDepthMm: quantity('Case depth', 'mm', 0, 20).nullable().default(null),
    heatSensitive: z.boolean().default(false),
    hazardousDust: z.boolean().default(false),
    /** Fines and sludge can burn (magnesium, titanium, zirconium and their alloys): the recipe gets the fire caution. */
    combustibleFines: z.boolean().default(false),
    notes: text('Notes', 2000).default(''),
  })
  .refine((m) => !m.caseHardened || m.caseDepthMm !== null, { path: ['caseDepthMm'], message: 'Give the case depth of a case-hardened material.' })
  .refine((m) => m.coated || m.coatingHardness === null, { path: ['coatingHardness'], message: 'Only a coated material has a coating hardness.' });
export type MaterialBody = z.infer<typeof materialBody>;

export const wheelBody = z
  .strictObject({
    name: requiredText('Name', 120),
    kind: z.enum(WHEEL_KINDS, { error: 'Choose bonded or rim wheel.' }),
    /** ISO 525-style marking, e.g. "A60K5B" (abrasive, grit, grade, structure, bond); parsed by wheel-spec.ts. */
    specification: requiredText('Specification', 40),
    diameterMm: quantity('Diameter', 'mm', 10, 1000),
    thicknessMm: quantity('Thickness', 'mm', 0.05, 20),
    boreMm: quantity('Bore', 'mm', 1, 100),
    /** The unit the maximum operating speed is marked in on the wheel; the other value is computed from the diameter. */
    maxSpeedMarkedIn: z.enum(SPEED_MARKINGS, { error: 'Say whether the wheel is marked in m/s or rpm.' }).default('m/s'),
    /** Maximum operating speed (m/s): as marked, or computed from a marking in rpm. */
    maxSpeedMs: quantity('Marked maximum speed', 'm/s', 1, 200).nullable().default(null),
    /** Maximum operating speed (rpm): as marked, or computed from a marking in m/s. */
    maxSpeedRpm: quantity('Marked maximum speed', 'rpm', 1, 1_000_000).nullable().default(null),
    /** Whether the wheel's maker allows dry cutting. */
    dryAllowed: z.boolean().default(false),
    /** Restrictions of use marked on the wheel or its label. */
    restrictions: z
      .array(z.enum(WHEEL_RESTRICTIONS, { error: 'Unknown restriction mark.' }))
      .max(WHEEL_RESTRICTIONS.length)
      .refine((r) => new Set(r).size === r.length, 'Give each restriction once.')
      .default([]),
    /** Smallest diameter the wheel is used down to (mm); null = the lab's default share of the new diameter. */
    minUsableDiameterMm: quantity('Smallest usable diameter', 'mm', 10, 1000).nullable().default(null),
    notes: text('Notes', 2000).default(''),
  })
  .refine((w) => (w.maxSpeedMarkedIn === 'm/s' ? w.maxSpeedMs !== null : w.maxSpeedRpm !== null), {
    path: ['maxSpeedMs'],
    message: 'Give the maximum operating speed marked on the wheel.',
  })
  .refine((w) => w.minUsableDiameterMm === null || w.minUsableDiameterMm < w.diameterMm, {
    path: ['minUsableDiameterMm'],
    message: 'The smallest usable diameter must be below the new diameter.',
  });
export type WheelBody = z.infer<typeof wheelBody>;

export const machineBody = z
  .strictObject({
    name: requiredText('Name', 120),
    machineClass: z.enum(MACHINE_CLASSES, { error: 'Choose a machine class.' }),
    wheelDiameterMinMm: quantity('Smallest wheel', 'mm', 10, 1000),
    wheelDiameterMaxMm: quantity('Largest wheel', 'mm', 10, 1000),
    /** Diameter of the flanges that clamp the wheel (mm): limits the cutting depth. */
    flangeDiameterMm: quantity('Flange diameter', 'mm', 5, 500),
    /** Spindle speed range; a fixed-speed machine has min = max. */
    rpmMin: quantity('Lowest speed', 'rpm', 1, 30000),
    rpmMax: quantity('Highest speed', 'rpm', 1, 30000),
    feedMinMmS: quantity('Lowest feed', 'mm/s', 0, 50),
    feedMaxMmS: quantity('Highest feed', 'mm/s', 0, 50),
    feedControl: z.enum(['manual', 'automatic'], { error: 'Feed control must be manual or automatic.' }),
    /** Whether the wheel comes down into the part or the part is fed horizontally into the wheel. */
    feedDirection: z.enum(FEED_DIRECTIONS, { error: 'Choose how the wheel and the part meet.' }).default('wheel-down'),
    /** A speed limit set on the spindle (rpm) below its top speed, e.g. by a limiter or a locked setting; null = none. */
    spindleLimitRpm: quantity('Spindle speed limit', 'rpm', 1, 30000).nullable().default(null),
    /** Who set that limit, and on what record (e.g. "Maintenance, work order 2291"). */
    spindleLimitSetBy: text('Set by', 200).default(''),
    /** Rated power of the spindle motor, kW; null when not known. */
    motorPowerKw: quantity('Motor power', 'kW', 0.01, 500).nullable().default(null),
    cutMotions: z.array(z.enum(CUT_MOTIONS)).min(1, 'Choose at least one cut motion.'),
    clampingMethods: z.array(z.enum(CLAMPING_METHODS)).min(1, 'Choose at least one clamping method.'),
    notes: text('Notes', 2000).default(''),
  })
  .refine((m) => m.wheelDiameterMinMm <= m.wheelDiameterMaxMm, {
    path: ['wheelDiameterMaxMm'],
    message: 'Largest wheel must not be smaller than the smallest.',
  })
  .refine((m) => m.rpmMin <= m.rpmMax, { path: ['rpmMax'], message: 'Highest speed must not be below the lowest.' })
  .refine((m) => m.feedMinMmS <= m.feedMaxMmS, { path: ['feedMaxMmS'], message: 'Highest feed must not be below the lowest.' })
  .refine((m) => m.flangeDiameterMm < m.wheelDiameterMaxMm, { path: ['flangeDiameterMm'], message: 'Flange must be smaller than the largest wheel.' })
  .refine((m) => m.spindleLimitRpm === null || m.spindleLimitSetBy.trim() !== '', {
    path: ['spindleLimitSetBy'],
    message: 'Say who set the spindle speed limit.',
  })
  .refine((m) => m.spindleLimitRpm === null || m.spindleLimitRpm <= m.rpmMax, {
    path: ['spindleLimitRpm'],
    message: 'A speed limit must not be above the highest speed.',
  });
export type MachineBody = z.infer<typeof machineBody>;

/** One row of the lab's wheel-selection table: material group × hardness band → wheel. */
export const selectionRowBody = z.strictObject({
  group: materialGroup,
  /** Hardness band; null = any hardness in the group. */
  hardness: hardnessWindow.nullable().default(null),
  wheelId: refId('Wheel'),
  note: text('Note', 500).default(''),
});
export type SelectionRowBody = z.infer<typeof selectionRowBody>;

/** Table query shared by the stock lists: paging, sort, search, archived or not. */
export const stockListQuery = z.strictObject({
  page: z.coerce.number().int().min(0, 'Page must be 0 or more.').default(0),
  pageSize: z.coerce.number().int().min(1).max(200, 'Page size must be at most 200.').default(25),
  sort: z.string().trim().max(40).default('name'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  q: z.string().trim().max(100, 'Search text must be at most 100 characters.').optional(),
  group: materialGroup.optional(),
  archived: z.enum(['no', 'yes', 'all']).default('no'),
});
export type StockListQuery = z.infer<typeof stockListQuery>;
