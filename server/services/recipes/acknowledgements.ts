/**
 * "Read and understood": when a version comes into use, every operator assigned
 * to its machine acknowledges it before printing its bench sheet or logging a cut with it. Only an approved version
 * (current, or approved for a later day) of a machine the operator runs can be
 * acknowledged; a second acknowledgement answers the first one and records nothing.
 */
import type { Knex } from 'knex';
import type { Role } from '../../../shared/roles';
import type { AcknowledgementsDto, ChangesSinceAcknowledgedDto, MyAcknowledgementDto } from '../../../shared/recipe-types';
import type { UnitPreference } from '../../../shared/api-types';
import { compareRecipeVersions } from './compare';
import { AppError } from '../../app-error';
import {
  activeOperatorsOfMachine,
  findAcknowledgement,
  findMachineName,
  insertAcknowledgement,
  isOperatorOfMachine,
  lastAcknowledgementBefore,
  listAcknowledgementRows,
  type AcknowledgementRow,
} from '../../data/acknowledgements';
import type { VersionRow, VersionWithNames } from '../../data/recipes';
import { lockRecipe, lockVersion } from '../../data/workflow';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { visibleVersion, type VersionScope } from '../operator/visibility';
import { RECIPE_STATUS_PHRASES } from '../../../shared/vocabulary';

/** The person asking, as the acknowledgement rules need them. */
export interface Viewer {
  id: number;
  roles: readonly Role[];
}

const myDto = (row: AcknowledgementRow | undefined): MyAcknowledgementDto => ({
  required: !row,
  acknowledgedAt: row ? new Date(row.acknowledged_at).toISOString() : null,
});

/** True when the person must acknowledge this version: an operator of its machine, and the version approved. */
async function concerns(db: Knex, viewer: Viewer, v: Pick<VersionRow, 'status' | 'machine_id'>): Promise<boolean> {
  return v.status === 'approved' && viewer.roles.includes('operator') && (await isOperatorOfMachine(db, viewer.id, v.machine_id));
}

/** `RecipeVersionDto.myAcknowledgement`: for an operator of the machine while the version is approved, else null. */
export async function myAcknowledgement(
  db: Knex,
  viewer: Viewer | undefined,
  v: Pick<VersionRow, 'id' | 'status' | 'machine_id'>,
): Promise<MyAcknowledgementDto | null> {
  if (!viewer || !(await concerns(db, viewer, v))) return null;
  return myDto(await findAcknowledgement(db, v.id, viewer.id));
}

/**
 * The bench sheet's gate: an operator of the machine who has not acknowledged an approved
 * version gets 409 ACKNOWLEDGE_FIRST. Everyone else prints as before.
 */
export async function requireAcknowledgedForSheet(db: Knex, viewer: Viewer, v: Pick<VersionRow, 'id' | 'status' | 'machine_id'>): Promise<void> {
  const mine = await myAcknowledgement(db, viewer, v);
  if (mine?.required) {
    throw new AppError(409, 'ACKNOWLEDGE_FIRST', [{ path: '', message: 'Acknowledge this version (read and understood) before printing its sheet.' }]);
  }
}

/**
 * The same gate for logging a cut: a cut made with a version the operator has not read and
 * understood would be traced to instructions they never confirmed.
 */
export async function requireAcknowledgedForCut(
  db: Knex,
  viewer: Viewer,
  v: Pick<VersionRow, 'id' | 'status' | 'machine_id' | 'version'> & { number: string },
): Promise<void> {
  const mine = await myAcknowledgement(db, viewer, v);
  if (mine?.required) {
    throw new AppError(409, 'ACKNOWLEDGE_FIRST', [
      { path: '', message: `Acknowledge version ${v.version} of ${v.number} (read and understood) before you log a cut with it.` },
    ]);
  }
}

function isDuplicate(err: unknown): boolean {
  return (err as { code?: string }).code === 'ER_DUP_ENTRY';
}

