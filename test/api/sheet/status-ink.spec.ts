/**
 * The bench sheet's status mark prints in the shared status language's ink
 * (shared/status-colours.ts): the same green as the "Approved" chip on screen. Read back with
 * pdf.js's operator list against the real MariaDB.
 */
import { expect } from 'chai';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { TONE_COLOURS } from '../../../shared/status-colours';
import { apiTestContext } from '../support/hooks';
import { createStockSet } from '../support/stock';
import { approved, sessionFor } from '../workflow/workflow-support';
import { getSheet } from './sheet-support';

/** The fill colour in force when each piece of text is drawn, as "#rrggbb" → the text drawn in it. */
async function textByFillColour(pdf: Buffer): Promise<Map<string, string>> {
  const doc = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false, isEvalSupported: false }).promise;
  const byColour = new Map<string, string>();
  try {
    for (let p = 1; p <= doc.numPages; p += 1) {
      const ops = await (await doc.getPage(p)).getOperatorList();
      let fill = '#000000';
      ops.fnArray.forEach((fn, i) => {
        const args = ops.argsArray[i] as unknown[];
        if (fn === OPS.setFillRGBColor) {
          fill = typeof args[0] === 'string' ? args[0] : `#${(args as number[]).map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;
        } else if (fn === OPS.showText) {
          const glyphs = (args[0] as ({ unicode?: string } | number | null)[]).map((g) => (g && typeof g === 'object' ? (g.unicode ?? '') : '')).join('');
          byColour.set(fill, `${byColour.get(fill) ?? ''}${glyphs} `);
        }
      });
    }
  } finally {
    await doc.destroy();
  }
  return byColour;
}

describe('Bench sheet status mark colour', () => {
  const ctx = apiTestContext();

  it('prints "Approved — current" in the shared "go" ink, and nothing else in it', async function () {
    this.timeout(60000);
    const author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    const approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Zoë Ødegård');
    const operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
    const v1 = await approved(author, approver, await createStockSet(ctx.db));
    const res = await getSheet(operator.agent, v1.recipeId, 1).expect(200);
    const byColour = await textByFillColour(res.body as Buffer);
    const inGo = (byColour.get(TONE_COLOURS.go.ink) ?? '').replace(/\s+/g, '');
    expect(inGo, `text in ${TONE_COLOURS.go.ink}; colours used: ${[...byColour.keys()].join(', ')}`).to.equal('Approved—current');
  });
});
