/**
 * The lab's settings as one record: read (the limits through the same validation the checks
 * use, so the screen shows what is in effect) and saved whole, against the revision the
 * screen started from. Every save that changes something writes one trail event with the
 * values before and after.
 */
import type { Knex } from 'knex';
import { AppError } from '../../app-error';
import { dateFormatOf, findLabSettings, updateLabSettingsRow, type LabSettingsRow } from '../../data/lab-settings';
import type { LabSettingsBody, LabSettingsDto, LabSettingsValues } from '../../../shared/schemas/lab-settings';
import type { Actor } from '../actor';
import { getLabLimits } from '../stock/lab-limits';
import { appendTrailEvent } from '../trail/append';
import { diff } from '../trail/changes';
import { TRAIL_EVENTS } from '../trail/event-types';

async function mustFindRow(db: Knex, forUpdate = false): Promise<LabSettingsRow> {
  const row = await findLabSettings(db, forUpdate);
  // The migrations insert the row; without it the install is broken, not the request.
  if (!row) throw new Error('The lab settings row (id 1) is missing: run the migrations.');
  return row;
}

async function toDto(db: Knex, row: LabSettingsRow): Promise<LabSettingsDto> {
  const limits = await getLabLimits(db);
  return {
    labName: row.lab_name,
    sheetPaper: row.sheet_paper === 'Letter' ? 'Letter' : 'A4',
    reviewIntervalMonths: row.review_interval_months,
    defaultUnits: row.default_units === 'metric+imperial' ? 'metric+imperial' : 'metric',
    dateFormat: dateFormatOf(row),
    sealIntervalHours: row.seal_interval_hours,
    ...limits,
    revision: row.revision,
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

export async function getLabSettings(db: Knex): Promise<LabSettingsDto> {
  return toDto(db, await mustFindRow(db));
}

function valuesOf(dto: LabSettingsDto): LabSettingsValues {
  const { revision: _revision, updatedAt: _updatedAt, ...values } = dto;
  return values;
}

function stale(current: LabSettingsDto): AppError {
  return new AppError(
    409,
    'CONFLICT',
    [
      {
        path: 'revision',
        message: `The lab settings were changed after you opened them (now revision ${current.revision}). Reload them and make your change again.`,
      },
    ],
    { extra: { current } },
  );
}

/** Saves every value; 409 with the current settings when the body's revision is not the stored one. */
export async function updateLabSettings(db: Knex, actor: Actor, body: LabSettingsBody): Promise<LabSettingsDto> {
  return db.transaction(async (trx) => {
    const row = await mustFindRow(trx, true);
    const before = await toDto(trx, row);
    if (row.revision !== body.revision) throw stale(before);
    const now = new Date();
    const written = await updateLabSettingsRow(
      trx,
      body.revision,
      {
        lab_name: body.labName,
        sheet_paper: body.sheetPaper,
        review_interval_months: body.reviewIntervalMonths,
        default_units: body.defaultUnits,
        date_format: body.dateFormat,
        seal_interval_hours: body.sealIntervalHours,
        feed_limits_json: JSON.stringify({ plunge: body.feedCeilings, traverseRemoval: body.traverseRemovalCeilings }),
        long_contact_mm: body.longContactMm,
        worn_diameter_share: body.wornDiameterShare,
        kerf_allowance_mm: body.kerfAllowanceMm,
        specific_energy_json: JSON.stringify(body.specificEnergyJMm3),
        power_warning_pct: body.powerWarningPct,
      },
      now,
    );
    if (!written) throw stale(await toDto(trx, await mustFindRow(trx)));
    const after = await toDto(trx, await mustFindRow(trx));
    const changes = diff(valuesOf(before), valuesOf(after));
    if (Object.keys(changes.after).length > 0) {
      await appendTrailEvent(trx, actor, { type: TRAIL_EVENTS.labSettingsChanged, entityType: 'lab_settings', entityId: 1, ...changes }, now);
    }
    return after;
  });
}
