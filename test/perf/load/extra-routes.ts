/**
 * Routes that exist only in the bench server (never in the real app), mounted through
 * createApp's `extraApiRouter` so they run behind the same session, passport, CSRF and
 * error middleware and the same per-route access gate as the real routes:
 *
 * - GET  /api/bench/baseline  — signed in; one primary-key select (the caller's own user
 *   row). The yardstick the library search is measured against.
 * - GET  /api/bench/bare-pdf  — signed in; a one-page pdfkit document with the bench
 *   sheet's fonts and a few lines of text. The yardstick of the sheet PDF.
 * - POST /api/bench/capture   — admin; starts recording the SQL the app runs.
 * - GET  /api/bench/captured  — admin; stops recording and answers what was run, so the
 *   bench can EXPLAIN every query a list route makes.
 */
import express, { type Router } from 'express';
import type { Knex } from 'knex';
import PDFDocument from 'pdfkit';
import { registerSheetFonts } from '../../../server/services/bench-sheet/fonts';
import { requireAccess } from '../../../server/web/access';
import type { RouteDefinition } from '../../../server/web/route-definition';

export interface CapturedQuery {
  sql: string;
  bindings: unknown[];
}

/** Records the SQL knex sends while switched on; off (one boolean test per query) otherwise. */
export function queryRecorder(db: Knex) {
  let on = false;
  let queries: CapturedQuery[] = [];
  db.on('query', (q: { sql: string; bindings?: unknown[] }) => {
    if (on) queries.push({ sql: q.sql, bindings: q.bindings ?? [] });
  });
  return {
    start(): void {
      queries = [];
      on = true;
    },
    stop(): CapturedQuery[] {
      on = false;
      const taken = queries;
      queries = [];
      return taken;
    },
  };
}

/** The access gate of a route-table entry, reused so the bench routes pay what real ones pay. */
function gate(access: RouteDefinition['access']) {
  return requireAccess({ access });
}

/** A one-page sheet-like document: the sheet's fonts, a heading and a few lines. */
export function barePdf(): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'A4', margins: { top: 40, bottom: 40, left: 40, right: 40 }, lang: 'en' });
    registerSheetFonts(doc);
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.font('bold').fontSize(14).text('Bench baseline page');
    doc.font('regular').fontSize(9);
    for (let i = 1; i <= 6; i++) doc.text(`${i}. Clamp both sides, wheel Ø 250 mm at 3000 rpm, feed 0.5 mm/s ± 0.1 — µ ° ≤ check.`);
    doc.end();
  });
}

export function benchRouter(db: Knex, recorder: ReturnType<typeof queryRecorder>): Router {
  const router = express.Router();

  router.get('/bench/baseline', gate('signedIn'), async (req, res) => {
    const row = (await db('users').where({ id: req.user!.id }).first('id', 'username', 'display_name')) as
      { id: number; username: string; display_name: string } | undefined;
    res.json({ id: row?.id ?? null, username: row?.username ?? null, displayName: row?.display_name ?? null });
  });

  router.get('/bench/bare-pdf', gate('signedIn'), async (_req, res) => {
    const pdf = await barePdf();
    res
      .status(200)
      .set({ 'Content-Type': 'application/pdf', 'Cache-Control': 'no-store', 'Content-Length': String(pdf.length) })
      .end(pdf);
  });

  router.post('/bench/capture', gate(['admin']), (_req, res) => {
    recorder.start();
    res.status(204).end();
  });

  router.get('/bench/captured', gate(['admin']), (_req, res) => {
    res.json(recorder.stop());
  });

  return router;
}
