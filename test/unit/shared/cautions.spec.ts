import { expect } from 'chai';
import { NO_SAFETY_CLAIM, PRECEDENCE_LINE, STANDARD_CAUTIONS } from '../../../shared/cautions';

describe('shared/cautions', () => {
  it('covers the standard cautions: wheel speed and guards, wheel inspection, clamping, coolant, hot parts, protection, lock-out, hazardous dusts', () => {
    const ids = STANDARD_CAUTIONS.map((c) => c.id);
    expect(ids).to.include.members(['wheel-burst', 'wheel-inspection', 'clamping', 'coolant', 'hot-parts', 'ppe', 'lock-out', 'hazardous-dust']);
    expect(new Set(ids).size).to.equal(ids.length);
    for (const c of STANDARD_CAUTIONS) expect(c.title.length * c.text.length, c.id).to.be.greaterThan(0);
  });
  it('names the standards and regulations behind them (ANSI B7.1, EN 12413, OSHA 29 CFR 1910.215 and 1910.147, NIOSH 98-102, Directive 2003/10/EC, ISO 14118, OSHA beryllium PEL)', () => {
    const sources = STANDARD_CAUTIONS.flatMap((c) => c.sources).join(' | ');
    for (const s of ['ANSI B7.1', 'EN 12413', '1910.215', 'NIOSH 98-102', '2003/10/EC', '1910.147', 'ISO 14118', '0.2 µg/m³']) expect(sources).to.contain(s);
  });
  it('defers to local regulations, the manual and licensed practice, and claims no safety', () => {
    expect(PRECEDENCE_LINE)
      .to.match(/local regulations/i)
      .and.match(/manual/)
      .and.match(/licensed safety practice/);
    expect(NO_SAFETY_CLAIM).to.match(/does not certify/);
  });
});
