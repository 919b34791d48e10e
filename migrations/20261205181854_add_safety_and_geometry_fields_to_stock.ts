import type { Knex } from 'knex';

/**
 * Wheels: the unit their maximum speed is marked in and the speed in rpm (filled by the next
 * migration, then required), restriction marks, the smallest usable diameter. Machines: how
 * wheel and part meet, a speed limit set on the spindle and who set it, the motor's power.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('wheels', (t) => {
    t.string('max_speed_marked_in', 8).notNullable().defaultTo('m/s');
    t.double('max_speed_rpm').nullable();
    t.json('restrictions').nullable();
    t.double('min_usable_diameter_mm').nullable();
  });
  await knex.schema.alterTable('machines', (t) => {
    t.string('feed_direction', 20).notNullable().defaultTo('wheel-down');
    t.double('spindle_limit_rpm').nullable();
    t.string('spindle_limit_set_by', 200).notNullable().defaultTo('');
    t.double('motor_power_kw').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('machines', (t) => {
    t.dropColumn('motor_power_kw');
    t.dropColumn('spindle_limit_set_by');
    t.dropColumn('spindle_limit_rpm');
    t.dropColumn('feed_direction');
  });
  await knex.schema.alterTable('wheels', (t) => {
    t.dropColumn('min_usable_diameter_mm');
    t.dropColumn('restrictions');
    t.dropColumn('max_speed_rpm');
    t.dropColumn('max_speed_marked_in');
  });
}
