/**
 * A signed version whose content no longer matches its signatures is reported once per
 * finding: a trail event and a mail to every admin and auditor, the first time a read,
 * comparison or print sees it (the same finding again adds nothing; a new one reports again).
 */
import type { Knex } from 'knex';
import type { VersionIntegrityDto } from '../../../shared/recipe-types';
import { fromJsonColumn } from '../../data/json-column';
import { findVersion } from '../../data/recipes';
import { listVersionEventRows } from '../../data/trail-events';
import type { Actor } from '../actor';
import { notifyIntegrityFailed } from '../mail/notifications';
import type { MailSettings } from '../mail/settings';
import { appendTrailEvent } from '../trail/append';
import { TRAIL_EVENTS } from '../trail/event-types';

export const INTEGRITY_ACTOR: Actor = { userId: null, name: 'Kerfbook integrity check', clientAddress: '' };

export interface CheckedVersion {
  recipeId: number;
  number: string;
  version: number;
  title: string;
}

export async function reportIntegrityFailure(db: Knex, mail: MailSettings, v: CheckedVersion, integrity: VersionIntegrityDto, now = new Date()): Promise<void> {
  if (integrity.ok) return;
  const row = await findVersion(db, v.recipeId, v.version);
  if (!row) return;
  const earlier = await listVersionEventRows(db, TRAIL_EVENTS.versionIntegrityFailed, [row.id]);
  const last = earlier.at(-1);
  if (last && JSON.stringify(fromJsonColumn<{ problems?: string[] }>(last.after_json)?.problems) === JSON.stringify(integrity.problems)) return;
  await db.transaction(async (trx) => {
    await notifyIntegrityFailed(trx, mail, { recipeId: v.recipeId, number: v.number, version: v.version, title: v.title }, integrity.problems, now);
    await appendTrailEvent(
      trx,
      INTEGRITY_ACTOR,
      {
        type: TRAIL_EVENTS.versionIntegrityFailed,
        entityType: 'recipe_version',
        entityId: row.id,
        after: { number: v.number, version: v.version, problems: integrity.problems },
      },
      now,
    );
  });
}
