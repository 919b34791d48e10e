/**
 * The bench sheet: the PDF an operator prints and keeps at the saw. Only an
 * approved version prints — the one in force, or one approved for a later day — so a
 * draft, a returned or a superseded version never reaches the bench (ISO/IEC 17025 §8.3).
 * Every print is recorded (sheet_prints) and written to the trail as `sheet.printed`. An
 * operator of the version's machine prints it only after acknowledging it.
 */
import type { Knex } from 'knex';
import sharp from 'sharp';
import type { UnitPreference } from '../../../shared/api-types';
import { AppError } from '../../app-error';
import { listAttachmentMetaRows, readAttachmentBytes } from '../../data/attachments';
import { dateFormatOf, findLabSettings } from '../../data/lab-settings';
import { findRecipeRow } from '../../data/recipes';
import { findCheckCodeOfVersion, insertSheetPrint } from '../../data/sheet-prints';
import { rolesOf } from '../../data/users';
import { requireAcknowledgedForSheet } from '../recipes/acknowledgements';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { assignCheckCode, formatCheckCode } from '../recipes/check-codes';
import { visibleVersion, type VersionScope } from '../operator/visibility';
import { loadRecipeContext } from '../recipes/context-loader';
import { requireActor, versionDto } from '../recipes/recipes';
import { formatDateTime } from '../../../shared/date-format';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';
import { reportIntegrityFailure } from '../recipes/integrity-alert';
import { buildSheetModel } from './content';
import { qrPng } from './qr';
import { renderSheet, type SheetPhoto } from './render';
import { RECIPE_STATUS_PHRASES } from '../../../shared/vocabulary';

export interface BenchSheet {
  pdf: Buffer;
  /** "KB-0001-v2.pdf". */
  fileName: string;
}

/** The setup photo as JPEG for pdfkit (which embeds JPEG and PNG only), or null when there is none. */
async function setupPhoto(db: Knex, versionId: number): Promise<SheetPhoto | null> {
  const meta = (await listAttachmentMetaRows(db, [versionId])).find((a) => a.role === 'setup');
  if (!meta) return null;
  const bytes = await readAttachmentBytes(db, meta.id, 'data');
  if (!bytes) return null;
  const { data, info } = await sharp(bytes)
    .rotate()
    .resize({ width: 1000, height: 1000, fit: 'inside', withoutEnlargement: true })
    .flatten({ background: '#ffffff' })
    .jpeg({ quality: 82 })
    .toBuffer({ resolveWithObject: true });
  return { jpeg: data, width: info.width, height: info.height, caption: meta.caption };
}

/**
 * Renders the sheet and records the print. `origin` is the address people reach Kerfbook
 * at (scheme and host, as the request came in), for the QR code's `<origin>/check/<CODE>`.
 */
export async function printBenchSheet(
  db: Knex,
  actor: Actor,
  recipeId: number,
  version: number,
  origin: string,
  scope: VersionScope = 'all',
  now = new Date(),
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<BenchSheet> {
  const userId = requireActor(actor);
  // 404 for an unknown recipe or version, and for one the person may not see (an operator and a draft).
  const row = await visibleVersion(db, scope, recipeId, version);
  // Independent reads at once: a sheet waits on one round trip instead of five.
  const [dto, roles, codeFound, recipe, settings] = await Promise.all([
    versionDto(db, recipeId, version),
    rolesOf(db, userId),
    findCheckCodeOfVersion(db, row.id),
    findRecipeRow(db, recipeId).then((r) => r!),
    findLabSettings(db),
  ]);
  if (dto.status !== 'approved') {
    const current = recipe.current_version_id ? (await db('recipe_versions').where({ id: recipe.current_version_id }).first('version'))?.version : null;
    const instead = current ? ` Print version ${current}, the current one.` : '';
    throw AppError.conflict(
      `Version ${version} of ${dto.number} is ${RECIPE_STATUS_PHRASES[dto.status]}: only approved versions (current or approved for a later day) print as bench sheets.${instead}`,
      'status',
    );
  }

  // Content that no longer matches its signatures never reaches the bench.
  if (dto.integrity && !dto.integrity.ok) {
    await reportIntegrityFailure(db, mail, dto, dto.integrity);
    throw new AppError(409, 'INTEGRITY_FAILED', [
      {
        path: '',
        message: `Version ${version} of ${dto.number} fails its integrity check: its content no longer matches its signatures, so its bench sheet does not print. Admins and auditors have been told.`,
      },
    ]);
  }

  // An operator of the machine reads and acknowledges a version before its sheet reaches the bench.
  await requireAcknowledgedForSheet(db, { id: userId, roles }, row);

  let code = codeFound;
  if (!code) {
    // Approved before codes existed and missed by the backfill: give it one now.
    await assignCheckCode(db, row.id);
    code = (await findCheckCodeOfVersion(db, row.id))!;
  }
  const units: UnitPreference = settings?.default_units === 'metric+imperial' ? 'metric+imperial' : 'metric';
  const paper = settings?.sheet_paper === 'Letter' ? 'Letter' : 'A4';
  const dateFormat = dateFormatOf(settings);
  const checkUrl = `${origin}/check/${code}`;

  const [context, photo, qr] = await Promise.all([loadRecipeContext(db, dto.content), setupPhoto(db, row.id), qrPng(checkUrl)]);
  const model = buildSheetModel({
    version: dto,
    context,
    labName: settings?.lab_name || 'Kerfbook',
    units,
    dateFormat,
    checkCode: formatCheckCode(code),
    checkUrl,
    current: recipe.current_version_id === row.id,
  });
  const pdf = await renderSheet({
    model,
    paper,
    qrPng: qr,
    photo,
    footer: `Printed ${formatDateTime(now, dateFormat)} by ${actor.name} — check the code before use`,
  });

  await db.transaction(async (trx) => {
    const printId = await insertSheetPrint(trx, { version_id: row.id, user_id: userId, printed_at: now, client_address: actor.clientAddress.slice(0, 45) });
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.sheetPrinted,
        entityType: 'recipe_version',
        entityId: row.id,
        after: { printId, number: dto.number, version: dto.version, checkCode: code, paper, current: recipe.current_version_id === row.id },
      },
      now,
    );
  });
  return { pdf, fileName: `${dto.number}-v${dto.version}.pdf` };
}
