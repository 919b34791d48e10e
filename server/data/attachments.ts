/** Queries on attachments. Listing never reads the bytes; serving reads one blob column. */
import type { Knex } from 'knex';
import type { RecipeStatus } from '../../shared/vocabulary';

export interface AttachmentMetaRow {
  id: number;
  version_id: number;
  role: 'setup' | 'good-face' | 'bad-face' | 'other';
  caption: string;
  file_name: string;
  mime_type: string;
  size_bytes: number;
  sha256: string;
  width: number;
  height: number;
  thumbnail_mime_type: string;
  thumbnail_sha256: string;
  created_by: number;
  created_at: Date;
}

const META_COLUMNS = [
  'id',
  'version_id',
  'role',
  'caption',
  'file_name',
  'mime_type',
  'size_bytes',
  'sha256',
  'width',
  'height',
  'thumbnail_mime_type',
  'thumbnail_sha256',
  'created_by',
  'created_at',
] as const;

/**
 * Pieces of at most 2 MB: a query carries bytes hex-escaped (twice their size), and
 * MariaDB's default max_allowed_packet is 16 MB.
 */
const PIECE_BYTES = 2 * 1024 * 1024;

export async function insertAttachment(trx: Knex.Transaction, meta: Omit<AttachmentMetaRow, 'id'>, data: Buffer, thumbnail: Buffer): Promise<number> {
  const [id] = await trx('attachments').insert({ ...meta, data: data.subarray(0, PIECE_BYTES), thumbnail });
  for (let offset = PIECE_BYTES; offset < data.length; offset += PIECE_BYTES) {
    await trx('attachments')
      .where({ id: id! })
      .update({ data: trx.raw('CONCAT(data, ?)', [data.subarray(offset, offset + PIECE_BYTES)]) });
  }
  return id!;
}

export async function listAttachmentMetaRows(db: Knex, versionIds: number[]): Promise<AttachmentMetaRow[]> {
  if (versionIds.length === 0) return [];
  return db('attachments')
    .whereIn('version_id', versionIds)
    .select(...META_COLUMNS)
    .orderBy('id');
}

export async function findAttachmentMeta(db: Knex, id: number): Promise<AttachmentMetaRow | undefined> {
  return db('attachments')
    .where({ id })
    .first(...META_COLUMNS);
}

/** The attachment's metadata with the status of the version it belongs to (who may see it follows from that). */
export async function findAttachmentWithStatus(db: Knex, id: number): Promise<(AttachmentMetaRow & { version_status: RecipeStatus }) | undefined> {
  return db('attachments')
    .join('recipe_versions', 'recipe_versions.id', 'attachments.version_id')
    .where('attachments.id', id)
    .first(...META_COLUMNS.map((c) => `attachments.${c}`), 'recipe_versions.status as version_status');
}

/** The stored bytes of the image or of its thumbnail. */
export async function readAttachmentBytes(db: Knex, id: number, which: 'data' | 'thumbnail'): Promise<Buffer | undefined> {
  const row = (await db('attachments').where({ id }).first(`${which} as bytes`)) as { bytes: Buffer } | undefined;
  return row?.bytes;
}

export async function deleteAttachmentRow(db: Knex, id: number): Promise<void> {
  await db('attachments').where({ id }).del();
}
