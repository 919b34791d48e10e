/**
 * Cut records: an operator records each cut against the exact version used —
 * only ever the recipe's current approved version, and (for an operator of its machine)
 * only once they have acknowledged it. Anything but a good cut flags the
 * recipe for its author until an author has looked at it. From a version the lab finds
 * every cut made with it; from a specimen id, the version and parameters used.
 */
import type { Knex } from 'knex';
import type { CutRecordDto, CutTrace } from '../../../shared/recipe-types';
import type { CutRecordBody } from '../../../shared/schemas/operator';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { AppError } from '../../app-error';
import { clearCutFlag, findCut, insertCut, listCutsOfSpecimen, listCutsOfVersion, lockCut, type CutWithVersion } from '../../data/cuts';
import { fromJsonColumn } from '../../data/json-column';
import { findVersionById } from '../../data/recipes';
import { listSignatureRows, lockRecipe } from '../../data/workflow';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { CSV_BOM, csvLine } from '../csv';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';
import { notifyCutFlagged } from '../mail/notifications';
import { visibleVersion, type VersionScope } from './visibility';
import { requireActor } from '../recipes/recipes';
import { requireAcknowledgedForCut } from '../recipes/acknowledgements';
import { rolesOf } from '../../data/users';
import { toSignatureDto } from '../recipes/signatures';
import { utcDay } from '../../../shared/calendar-dates';
import { RECIPE_STATUS_PHRASES } from '../../../shared/vocabulary';

/** Cuts a specimen search answers at most (a specimen id is cut a handful of times). */
const SPECIMEN_LIMIT = 200;

const iso = (value: Date | null): string | null => (value ? new Date(value).toISOString() : null);

export function toCutRecordDto(row: CutWithVersion): CutRecordDto {
  return {
    id: row.id,
    recipeId: row.recipe_id,
    number: row.number,
    version: row.version,
    specimenId: row.specimen_id,
    partRef: row.part_ref,
    quantity: row.quantity,
    outcome: row.outcome,
    notes: row.notes,
    operatorId: row.operator_id,
    operatorName: row.operator_name,
    cutAt: new Date(row.cut_at).toISOString(),
    flagClearedAt: iso(row.flag_cleared_at),
  };
}

async function cutOrNotFound(db: Knex, id: number): Promise<CutWithVersion> {
  const row = await findCut(db, id);
  if (!row) throw AppError.notFound(`There is no cut record with id ${id}.`);
  return row;
}

/**
 * Records one cut. The recipe row is locked while the cut is written, so a version that
 * stops being current at the same moment (supersession, withdrawal) either takes the cut
 * before it changes or refuses it — never a cut on a version already out of use. A cut
 * that is not good flags the recipe, and its authors are told by mail.
 */
export async function recordCut(
  db: Knex,
  actor: Actor,
  scope: VersionScope,
  recipeId: number,
  version: number,
  body: CutRecordBody,
  now = new Date(),
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<CutRecordDto> {
  const userId = requireActor(actor);
  const target = await visibleVersion(db, scope, recipeId, version);
  const id = await db.transaction(async (trx) => {
    const recipe = await lockRecipe(trx, recipeId);
    if (!recipe) throw AppError.notFound(`There is no recipe with id ${recipeId}.`);
    if (recipe.current_version_id !== target.id) {
      const current = recipe.current_version_id === null ? undefined : await findVersionById(trx, recipe.current_version_id);
      const state = target.status === 'approved' ? 'approved but not in force yet' : RECIPE_STATUS_PHRASES[target.status];
      const where = current
        ? `Use version ${current.version}, the one in force.`
        : `${recipe.number} has no version in force, so no cuts can be recorded on it.`;
      throw AppError.conflict(`Version ${version} of ${recipe.number} is ${state}: cuts are recorded only on the current version. ${where}`);
    }
    // Like the bench sheet: an operator of the machine reads and acknowledges the version before cutting with it.
    await requireAcknowledgedForCut(trx, { id: userId, roles: await rolesOf(trx, userId) }, { ...target, number: recipe.number });
    const cutId = await insertCut(trx, {
      version_id: target.id,
      recipe_id: recipeId,
      specimen_id: body.specimenId,
      part_ref: body.partRef,
      quantity: body.quantity,
      outcome: body.outcome,
      notes: body.notes,
      operator_id: userId,
      operator_name: actor.name.slice(0, 100),
      cut_at: now,
    });
    if (body.outcome !== 'good') {
      const ref = { recipeId, number: recipe.number, version: target.version, title: target.title };
      await notifyCutFlagged(
        trx,
        mail,
        target.id,
        ref,
        { operatorName: actor.name, specimenId: body.specimenId, outcome: body.outcome, notes: body.notes },
        now,
      );
    }
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.cutRecorded,
        entityType: 'recipe_version',
        entityId: target.id,
        before: null,
        after: {
          cutId,
          versionId: target.id,
          version,
          specimenId: body.specimenId,
          partRef: body.partRef,
          quantity: body.quantity,
          outcome: body.outcome,
          notes: body.notes,
        },
      },
      now,
    );
    return cutId;
  });
  return toCutRecordDto(await cutOrNotFound(db, id));
}

