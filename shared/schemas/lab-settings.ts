/**
 * The lab's settings: its name, paper, review interval, units and date format, and the
 * limits the recipe checks read (feed ceilings, removal ceilings, long contact, worn wheel,
 * kerf, cutting energy, power warning). The settings screen and the server check a save
 * with the same schema; each stored limit is validated again where the checks read it.
 */
import { z } from 'zod';
import { DATE_FORMATS, MACHINE_CLASSES, SHEET_PAPERS, UNIT_PREFERENCES } from '../vocabulary';
import { quantity, requiredText } from './numbers';
import { hardnessWindow, materialGroup } from './stock';

/**
 * One plunge-feed ceiling: material group × hardness band × machine class → the highest
 * feed, mm/s. A band of null covers any hardness in the group.
 */
export const feedCeiling = z.strictObject({
  group: materialGroup,
  hardness: hardnessWindow.nullable(),
  machineClass: z.enum(MACHINE_CLASSES, { error: 'Choose a machine class.' }),
  maxFeedMmS: quantity('Feed ceiling', 'mm/s', 0, 50),
});
export type FeedCeiling = z.infer<typeof feedCeiling>;

/** Traverse passes: the highest removal per millimetre of wheel width (Q'w), mm³/s per mm. */
export const traverseRemovalCeiling = quantity('Removal per mm of wheel width', 'mm³/s per mm', 0, 10000);

/** Contact length above which a straight plunge gets the long-contact note, mm. */
export const longContactLength = quantity('Long contact', 'mm', 0, 2000);

/** Share of a consumable wheel's new diameter below which it is worn out, when its record gives none (0–1, both exclusive). */
export const wornDiameterShare = quantity('Worn wheel share', 'of the new diameter', 0, 0.99);

/** Added to the wheel's thickness for the kerf loss, mm. */
export const kerfAllowance = quantity('Kerf allowance', 'mm', 0, 5, { inclusiveMin: true });

/** Specific cutting energy of a material group, J/mm³ (an order of magnitude). */
export const specificEnergy = quantity('Specific cutting energy', 'J/mm³', 0, 1000);

/** Share of the motor power above which the peak cutting power warns, %. */
export const powerWarningShare = quantity('Power warning share', '%', 0, 100);

/** Months from approval to a recipe's periodic review. */
export const reviewInterval = z
  .number({ error: 'Review interval must be a number of months.' })
  .int('Review interval must be a whole number of months.')
  .min(1, 'Review interval must be at least 1 month.')
  .max(120, 'Review interval must be at most 120 months.');

/**
 * Hours between two regular seals of the trail's chain head (a seal also follows every
 * approval). Daily by default; at most 30 days, so a truncation is never long unnoticed.
 */
export const sealInterval = z
  .number({ error: 'Seal interval must be a number of hours.' })
  .int('Seal interval must be a whole number of hours.')
  .min(1, 'Seal interval must be at least 1 hour.')
  .max(720, 'Seal interval must be at most 720 hours (30 days).');

/** A value per material group; groups left out have none. */
const perGroup = <T extends z.ZodType>(value: T) => z.partialRecord(materialGroup, value, { error: 'Choose a material group.' });

/** Every setting the lab can change, as the screen sends it and GET answers it. */
export const labSettingsValues = z.strictObject({
  labName: requiredText('Lab name', 120),
  sheetPaper: z.enum(SHEET_PAPERS, { error: 'Paper must be A4 or Letter.' }),
  reviewIntervalMonths: reviewInterval,
  defaultUnits: z.enum(UNIT_PREFERENCES, { error: 'Units must be "metric" or "metric+imperial".' }),
  dateFormat: z.enum(DATE_FORMATS, { error: 'Choose a date format.' }),
  sealIntervalHours: sealInterval,
  feedCeilings: z.array(feedCeiling, { error: 'Feed ceilings must be a list.' }).max(500, 'At most 500 feed ceilings.'),
  traverseRemovalCeilings: perGroup(traverseRemovalCeiling),
  longContactMm: longContactLength.nullable(),
  wornDiameterShare,
  kerfAllowanceMm: kerfAllowance,
  specificEnergyJMm3: perGroup(specificEnergy),
  powerWarningPct: powerWarningShare,
});
export type LabSettingsValues = z.infer<typeof labSettingsValues>;

/** A save: every value, and the revision the screen started from (a save based on an older one gets 409). */
export const labSettingsBody = labSettingsValues.extend({
  revision: z.number({ error: 'Revision must be a number.' }).int('Revision must be a whole number.').min(1, 'Revision must be at least 1.'),
});
export type LabSettingsBody = z.infer<typeof labSettingsBody>;

/** The lab's settings as GET answers them: every value, the revision to send back with a save, and when they last changed. */
export interface LabSettingsDto extends LabSettingsValues {
  revision: number;
  updatedAt: string;
}
