/** The lab's single settings row (id 1). */
import type { Knex } from 'knex';
import { fromJsonColumn } from './json-column';

export interface LabSettingsRow {
  id: number;
  lab_name: string;
  review_interval_months: number;
  sheet_paper: 'A4' | 'Letter';
  default_units: string;
  feed_ceilings_json: unknown;
  worn_diameter_share: number | null;
  kerf_allowance_mm: number | null;
  specific_energy_json: unknown;
  power_warning_pct: number | null;
  updated_at: Date;
}

export async function findLabSettings(db: Knex): Promise<LabSettingsRow | undefined> {
  return db<LabSettingsRow>('lab_settings').where({ id: 1 }).first();
}

export function feedCeilingsOf(row: LabSettingsRow | undefined): Record<string, number> {
  return row?.feed_ceilings_json == null ? {} : fromJsonColumn<Record<string, number>>(row.feed_ceilings_json);
}

export function specificEnergiesOf(row: LabSettingsRow | undefined): Record<string, number> {
  return row?.specific_energy_json == null ? {} : fromJsonColumn<Record<string, number>>(row.specific_energy_json);
}