/** Every cut made with a version, newest first. */
export async function listVersionCuts(db: Knex, scope: VersionScope, recipeId: number, version: number): Promise<CutRecordDto[]> {
  const target = await visibleVersion(db, scope, recipeId, version);
  return (await listCutsOfVersion(db, target.id)).map(toCutRecordDto);
}

const CSV_HEADER = [
  'cut_id',
  'recipe',
  'version',
  'specimen_id',
  'part_lot_heat',
  'quantity',
  'outcome',
  'notes',
  'operator_id',
  'operator_name',
  'cut_at_utc',
  'flag_cleared_at_utc',
];

/** The version's cuts as CSV (RFC 4180, UTF-8 with BOM, formula-like cells made inert). */
export async function versionCutsCsv(
  db: Knex,
  scope: VersionScope,
  recipeId: number,
  version: number,
  now = new Date(),
): Promise<{ fileName: string; text: string }> {
  const target = await visibleVersion(db, scope, recipeId, version);
  const cuts = (await listCutsOfVersion(db, target.id)).map(toCutRecordDto);
  const lines = cuts.map((c) =>
    csvLine([c.id, c.number, c.version, c.specimenId, c.partRef, c.quantity, c.outcome, c.notes, c.operatorId, c.operatorName, c.cutAt, c.flagClearedAt]),
  );
  const day = utcDay(now).replace(/-/g, '');
  return { fileName: `kerfbook-cuts-${target.number}-v${target.version}-${day}.csv`, text: CSV_BOM + csvLine(CSV_HEADER) + lines.join('') };
}

/** Traceability: every cut of a specimen id with the content and signatures of the version used, newest first. */
export async function traceSpecimen(db: Knex, specimenId: string): Promise<CutTrace[]> {
  const cuts = await listCutsOfSpecimen(db, specimenId, SPECIMEN_LIMIT);
  const versionIds = [...new Set(cuts.map((c) => c.version_id))];
  const [signatures, versions] = await Promise.all([
    listSignatureRows(db, versionIds),
    db('recipe_versions').whereIn('id', versionIds).select('id', 'content_json'),
  ]);
  const content = new Map((versions as { id: number; content_json: unknown }[]).map((v) => [v.id, fromJsonColumn<RecipeContent>(v.content_json)]));
  return cuts.map((c) => ({
    cut: toCutRecordDto(c),
    versionContent: content.get(c.version_id)!,
    signatures: signatures.filter((s) => s.version_id === c.version_id).map(toSignatureDto),
  }));
}

/** An author has looked at a flagged cut: the flag no longer counts on Today. */
export async function clearFlag(db: Knex, actor: Actor, cutId: number, now = new Date()): Promise<CutRecordDto> {
  const userId = requireActor(actor);
  await db.transaction(async (trx) => {
    const cut = await lockCut(trx, cutId);
    if (!cut) throw AppError.notFound(`There is no cut record with id ${cutId}.`);
    if (cut.outcome === 'good') throw AppError.conflict(`Cut ${cutId} was good, so it carries no flag to clear.`);
    if (cut.flag_cleared_at !== null)
      throw AppError.conflict(`The flag on cut ${cutId} was already cleared at ${new Date(cut.flag_cleared_at).toISOString()}.`);
    await clearCutFlag(trx, cutId, userId, now);
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.cutFlagCleared,
        entityType: 'recipe_version',
        entityId: cut.version_id,
        before: { cutId, versionId: cut.version_id, outcome: cut.outcome, flagClearedAt: null },
        after: { cutId, versionId: cut.version_id, outcome: cut.outcome, flagClearedAt: now.toISOString() },
      },
      now,
    );
  });
  return toCutRecordDto(await cutOrNotFound(db, cutId));
}
