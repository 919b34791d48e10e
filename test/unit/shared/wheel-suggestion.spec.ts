import { expect } from 'chai';
import type { SelectionRow } from '../../../shared/stock-types';
import { matchesStarterWheel, STARTER_SELECTION, suggestWheels } from '../../../shared/wheel-suggestion';
import { MATERIAL_GROUPS, METALLIC_GROUPS } from '../../../shared/vocabulary';
import { abrasiveFamily } from '../../../shared/wheel-spec';
import { rimWheel, wheel } from './fixtures';

const any = wheel({ id: 10, name: 'General alumina', specification: 'A46P5BF' });
const medium = wheel({ id: 11, name: 'Medium alumina', specification: 'A60M5BF' });
const soft = wheel({ id: 12, name: 'Soft alumina', specification: 'A60H5BF' });
const old = wheel({ id: 13, name: 'Old wheel', archived: true });
const rows: SelectionRow[] = [
  { id: 1, group: 'hardened-tool-steel', hardness: null, wheelId: 10, note: '' },
  { id: 2, group: 'hardened-tool-steel', hardness: { min: 20, max: 68, scale: 'HRC' }, wheelId: 11, note: '' },
  { id: 3, group: 'hardened-tool-steel', hardness: { min: 50, max: 68, scale: 'HRC' }, wheelId: 12, note: 'Softer bond for hard steel.' },
  { id: 4, group: 'hardened-tool-steel', hardness: null, wheelId: 13, note: '' },
  { id: 5, group: 'copper', hardness: null, wheelId: 10, note: '' },
];
const stock = [any, medium, soft, old];

