/**
 * The lab's feed limits, as stored in its settings row and read by the recipe checks (the
 * settings screen that edits them comes later; each stored value is validated on read).
 */
import { z } from 'zod';
import { MACHINE_CLASSES } from '../vocabulary';
import { quantity } from './numbers';
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
