/**
 * The bench sheet's "never above N rpm on this machine" line beside the rpm, read back from
 * the PDF's text: N is the wheel's marked maximum in whole rpm at its new diameter
 * (60 000·63/(π·250) = 4812.8 → 4812), or the spindle limit set on the machine where lower.
 * Also the wheel's restriction marks, its marked maximum as marked, and the cautions the
 * recipe's material calls for, with their basis.
 */
import { expect } from 'chai';
import { COMBUSTIBLE_FINES } from '../../../shared/cautions';
import { apiTestContext } from '../support/hooks';
import { createStockSet } from '../support/stock';
import { approved, sessionFor, type Session } from '../workflow/workflow-support';
import { getSheet, readSheet } from './sheet-support';

const flat = (text: string) => text.replace(/\s+/g, ' ').normalize('NFKC');

describe('Bench sheet: the speed never to exceed on this machine', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Petra Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
  });

  const sheetText = async (recipeId: number) => flat((await readSheet((await getSheet(operator.agent, recipeId, 1).expect(200)).body as Buffer)).text);

  it('prints the wheel’s marked maximum in whole rpm beside the rpm, the marking as marked, and the restriction marks', async function () {
    this.timeout(30000);
    const stock = await createStockSet(ctx.db, { wheel: { restrictions: ['wet-use-only', 'no-side-grinding'] } });
    const v = await approved(author, approver, stock, { title: 'No limit on the saw' });
    const text = await sheetText(v.recipeId);
    expect(text).to.include('3000 rpm never above 4812 rpm on this machine');
    expect(text).to.include('63 m/s (marked) · 4812 rpm at 250 mm');
    expect(text).to.include('For wet use only; Not for side grinding');
  });

  it('prints the spindle limit where it is lower than the wheel’s marking (2800 rpm)', async function () {
    this.timeout(30000);
    const stock = await createStockSet(ctx.db, {
      machine: { name: 'Limited bench saw', spindleLimitRpm: 2800.6, spindleLimitSetBy: 'Maintenance, work order 17' },
      wheel: { name: 'Alumina 250 for the limited saw' },
      material: { name: 'C45 for the limited saw' },
    });
    const v = await approved(author, approver, stock, { title: 'Limited saw', cutting: { wheelRpm: 2500 } });
    const text = await sheetText(v.recipeId);
    // 2800.6 floored: never above 2800.
    expect(text).to.include('2500 rpm never above 2800 rpm on this machine');
    expect(text).to.include('None marked');
  });

  it('a wheel marked in rpm: the marked figure, floored, and the m/s computed from it', async function () {
    this.timeout(30000);
    const stock = await createStockSet(ctx.db, {
      wheel: { name: 'Alumina 250 marked in rpm', maxSpeedMarkedIn: 'rpm', maxSpeedMs: null, maxSpeedRpm: 4800 },
      machine: { name: 'Bench saw for rpm marks' },
      material: { name: 'C45 for rpm marks' },
    });
    const v = await approved(author, approver, stock, { title: 'Marked in rpm' });
    const text = await sheetText(v.recipeId);
    // π·250·4800/60 000 = 62.8 m/s.
    expect(text).to.include('4800 rpm (marked) · 62.8 m/s at 250 mm');
    expect(text).to.include('3000 rpm never above 4800 rpm on this machine');
  });

  it('prints the fire caution for titanium fines with its basis, and no such caution for steel', async function () {
    this.timeout(30000);
    const ti = await createStockSet(ctx.db, {
      material: { name: 'Ti-6Al-4V bar', designation: 'UNS R56400', group: 'titanium', hardness: { value: 340, scale: 'HV' }, combustibleFines: true },
      machine: { name: 'Bench saw for titanium' },
      wheel: { name: 'SiC 250 for titanium', specification: 'C80N5B' },
    });
    const v = await approved(author, approver, ti, {
      title: 'Titanium bar',
      scope: { group: 'titanium', hardness: { min: 300, max: 360, scale: 'HV' } },
      cutting: { feedMmS: 0.2 },
    });
    const text = await sheetText(v.recipeId);
    expect(text).to.include('FOR THIS MATERIAL AND SETUP');
    expect(text).to.include(COMBUSTIBLE_FINES.title);
    expect(text).to.include('Basis: NFPA 484, combustible metals (from memory); common practice.');
    expect(text).to.include('Run a newly mounted wheel first.');

    const steel = await approved(
      author,
      approver,
      await createStockSet(ctx.db, { machine: { name: 'Saw 3' }, wheel: { name: 'Wheel 3' }, material: { name: 'Steel 3' } }),
      {
        title: 'Plain steel',
      },
    );
    const plain = await sheetText(steel.recipeId);
    expect(plain).to.not.include(COMBUSTIBLE_FINES.title);
    expect(plain).to.not.include('FOR THIS MATERIAL AND SETUP');
  });
});