describe('shared/wheel-suggestion', () => {
  it('most specific band first, then group-wide rows; archived wheels never', () => {
    const s = suggestWheels('hardened-tool-steel', { value: 60, scale: 'HRC' }, rows, stock);
    expect(s.map((x) => x.wheel.id)).to.deep.equal([12, 11, 10]);
    expect(s[0]!.reason).to.contain('50–68 HRC').and.contain('Softer bond');
    expect(s[2]!.reason).to.contain('any hardness');
  });

  it('leaves out bands that do not contain the hardness', () => {
    expect(suggestWheels('hardened-tool-steel', { value: 30, scale: 'HRC' }, rows, stock).map((x) => x.wheel.id)).to.deep.equal([11, 10]);
  });

  it('converts a steel hardness to the band scale (ASTM E140, Table 1: 697 HV = 60 HRC)', () => {
    const s = suggestWheels('hardened-tool-steel', { value: 697, scale: 'HV' }, rows, stock);
    expect(s.map((x) => x.wheel.id)).to.deep.equal([12, 11, 10]);
    expect(s[0]!.reason).to.contain('≈ 60 HRC');
  });

  it('without a hardness: group-wide first, banded rows after, marked unconfirmed', () => {
    const s = suggestWheels('hardened-tool-steel', null, rows, stock);
    expect(s.map((x) => x.wheel.id)).to.deep.equal([10, 12, 11]);
    expect(s[1]!.reason).to.contain('not confirmed');
  });

  it('only the group asked for', () => {
    expect(suggestWheels('ceramic-glass', null, rows, stock)).to.deep.equal([]);
    expect(suggestWheels('copper', null, rows, stock).map((x) => x.wheel.id)).to.deep.equal([10]);
  });

  describe("a coated part: the coating's hardness as well as the substrate's (the harder layer sets the bond: harder material, softer bond, common practice)", () => {
    const banded: SelectionRow[] = [
      { id: 1, group: 'plain-low-alloy-steel', hardness: { min: 80, max: 345, scale: 'HV' }, wheelId: 10, note: '' },
      { id: 2, group: 'plain-low-alloy-steel', hardness: { min: 35, max: 50, scale: 'HRC' }, wheelId: 11, note: '' },
      { id: 3, group: 'plain-low-alloy-steel', hardness: { min: 50, max: 68, scale: 'HRC' }, wheelId: 12, note: '' },
    ];
    const substrate30 = { value: 30, scale: 'HRC' } as const;
    it("a harder coating (45 HRC) on a 30 HRC substrate: the coating's band first, then the substrate's", () => {
      const s = suggestWheels('plain-low-alloy-steel', substrate30, banded, stock, { value: 45, scale: 'HRC' });
      expect(s.map((x) => x.wheel.id)).to.deep.equal([11, 10]);
      expect(s[0]!.reason).to.contain("coating's 45 HRC").and.contain('harder layer');
      expect(s[1]!.reason).to.not.contain('coating');
    });
    it('a coating above every band (1150 HV > 940 HV = 68 HRC, ASTM E140 Table 1) takes the hardest band', () => {
      const s = suggestWheels('plain-low-alloy-steel', substrate30, banded, stock, { value: 1150, scale: 'HV' });
      expect(s.map((x) => x.wheel.id)).to.deep.equal([12, 10]);
      expect(s[0]!.reason).to.contain('hardest band').and.contain('1150 HV');
    });
    it("a softer coating on a harder substrate: the substrate's band first (200 HV < 446 HV = 45 HRC, ASTM E140 Table 1)", () => {
      const s = suggestWheels('plain-low-alloy-steel', { value: 45, scale: 'HRC' }, banded, stock, { value: 200, scale: 'HV' });
      expect(s.map((x) => x.wheel.id)).to.deep.equal([11, 10]);
      expect(s[1]!.reason).to.contain("coating's 200 HV").and.not.contain('harder layer');
    });
    it('without a substrate hardness the coating leads and the other bands follow, unconfirmed; without a coating nothing changes', () => {
      const s = suggestWheels('plain-low-alloy-steel', null, banded, stock, { value: 55, scale: 'HRC' });
      expect(s.map((x) => x.wheel.id)).to.deep.equal([12, 11, 10]);
      expect(s[1]!.reason).to.contain('not confirmed');
      expect(suggestWheels('hardened-tool-steel', { value: 60, scale: 'HRC' }, rows, stock, null)).to.deep.equal(
        suggestWheels('hardened-tool-steel', { value: 60, scale: 'HRC' }, rows, stock),
      );
    });
  });

  describe('STARTER_SELECTION (common practice: alumina for ferrous, silicon carbide for non-ferrous metals, diamond for hard brittle materials; harder material, softer bond)', () => {
    it('covers every group', () => {
      for (const g of MATERIAL_GROUPS)
        expect(
          STARTER_SELECTION.some((r) => r.group === g),
          g,
        ).to.equal(true);
    });
    it('aluminium oxide for ferrous metals and nickel and cobalt alloys, silicon carbide for the other non-ferrous metals, diamond rim wheels for hard brittle materials', () => {
      const first = (g: string) => STARTER_SELECTION.find((r) => r.group === g)!.wheel;
      // Nickel and cobalt alloys: aluminium oxide, as wheel charts give them (from memory); SiC wears chemically on nickel and cobalt as on iron (from memory).
      for (const g of ['plain-low-alloy-steel', 'hardened-tool-steel', 'stainless-steel', 'cast-iron', 'nickel-cobalt'])
        expect(first(g).abrasives[0], g).to.equal('aluminium-oxide');
      for (const g of ['aluminium-magnesium', 'copper', 'titanium']) expect(first(g).abrasives[0], g).to.equal('silicon-carbide');
      for (const g of ['cemented-carbide', 'ceramic-glass']) expect(first(g)).to.deep.include({ kind: 'rim', abrasives: ['diamond'] });
      for (const r of STARTER_SELECTION) if (METALLIC_GROUPS.includes(r.group) && r.wheel.kind === 'rim') expect(r.wheel.abrasives).to.not.include('diamond');
    });
    it('harder material → softer bond (hardened steel bands)', () => {
      const bands = STARTER_SELECTION.filter((r) => r.group === 'hardened-tool-steel' && r.wheel.kind === 'bonded');
      const lowBand = bands.find((r) => r.hardness!.min === 20)!;
      const highBand = bands.find((r) => r.hardness!.min === 45)!;
      expect([lowBand.wheel.grade, highBand.wheel.grade]).to.deep.equal(['medium', 'soft']);
    });
    it('plain and low-alloy steels are banded too: no hard bond for hardened low-alloy steel (bands at 35 and 50 HRC, from memory; 35 HRC = 345 HV, ASTM E140 Table 1)', () => {
      const bands = STARTER_SELECTION.filter((r) => r.group === 'plain-low-alloy-steel');
      expect(bands.map((r) => [r.hardness, r.wheel.grade])).to.deep.equal([
        [{ min: 80, max: 345, scale: 'HV' }, 'hard'],
        [{ min: 35, max: 50, scale: 'HRC' }, 'medium'],
        [{ min: 50, max: 68, scale: 'HRC' }, 'soft'],
      ]);
      expect(bands.every((r) => r.hardness !== null && r.wheel.kind === 'bonded' && r.wheel.abrasives[0] === 'aluminium-oxide')).to.equal(true);
    });
    it('matchesStarterWheel checks kind, abrasive and grade band', () => {
      const plain = STARTER_SELECTION.find((r) => r.group === 'plain-low-alloy-steel' && r.wheel.grade === 'hard')!.wheel;
      expect(matchesStarterWheel(plain, any)).to.equal(true); // A46P… is a hard grade (P and up: Kerfbook's grade bands, from memory)
      expect(matchesStarterWheel(plain, soft)).to.equal(false);
      const ceramic = STARTER_SELECTION.find((r) => r.group === 'ceramic-glass')!.wheel;
      expect(matchesStarterWheel(ceramic, rimWheel())).to.equal(true);
      expect(abrasiveFamily(rimWheel().specification)).to.equal('diamond');
      expect(matchesStarterWheel(ceramic, any)).to.equal(false);
    });
  });
});
