/**
 * The lab's machines that can turn one of its wheels above the speed marked on it (their top
 * speed, or the limit set on their spindle): the Stock lists show it on both records, so it
 * is seen before the wheel is mounted, not only when a recipe names the pair.
 */
import type { Knex } from 'knex';
import { speedMismatches, type SpeedMismatch } from '../../../shared/spindle-speed';
import { listInUseStockRows } from '../../data/stock';
import { toMachineRecord, toWheelRecord, type MachineRow, type WheelRow } from './records';

/** Every pair of in-use machine and wheel (that the machine takes) where the machine can over-speed the wheel. */
export async function listSpeedMismatches(db: Knex): Promise<SpeedMismatch[]> {
  const machines = (await listInUseStockRows<MachineRow>(db, 'machines')).map(toMachineRecord);
  const wheels = (await listInUseStockRows<WheelRow>(db, 'wheels')).map(toWheelRecord);
  return speedMismatches(machines, wheels);
}
