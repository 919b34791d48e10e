/**
 * The bench sheet as it is used at the saw, read back page by page with pdf-parse: every
 * page names its recipe, version and check code and says "Page x of y", so a loose page
 * finds its recipe; page 1 opens with the key settings in large type; a sheet that can fit
 * on one page does; who prepared the recipe is printed beside who approved it.
 */
import { expect } from 'chai';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { approved, sessionFor, type Session } from '../workflow/workflow-support';
import { getSheet, readSheet, type ReadSheet } from './sheet-support';

const flat = (text: string) => text.replace(/\s+/g, ' ').normalize('NFKC');

describe('Bench sheet at the saw', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Petra Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
    stock = await createStockSet(ctx.db);
  });

  async function sheetOf(recipeId: number): Promise<ReadSheet> {
    const body = (await getSheet(operator.agent, recipeId, 1).expect(200)).body as Buffer;
    return readSheet(body);
  }

  async function printedCode(recipeId: number): Promise<string> {
    const code = (await ctx.db('recipe_versions').where({ recipe_id: recipeId, version: 1 }).first('check_code')).check_code as string;
    return `${code.slice(0, 4)}-${code.slice(4)}`;
  }

  it('prints the recipe number, version, check code and "Page x of y" on every page of a long sheet', async function () {
    this.timeout(30000);
    const steps = Array.from({ length: 70 }, (_, i) => `${i + 1}. Step ${i + 1}: check the clamp, the wheel guard and the coolant jet before going on.`);
    const v = await approved(author, approver, stock, { title: 'A long procedure', instructionsMd: steps.join('\n') });
    const sheet = await sheetOf(v.recipeId);
    const code = await printedCode(v.recipeId);
    expect(sheet.pages).to.be.at.least(2);
    expect(sheet.pageTexts).to.have.length(sheet.pages);
    sheet.pageTexts.forEach((raw, i) => {
      const page = flat(raw);
      expect(page, `page ${i + 1}`).to.include(`${v.number} · Version 1 · Check code ${code}`);
      expect(page, `page ${i + 1}`).to.include(`Page ${i + 1} of ${sheet.pages}`);
    });
  });

  it('opens page 1 with the key settings in large type: wheel, rpm with its limit, feed, cut motion and coolant', async function () {
    this.timeout(30000);
    const v = await approved(
      author,
      approver,
      await createStockSet(ctx.db, { machine: { name: 'Strip saw' }, wheel: { name: 'Strip wheel' }, material: { name: 'Strip C45' } }),
      {
        title: 'Key settings',
        cutting: { feedMmS: 0.3, entryFeedMmS: 0.1, entryLengthMm: 5, cutMotion: 'pulsed-plunge' },
        coolant: { type: 'water-soluble', concentrationPct: 5, flowLMin: 10 },
      },
    );
    const page1 = flat((await sheetOf(v.recipeId)).pageTexts[0]!);
    const strip = page1.slice(page1.indexOf('KEY SETTINGS'), page1.indexOf('SCOPE'));
    expect(page1.indexOf('KEY SETTINGS'), 'the strip is printed').to.be.above(0);
    expect(page1.indexOf('KEY SETTINGS'), 'the strip comes before the scope').to.be.below(page1.indexOf('SCOPE'));
    for (const expected of [
      'Strip wheel',
      'A60P5B',
      '3000 rpm never above 4812 rpm on this machine',
      '0.30 mm/s',
      'entry 0.10 mm/s for the first 5.00 mm',
      'Pulsed plunge',
      'Water-soluble coolant',
      '5 % v/v · 10 L/min',
    ]) {
      expect(strip, expected).to.include(expected);
    }
  });

  const steps = [
    '1. Inspect the wheel for chips and cracks; check its marked speed against the recipe.',
    '2. Clamp the part on both sides of the cut; the offcut must not drop or pinch the wheel.',
    '3. Check the coolant concentration with the refractometer.',
    '4. Close the hood, start the coolant, then the wheel; start the automatic feed.',
    '5. After the cut, let the wheel stop before opening the hood. Deburr the specimen.',
  ];
  async function usualRecipe(title: string, stepCount: number) {
    return approved(
      author,
      approver,
      await createStockSet(ctx.db, { machine: { name: `${title} saw` }, wheel: { name: 'Usual wheel' }, material: { name: `${title} C45` } }),
      {
        title,
        clamping: { placement: 'Jaws 10 mm either side of the cut line.', orientationRule: 'Mark faces the operator.' },
        instructionsMd: steps.slice(0, stepCount).join('\n'),
      },
    );
  }

  it('fits a short sheet on one A4 page, standard cautions and signatures included, with who prepared it beside who approved it', async function () {
    this.timeout(30000);
    const v = await usualRecipe('Short', 3);
    const sheet = await sheetOf(v.recipeId);
    // Three steps, the usual scope and clamping, one signature: the end of the sheet is set
    // tighter rather than sent to a page of its own.
    expect(sheet.pages, 'pages').to.equal(1);
    const page1 = flat(sheet.pageTexts[0]!);
    for (const step of steps.slice(0, 3)) expect(page1, step).to.include(step);
    expect(page1).to.include('No burn marks.');
    expect(page1).to.match(/Prepared by Ines Author/i);
    expect(page1).to.match(/Approved by Petra Approver/i);
    // Every standard caution, the precedence line and the signature are still printed.
    for (const title of [
      'Wheel speed and guards',
      'Inspect the wheel before mounting',
      'Clamp the part',
      'Coolant',
      'Hazardous dusts',
      'Lock out before maintenance',
    ])
      expect(page1, title).to.include(`${title}.`);
    expect(page1).to.include('take precedence over this sheet');
    expect(page1).to.match(/Petra Approver · Approved · \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC · content SHA-256 [0-9a-f]{16}/);
    expect(page1).to.include('Page 1 of 1');
  });

  it('moves the instructions up: a longer sheet keeps every step on page 1 and goes on to a second page only for the cautions and signatures', async function () {
    this.timeout(30000);
    const v = await usualRecipe('Longer', 5);
    const sheet = await sheetOf(v.recipeId);
    expect(sheet.pages, 'pages').to.be.within(1, 2);
    const page1 = flat(sheet.pageTexts[0]!);
    for (const step of steps) expect(page1, step).to.include(step);
    expect(page1).to.include('No burn marks.');
    const text = flat(sheet.text);
    expect(text).to.include('STANDARD CAUTIONS');
    expect(text).to.include(`Page ${sheet.pages} of ${sheet.pages}`);
  });
});