/** POST /api/recipes/:id/versions/:n/acknowledge */
export async function acknowledgeVersion(
  db: Knex,
  actor: Actor,
  viewer: Viewer,
  scope: VersionScope,
  recipeId: number,
  version: number,
  now = new Date(),
): Promise<MyAcknowledgementDto> {
  const userId = viewer.id;
  const seen = await visibleVersion(db, scope, recipeId, version);
  const existing = await findAcknowledgement(db, seen.id, userId);
  if (existing) return myDto(existing);

  try {
    await db.transaction(async (trx) => {
      // Lock order as everywhere: the recipe row, then the version (a withdrawal cannot slip in between).
      await lockRecipe(trx, recipeId);
      const v = (await lockVersion(trx, recipeId, version))!;
      if (v.status !== 'approved') {
        throw AppError.conflict(
          `Version ${version} of ${seen.number} is ${RECIPE_STATUS_PHRASES[v.status]}: only an approved version (in use, or approved for a later day) is acknowledged.`,
          'status',
        );
      }
      if (!viewer.roles.includes('operator') || !(await isOperatorOfMachine(trx, userId, v.machine_id))) {
        const machine = (await findMachineName(trx, v.machine_id)) ?? `machine ${v.machine_id}`;
        throw AppError.conflict(
          `Version ${version} of ${seen.number} is for ${machine}, which is not one of your machines, so it is not yours to acknowledge.`,
          'machine',
        );
      }
      const id = await insertAcknowledgement(trx, { version_id: v.id, user_id: userId, user_name: actor.name.slice(0, 100), acknowledged_at: now });
      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.versionAcknowledged,
          entityType: 'recipe_version',
          entityId: v.id,
          before: null,
          after: { acknowledgementId: id, versionId: v.id, number: seen.number, version, machineId: v.machine_id, acknowledgedAt: now.toISOString() },
        },
        now,
      );
    });
  } catch (err) {
    // The same person acknowledging twice at the same moment: the first one stands.
    if (!isDuplicate(err)) throw err;
  }
  return myDto(await findAcknowledgement(db, seen.id, userId));
}

/** GET /api/recipes/:id/versions/:n/acknowledgements: who did, and (while it is approved) who has not yet. */
export async function listAcknowledgements(db: Knex, scope: VersionScope, recipeId: number, version: number): Promise<AcknowledgementsDto> {
  const v: VersionWithNames = await visibleVersion(db, scope, recipeId, version);
  const [rows, machineName] = await Promise.all([listAcknowledgementRows(db, v.id), findMachineName(db, v.machine_id)]);
  const done = new Set(rows.map((r) => r.user_id));
  const pending = v.status === 'approved' ? (await activeOperatorsOfMachine(db, v.machine_id)).filter((o) => !done.has(o.id)) : [];
  return {
    recipeId,
    version,
    machine: { id: v.machine_id, name: machineName ?? `machine ${v.machine_id}` },
    acknowledged: rows.map((r) => ({ userId: r.user_id, displayName: r.user_name, acknowledgedAt: new Date(r.acknowledged_at).toISOString() })),
    pending: pending.map((o) => ({ userId: o.id, displayName: o.display_name })),
  };
}

/**
 * GET /api/recipes/:id/versions/:n/changes-since-acknowledged: the comparison from the
 * version of this recipe the person last acknowledged to this one, so "read and understood"
 * is about what changed. Null when they never acknowledged an earlier version.
 */
export async function changesSinceAcknowledged(
  db: Knex,
  viewer: Viewer,
  scope: VersionScope,
  recipeId: number,
  version: number,
  pref: UnitPreference,
): Promise<ChangesSinceAcknowledgedDto> {
  await visibleVersion(db, scope, recipeId, version);
  const last = await lastAcknowledgementBefore(db, recipeId, viewer.id, version);
  if (!last) return { since: null, comparison: null };
  return {
    since: { version: last.version, acknowledgedAt: new Date(last.acknowledged_at).toISOString() },
    comparison: await compareRecipeVersions(db, recipeId, last.version, version, pref, scope),
  };
}
