/** The lab's single settings row (id 1). */
import type { Knex } from 'knex';
import { DATE_FORMATS, type DateFormat } from '../../shared/vocabulary';
import { fromJsonColumn } from './json-column';

export interface LabSettingsRow {
  id: number;
  lab_name: string;
  review_interval_months: number;
  sheet_paper: 'A4' | 'Letter';
  default_units: string;
  /** `{ plunge: FeedCeiling[], traverseRemoval: { [group]: mm³/s per mm } }`, validated where it is read. */
  feed_limits_json: unknown;
  long_contact_mm: number | null;
  worn_diameter_share: number | null;
  kerf_allowance_mm: number | null;
  specific_energy_json: unknown;
  power_warning_pct: number | null;
  date_format: string;
  /** Hours between two regular seals of the trail's chain head. */
  seal_interval_hours: number;
  /** Raised by every save, for optimistic concurrency. */
  revision: number;
  updated_at: Date;
}

export async function findLabSettings(db: Knex, forUpdate = false): Promise<LabSettingsRow | undefined> {
  const query = db<LabSettingsRow>('lab_settings').where({ id: 1 });
  return forUpdate ? query.forUpdate().first() : query.first();
}

export type LabSettingsValuesRow = Omit<LabSettingsRow, 'id' | 'revision' | 'updated_at'>;

/**
 * Writes every value when the row is still at `revision`, and raises it. False when another
 * save came first (the row is at another revision).
 */
export async function updateLabSettingsRow(db: Knex, revision: number, values: LabSettingsValuesRow, now: Date): Promise<boolean> {
  const changed = await db('lab_settings')
    .where({ id: 1, revision })
    .update({ ...values, revision: revision + 1, updated_at: now });
  return changed === 1;
}

/** The stored feed limits as parsed JSON (not yet validated), or null when there are none. */
export function feedLimitsOf(row: LabSettingsRow | undefined): unknown {
  return row?.feed_limits_json == null ? null : fromJsonColumn<unknown>(row.feed_limits_json);
}

export function specificEnergiesOf(row: LabSettingsRow | undefined): Record<string, number> {
  return row?.specific_energy_json == null ? {} : fromJsonColumn<Record<string, number>>(row.specific_energy_json);
}

/** The lab's date format for everything Kerfbook writes for people (screens, sheets, mails); ISO 8601 when unset or unknown. */
export function dateFormatOf(row: LabSettingsRow | undefined): DateFormat {
  const value = row?.date_format ?? '';
  return (DATE_FORMATS as readonly string[]).includes(value) ? (value as DateFormat) : 'iso';
}
