import { expect } from 'chai';
import { abrasiveFamily, BOND_LABELS, CONVENTIONAL_BONDS, gradeBand, parseWheelSpec } from '../../../shared/wheel-spec';

describe('shared/wheel-spec', () => {
  describe('conventional wheels (ISO 525 field order: abrasive, grit, grade, structure, bond)', () => {
    it('reads A60K5V with a structure and A60KV without (ISO 525: the structure number may be left out)', () => {
      expect(parseWheelSpec('A60K5V')).to.deep.equal({
        ok: true,
        spec: { type: 'conventional', abrasive: 'A', grit: 60, grade: 'K', structure: 5, bond: 'V', text: 'A60K5V' },
      });
      const r = parseWheelSpec('A60KV');
      expect(r.ok && r.spec.type === 'conventional' && r.spec.structure).to.equal(null);
    });
    it('reads every bond letter Kerfbook knows (ISO 525 / ANSI B74.13: V, B, BF, R, E, M, S — from memory), BF before B', () => {
      for (const bond of ['V', 'B', 'BF', 'R', 'E', 'M', 'S']) {
        const r = parseWheelSpec(`C120P${bond}`);
        expect(r.ok && r.spec.type === 'conventional' && r.spec.bond, bond).to.equal(bond);
      }
      const bf = parseWheelSpec('A36R6BF');
      expect(bf.ok && bf.spec.type === 'conventional' && [bf.spec.grade, bf.spec.structure, bf.spec.bond]).to.deep.equal(['R', 6, 'BF']);
    });
    it('reads the cut-off bonds it used to miss (ISO 525 bond designations, from memory: RF reinforced rubber, MG magnesite, PL plastic)', () => {
      // Each with and without a structure number, so the two-letter bond is not read as a grade or a structure.
      const cases: [string, string, number | null, string][] = [
        ['A36P6RF', 'P', 6, 'RF'],
        ['A36PRF', 'P', null, 'RF'],
        ['C60K5MG', 'K', 5, 'MG'],
        ['C60KMG', 'K', null, 'MG'],
        ['A80M8PL', 'M', 8, 'PL'],
        ['A80MPL', 'M', null, 'PL'],
      ];
      for (const [marking, grade, structure, bond] of cases) {
        const r = parseWheelSpec(marking);
        expect(r.ok && r.spec.type === 'conventional' && [r.spec.grade, r.spec.structure, r.spec.bond], marking).to.deep.equal([grade, structure, bond]);
        expect(r.ok && r.spec.text, marking).to.equal(marking);
      }
      expect(BOND_LABELS.RF).to.equal('reinforced rubber');
      expect(BOND_LABELS.MG).to.equal('magnesite');
    });
    it('every bond letter of the list parses after a grade, and the message for an unknown one lists them all', () => {
      for (const bond of CONVENTIONAL_BONDS) {
        const r = parseWheelSpec(`A46N${bond}`);
        expect(r.ok && r.spec.type === 'conventional' && r.spec.bond, bond).to.equal(bond);
      }
      const r = parseWheelSpec('A46NX');
      expect(!r.ok && r.error).to.equal('Unknown bond "X": use V, B, BF, R, RF, E, MG, PL, M, S.');
    });
    it('ignores spaces and hyphens and reads lower case as capitals', () => {
      const r = parseWheelSpec(' a 60 k 5 v ');
      expect(r.ok && r.spec.text).to.equal('A60K5V');
      expect(parseWheelSpec('C-46-N-B').ok).to.equal(true);
    });
    it('rejects a grade outside A–Z (ISO 525: grades run from A, softest, to Z, hardest)', () => {
      for (const bad of ['A60ÄV', 'A60#5V', 'A60_5V', 'A60']) {
        const r = parseWheelSpec(bad);
        expect(r.ok, bad).to.equal(false);
        if (!r.ok) expect(r.error).to.match(/grade/i);
      }
    });
    it('rejects unknown abrasives and bonds with a message', () => {
      const x = parseWheelSpec('X60K5V');
      expect(!x.ok && x.error).to.match(/abrasive/);
      const q = parseWheelSpec('A60K5Q');
      expect(!q.ok && q.error).to.match(/bond "Q"/);
      expect(parseWheelSpec('').ok).to.equal(false);
      expect(parseWheelSpec('AK5V').ok).to.equal(false); // no grit
    });
  });

  describe('diamond and CBN wheels (the usual superabrasive marking, common practice)', () => {
    it('reads abrasive, grit, optional grade and concentration, bond', () => {
      expect(parseWheelSpec('D126M')).to.deep.equal({
        ok: true,
        spec: { type: 'superabrasive', abrasive: 'D', grit: 126, grade: null, concentration: null, bond: 'M', text: 'D126M' },
      });
      expect(parseWheelSpec('B151N100B')).to.deep.equal({
        ok: true,
        spec: { type: 'superabrasive', abrasive: 'B', grit: 151, grade: 'N', concentration: 100, bond: 'B', text: 'B151N100B' },
      });
      const cb = parseWheelSpec('CB91R75M');
      expect(cb.ok && cb.spec.type === 'superabrasive' && [cb.spec.abrasive, cb.spec.concentration]).to.deep.equal(['B', 75]);
    });
    it('rejects a wrong bond', () => {
      expect(parseWheelSpec('D126Q').ok).to.equal(false);
    });
  });

  it('abrasiveFamily', () => {
    expect(abrasiveFamily('A60K5V')).to.equal('aluminium-oxide');
    expect(abrasiveFamily('C60K5V')).to.equal('silicon-carbide');
    expect(abrasiveFamily('D126M')).to.equal('diamond');
    expect(abrasiveFamily('CB126M')).to.equal('cbn');
    expect(abrasiveFamily('B126M')).to.equal('cbn');
    expect(abrasiveFamily('nonsense')).to.equal(null);
  });

  it('grade bands: up to K soft, L–O medium, P and up hard (from memory)', () => {
    expect(['A', 'K', 'L', 'O', 'P', 'Z'].map(gradeBand)).to.deep.equal(['soft', 'soft', 'medium', 'medium', 'hard', 'hard']);
  });
});
