import type { Knex } from 'knex';

/**
 * Data: the lab's feed limits, carried over from its per-group feed ceilings.
 *
 * Starting values (common practice, not from a single source; a lab tunes them to its own
 * machines and trial cuts): abrasive cut-off feeds 0.05–1.0 mm/s and precision-saw feeds
 * 0.005–0.2 mm/s, the low end for hard, heat-sensitive or brittle work. Abrasive saws
 * (bench, floor, large traverse) share a ceiling; precision saws get their own, far lower.
 * The steel groups are split by hardness like the selection table (harder steel, lower
 * feed; the band limits from memory, at 35 and 50 HRC and 45 HRC for tool steels).
 *
 * Carried over: a group's old ceiling becomes the abrasive saws' ceiling of its softest
 * band (or of the whole group), harder bands keep the starting ratio to it, and a precision
 * saw never gets more than the abrasive saws. The traverse ceiling (removal per millimetre
 * of wheel width, Q'w = removal rate / wheel thickness) starts at what a plunge at the old
 * ceiling removes through a 40 mm section (Q'w = feed × contact length): Kerfbook's
 * reference, to be tuned like the rest. The long-contact note starts above 60 mm of
 * contact: large sections are cut with a pulsed, rocking or stepped motion (common
 * practice); the length itself is Kerfbook's starting value, about the largest bar a lab
 * saw cuts in one plunge without trouble (from memory).
 *
 * Only fills a row that has none, so a re-run (or a lab that changed them) keeps what is there.
 */

type Band = { min: number; max: number; scale: 'HV' | 'HRC' } | null;
interface StarterBand {
  hardness: Band;
  /** Abrasive saws (bench, floor, large traverse), mm/s. */
  abrasive: number;
  /** Precision saws, mm/s. */
  precision: number;
}
interface Ceiling {
  group: string;
  hardness: Band;
  machineClass: string;
  maxFeedMmS: number;
}

export const ABRASIVE_MACHINE_CLASSES = ['bench-abrasive', 'floor-abrasive', 'large-traverse'] as const;

/** Per group, softest band first. The abrasive value of the first band equals the old default ceiling of the group. */
export const STARTER_PLUNGE_FEEDS: Record<string, StarterBand[]> = {
  'plain-low-alloy-steel': [
    { hardness: { min: 80, max: 345, scale: 'HV' }, abrasive: 0.6, precision: 0.1 },
    { hardness: { min: 35, max: 50, scale: 'HRC' }, abrasive: 0.4, precision: 0.08 },
    { hardness: { min: 50, max: 68, scale: 'HRC' }, abrasive: 0.25, precision: 0.05 },
  ],
  'hardened-tool-steel': [
    { hardness: { min: 20, max: 45, scale: 'HRC' }, abrasive: 0.3, precision: 0.08 },
    { hardness: { min: 45, max: 68, scale: 'HRC' }, abrasive: 0.2, precision: 0.05 },
  ],
  'stainless-steel': [{ hardness: null, abrasive: 0.4, precision: 0.08 }],
  'cast-iron': [{ hardness: null, abrasive: 0.6, precision: 0.1 }],
  'aluminium-magnesium': [{ hardness: null, abrasive: 1.0, precision: 0.2 }],
  copper: [{ hardness: null, abrasive: 0.8, precision: 0.15 }],
  titanium: [{ hardness: null, abrasive: 0.3, precision: 0.05 }],
  'nickel-cobalt': [{ hardness: null, abrasive: 0.25, precision: 0.04 }],
  'cemented-carbide': [{ hardness: null, abrasive: 0.15, precision: 0.05 }],
  'ceramic-glass': [{ hardness: null, abrasive: 0.15, precision: 0.05 }],
  'polymer-composite': [{ hardness: null, abrasive: 0.8, precision: 0.1 }],
  'electronics-mixed': [{ hardness: null, abrasive: 0.3, precision: 0.05 }],
};

/** Section the starting traverse ceiling is taken through, mm (Kerfbook's reference). */
export const TRAVERSE_REFERENCE_SECTION_MM = 40;
/** Contact length above which a straight plunge gets the long-contact note, mm (Kerfbook's starting value, from memory). */
export const STARTER_LONG_CONTACT_MM = 60;

const round3 = (n: number) => Math.max(0.001, Math.round(n * 1000) / 1000);

/** The feed limits for a lab whose per-group ceilings were `old` (mm/s; missing groups take the starting value). */
export function feedLimitsFrom(old: Record<string, unknown>): { plunge: Ceiling[]; traverseRemoval: Record<string, number> } {
  const plunge: Ceiling[] = [];
  const traverseRemoval: Record<string, number> = {};
  for (const [group, bands] of Object.entries(STARTER_PLUNGE_FEEDS)) {
    const given = old[group];
    const softest = bands[0]!.abrasive;
    const lab = typeof given === 'number' && Number.isFinite(given) && given > 0 ? given : softest;
    for (const band of bands) {
      const abrasive = round3((band.abrasive * lab) / softest);
      for (const machineClass of ABRASIVE_MACHINE_CLASSES) plunge.push({ group, hardness: band.hardness, machineClass, maxFeedMmS: abrasive });
      plunge.push({ group, hardness: band.hardness, machineClass: 'precision', maxFeedMmS: Math.min(band.precision, abrasive) });
    }
    traverseRemoval[group] = round3(lab * TRAVERSE_REFERENCE_SECTION_MM);
  }
  return { plunge, traverseRemoval };
}

function parsed(value: unknown): Record<string, unknown> {
  if (value === null || value === undefined) return {};
  const v: unknown = typeof value === 'string' ? JSON.parse(value) : value;
  return v !== null && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {};
}

export async function up(knex: Knex): Promise<void> {
  const rows = (await knex('lab_settings').whereNull('feed_limits_json').select('id', 'feed_ceilings_json')) as { id: number; feed_ceilings_json: unknown }[];
  for (const row of rows) {
    await knex('lab_settings')
      .where({ id: row.id })
      .update({ feed_limits_json: JSON.stringify(feedLimitsFrom(parsed(row.feed_ceilings_json))) });
  }
  await knex('lab_settings').whereNull('long_contact_mm').update({ long_contact_mm: STARTER_LONG_CONTACT_MM });
}

/** Back to one ceiling per group: the floor saw's ceiling of the softest band (or of the whole group). */
export async function down(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('lab_settings', 'feed_ceilings_json')) {
    const rows = (await knex('lab_settings').select('id', 'feed_limits_json')) as { id: number; feed_limits_json: unknown }[];
    for (const row of rows) {
      const plunge = parsed(row.feed_limits_json).plunge;
      const old: Record<string, number> = {};
      for (const c of Array.isArray(plunge) ? (plunge as Ceiling[]) : []) {
        if (c.machineClass === 'floor-abrasive' && !(c.group in old)) old[c.group] = c.maxFeedMmS;
      }
      await knex('lab_settings')
        .where({ id: row.id })
        .update({ feed_ceilings_json: Object.keys(old).length > 0 ? JSON.stringify(old) : null });
    }
  }
  await knex('lab_settings').update({ feed_limits_json: null, long_contact_mm: null });
}
