import type { Knex } from 'knex';

/**
 * Data: starting specific cutting energies per material group, J/mm³ — order of magnitude
 * only. Cutting power = removal rate × specific energy; a lab tunes these to its own wheels
 * and machines (e.g. from the motor's power reading during a known cut).
 *
 * Sources, all from memory:
 * - the relation and the size effect: Malkin & Guo, "Grinding Technology: Theory and
 *   Applications of Machining with Abrasives", 2nd ed., 2008 — specific energy falls as the
 *   equivalent chip thickness grows, towards the chip-formation energy (about 14 J/mm³ for
 *   ferrous metals, close to the energy to melt them);
 * - the ranges in surface grinding: Kalpakjian & Schmid, "Manufacturing Engineering and
 *   Technology", table of specific energy in surface grinding — aluminium 7–27, cast iron
 *   12–60, low-carbon steel 14–68, titanium alloy 16–55, tool steel (67 HRC) 18–82 J/mm³.
 *
 * How the value was chosen within each range: abrasive cut-off removes a lot of material per
 * mm of wheel width, so it runs at the thick end of the equivalent chip thickness (about
 * 0.1–2 µm on an abrasive saw, at and above the 0.1–1 µm of conventional grinding; fine
 * grinding is far thinner), where the specific energy sits towards the bottom of the range.
 * Each value is a quarter of the way up its range, rounded to 5 J/mm³ (for the ferrous groups
 * that keeps it above their chip-formation energy). Groups with no range above are estimates, said so one by one. Precision saws with rim
 * wheels work at much thinner chips, where the true energy is higher; their removal rates
 * are so small that the power stays far below the motor's either way.
 */
export const DEFAULT_SPECIFIC_ENERGY_J_MM3 = {
  // Low-carbon steel 14–68: 14 + 54/4 = 27.5 → 30.
  'plain-low-alloy-steel': 30,
  // Tool steel 18–82: 18 + 64/4 = 34 → 35.
  'hardened-tool-steel': 35,
  // No range recalled: austenitic stainless takes more than plain steel (it work-hardens and is tougher); set with tool steel.
  'stainless-steel': 35,
  // Cast iron 12–60: 12 + 48/4 = 24 → 25.
  'cast-iron': 25,
  // Aluminium 7–27: 7 + 20/4 = 12 → 10.
  'aluminium-magnesium': 10,
  // No range recalled: ductile and soft, between aluminium and plain steel (estimate).
  copper: 20,
  // Titanium alloy 16–55: 16 + 39/4 = 25.75 → 25.
  titanium: 25,
  // No range recalled: nickel and cobalt alloys keep their strength hot and are harder to grind than tool steel (estimate).
  'nickel-cobalt': 40,
  // Diamond cutting of cemented carbide: tens of J/mm³, widely spread (estimate).
  'cemented-carbide': 60,
  // Diamond cutting of ceramics and glass: brittle fracture removes much of the material, tens of J/mm³ (estimate).
  'ceramic-glass': 30,
  // Polymers soften at low energy; the fibres of a composite take more (estimate).
  'polymer-composite': 10,
  // A mix of metal, glass fibre and polymer: taken as copper (estimate).
  'electronics-mixed': 20,
} as const;

/** Above this share of the motor's power, %, the power check warns (common practice: room for the drive's losses and the estimate's uncertainty). */
export const DEFAULT_POWER_WARNING_PCT = 80;

/** Only fills what is empty, so a re-run (or a lab that changed them) keeps what is there. */
export async function up(knex: Knex): Promise<void> {
  await knex('lab_settings')
    .whereNull('specific_energy_json')
    .update({ specific_energy_json: JSON.stringify(DEFAULT_SPECIFIC_ENERGY_J_MM3) });
  await knex('lab_settings').whereNull('power_warning_pct').update({ power_warning_pct: DEFAULT_POWER_WARNING_PCT });
}

export async function down(knex: Knex): Promise<void> {
  await knex('lab_settings').update({ specific_energy_json: null, power_warning_pct: null });
}
