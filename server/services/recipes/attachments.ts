/**
 * Photos of a recipe version: added and removed only while the version is a
 * draft; served to anyone signed in. The bytes are checked by image-intake before
 * anything is written.
 */
import type { Knex } from 'knex';
import type { AttachmentDto } from '../../../shared/recipe-types';
import type { AttachmentFields } from '../../../shared/schemas/attachment';
import { AppError } from '../../app-error';
import { deleteAttachmentRow, findAttachmentMeta, findAttachmentWithStatus, insertAttachment, readAttachmentBytes } from '../../data/attachments';
import { canSeeStatus, type VersionScope } from '../operator/visibility';
import { findVersion, type VersionWithNames } from '../../data/recipes';
import { touchEditor } from '../../data/workflow';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { acceptImage, type Upload } from './image-intake';
import { toAttachmentDto } from './recipe-dto';
import { RECIPE_STATUS_PHRASES } from '../../../shared/vocabulary';

/** Upload size cap: below MariaDB's default max_allowed_packet (16 MB) with room to spare. */
export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;

async function draftVersion(db: Knex, recipeId: number, version: number): Promise<VersionWithNames> {
  const row = await findVersion(db, recipeId, version);
  if (!row) throw AppError.notFound(`There is no version ${version} of recipe ${recipeId}.`);
  if (row.status !== 'draft') {
    throw AppError.conflict(`Version ${version} of ${row.number} is ${RECIPE_STATUS_PHRASES[row.status]}; photos can only be changed on a draft.`);
  }
  return row;
}

/** Keeps a name safe to show and to put in a header: no path, no control characters. */
function cleanFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base
    .replace(/[\u0000-\u001f\u007f"]/g, '')
    .trim()
    .slice(0, 200);
  return cleaned || 'photo';
}

export async function addAttachment(
  db: Knex,
  actor: Actor,
  recipeId: number,
  version: number,
  fields: AttachmentFields,
  upload: Upload,
): Promise<AttachmentDto> {
  if (actor.userId === null) throw new Error('Attachments are added by a signed-in person.');
  const userId = actor.userId;
  await draftVersion(db, recipeId, version);
  const fileName = cleanFileName(upload.fileName);
  const image = await acceptImage({ ...upload, fileName });
  const id = await db.transaction(async (trx) => {
    // Checked again under a lock: a submit in the meantime freezes the version.
    const locked = await trx('recipe_versions').where({ recipe_id: recipeId, version }).forUpdate().first('id', 'status');
    if (!locked || locked.status !== 'draft') throw AppError.conflict('This version is no longer a draft; photos can only be changed on a draft.');
    const now = new Date();
    const newId = await insertAttachment(
      trx,
      {
        version_id: locked.id,
        role: fields.role,
        caption: fields.caption,
        file_name: fileName,
        mime_type: image.mimeType,
        size_bytes: upload.bytes.length,
        sha256: image.sha256,
        width: image.width,
        height: image.height,
        thumbnail_mime_type: image.thumbnailMimeType,
        thumbnail_sha256: image.thumbnailSha256,
        created_by: userId,
        created_at: now,
      },
      upload.bytes,
      image.thumbnail,
    );
    // Changing a version's photos is editing it: that person may not approve it.
    await touchEditor(trx, locked.id, userId, now);
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.attachmentAdded,
        entityType: 'attachment',
        entityId: newId,
        before: null,
        after: {
          versionId: locked.id,
          role: fields.role,
          caption: fields.caption,
          fileName,
          mimeType: image.mimeType,
          sizeBytes: upload.bytes.length,
          sha256: image.sha256,
        },
      },
      now,
    );
    return newId;
  });
  const meta = await findAttachmentMeta(db, id);
  return toAttachmentDto(meta!);
}

export async function deleteAttachment(db: Knex, actor: Actor, recipeId: number, version: number, attachmentId: number): Promise<void> {
  const row = await draftVersion(db, recipeId, version);
  await db.transaction(async (trx) => {
    const locked = await trx('recipe_versions').where({ id: row.id }).forUpdate().first('status');
    if (!locked || locked.status !== 'draft') throw AppError.conflict('This version is no longer a draft; photos can only be changed on a draft.');
    const meta = await findAttachmentMeta(trx, attachmentId);
    if (!meta || meta.version_id !== row.id) throw AppError.notFound(`Version ${version} of ${row.number} has no attachment ${attachmentId}.`);
    await deleteAttachmentRow(trx, attachmentId);
    if (actor.userId !== null) await touchEditor(trx, row.id, actor.userId, new Date());
    await appendTrailEvent(trx, actor, {
      type: TRAIL_EVENTS.attachmentDeleted,
      entityType: 'attachment',
      entityId: attachmentId,
      before: { versionId: row.id, role: meta.role, caption: meta.caption, fileName: meta.file_name, sha256: meta.sha256 },
      after: null,
    });
  });
}

export interface ServedImage {
  bytes: Buffer;
  mimeType: string;
  /** Strong validator: the SHA-256 of exactly these bytes. */
  sha256: string;
  fileName: string;
}

/**
 * A photo's bytes for someone whose roles give `scope`: a photo of a version the person may
 * not see (an operator and a draft) answers exactly as an unknown id, so counting ids finds nothing.
 */
export async function readAttachment(db: Knex, id: number, which: 'image' | 'thumbnail', scope: VersionScope): Promise<ServedImage> {
  const meta = await findAttachmentWithStatus(db, id);
  if (!meta || !canSeeStatus(scope, meta.version_status)) throw AppError.notFound(`There is no attachment with id ${id}.`);
  const bytes = await readAttachmentBytes(db, id, which === 'image' ? 'data' : 'thumbnail');
  if (!bytes) throw AppError.notFound(`There is no attachment with id ${id}.`);
  return which === 'image'
    ? { bytes, mimeType: meta.mime_type, sha256: meta.sha256, fileName: meta.file_name }
    : { bytes, mimeType: meta.thumbnail_mime_type, sha256: meta.thumbnail_sha256, fileName: meta.file_name.replace(/\.[^.]*$/, '') + '-thumbnail.webp' };
}
