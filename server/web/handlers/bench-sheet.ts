import type { Request } from 'express';
import type { versionParams } from '../../../shared/schemas/params';
import { AppError } from '../../app-error';
import { printBenchSheet } from '../../services/bench-sheet/print';
import { versionScopeOf } from '../../services/operator/visibility';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

/** A host name or address with an optional port: nothing else may reach the printed QR code. */
const HOST = /^[A-Za-z0-9.-]+(:\d{1,5})?$|^\[[0-9A-Fa-f:.]+\](:\d{1,5})?$/;

/**
 * Where the person reached Kerfbook: scheme and host of this request. Behind a proxy with
 * `trust proxy` set, Express takes them from X-Forwarded-Proto and X-Forwarded-Host.
 */
function originOf(req: Request): string {
  const host = req.host;
  if (!host || !HOST.test(host))
    throw AppError.validation([{ path: 'host', message: 'The request has no usable Host header, so the sheet cannot point at its check page.' }]);
  return `${req.protocol}://${host}`;
}

/** GET /api/recipes/:id/versions/:n/sheet.pdf */
export const sheet: RouteHandler<{ params: typeof versionParams }> = async (req, res, { db, mail }, { params: { id, n } }) => {
  const { pdf, fileName } = await printBenchSheet(db, actorOf(req), id, n, originOf(req), versionScopeOf(req.user?.roles), new Date(), mail);
  res
    .status(200)
    .set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `inline; filename="${fileName}"`,
      'Cache-Control': 'no-store',
      'Content-Length': String(pdf.length),
    })
    .end(pdf);
};
