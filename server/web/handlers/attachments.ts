/** Photos: uploads (multipart, read by the route's multer step) and serving the stored bytes. */
import type { Response } from 'express';
import type { attachmentFields } from '../../../shared/schemas/attachment';
import type { idParams, versionAttachmentParams, versionParams } from '../../../shared/schemas/params';
import { AppError } from '../../app-error';
import { versionScopeOf } from '../../services/operator/visibility';
import * as attachments from '../../services/recipes/attachments';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

export const upload: RouteHandler<{ params: typeof versionParams; body: typeof attachmentFields }> = async (req, res, { db }, { params: { id, n }, body }) => {
  const file = req.file;
  if (!file) throw AppError.validation([{ path: 'file', message: 'Attach a photo (JPEG, PNG or WebP) in the form field "file".' }]);
  const dto = await attachments.addAttachment(db, actorOf(req), id, n, body, { bytes: file.buffer, fileName: file.originalname, declaredType: file.mimetype });
  res.status(201).json(dto);
};

export const remove: RouteHandler<{ params: typeof versionAttachmentParams }> = async (req, res, { db }, { params: { id, n, attachmentId } }) => {
  await attachments.deleteAttachment(db, actorOf(req), id, n, attachmentId);
  res.status(204).end();
};

function send(res: Response, image: attachments.ServedImage, ifNoneMatch: string | undefined): void {
  const etag = `"${image.sha256}"`;
  res.set({
    ETag: etag,
    // The bytes behind an id never change; private because only signed-in people may see them.
    'Cache-Control': 'private, max-age=31536000, immutable',
    'X-Content-Type-Options': 'nosniff',
    // An image never runs anything, even if opened on its own.
    'Content-Security-Policy': "default-src 'none'; sandbox",
    'Content-Disposition': `inline; filename="${image.fileName.replace(/[^\x20-\x7e]/g, '_')}"`,
  });
  if (ifNoneMatch && ifNoneMatch.split(',').some((tag) => tag.trim() === etag)) {
    res.status(304).end();
    return;
  }
  res.type(image.mimeType).send(image.bytes);
}

export const image: RouteHandler<{ params: typeof idParams }> = async (req, res, { db }, { params }) => {
  send(res, await attachments.readAttachment(db, params.id, 'image', versionScopeOf(req.user?.roles)), req.headers['if-none-match']);
};

export const thumbnail: RouteHandler<{ params: typeof idParams }> = async (req, res, { db }, { params }) => {
  send(res, await attachments.readAttachment(db, params.id, 'thumbnail', versionScopeOf(req.user?.roles)), req.headers['if-none-match']);
};
