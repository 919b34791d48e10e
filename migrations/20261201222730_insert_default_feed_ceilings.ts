import type { Knex } from 'knex';

/**
 * Data: starting feed ceilings per material group, mm/s. Common practice for abrasive
 * cut-off (feed 0.05–1.0 mm/s, the low end for hard, heat-sensitive or brittle work; start
 * low and raise with experience) — not from a single source. Above the ceiling the feed
 * check warns; a lab tunes these to its own machines. Only fills a row that has none, so a
 * re-run (or a lab that changed them) keeps what is there.
 */
export const DEFAULT_FEED_CEILINGS_MM_S = {
  'plain-low-alloy-steel': 0.6,
  'hardened-tool-steel': 0.3,
  'stainless-steel': 0.4,
  'cast-iron': 0.6,
  'aluminium-magnesium': 1.0,
  copper: 0.8,
  titanium: 0.3,
  'nickel-cobalt': 0.25,
  'cemented-carbide': 0.15,
  'ceramic-glass': 0.15,
  'polymer-composite': 0.8,
  'electronics-mixed': 0.3,
} as const;

export async function up(knex: Knex): Promise<void> {
  await knex('lab_settings').whereNull('feed_ceilings_json').update({ feed_ceilings_json: JSON.stringify(DEFAULT_FEED_CEILINGS_MM_S) });
}

export async function down(knex: Knex): Promise<void> {
  await knex('lab_settings').update({ feed_ceilings_json: null });
}
