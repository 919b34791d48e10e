import { expect } from 'chai';
import { formatDecimalText, parseDecimalText } from '../../../shared/decimal-text';

// Either sign is a decimal sign: ISO 80000-1:2009 allows the comma or the point on the line
// as the decimal sign (clause 7.3.2, from memory). Thousands separators are refused rather
// than guessed (common practice for entry of measured values: a dropped sign is a 1000× error).
describe('shared/decimal-text', () => {
  const value = (text: string, group?: string) => {
    const result = parseDecimalText(text, group);
    if (!result.ok) throw new Error(`refused: ${result.message}`);
    return result.value;
  };
  const refusal = (text: string, group?: string) => {
    const result = parseDecimalText(text, group);
    if (result.ok) throw new Error(`accepted as ${result.value}`);
    return result.message;
  };

  it('reads a comma and a point as the decimal sign in an English and a German locale', () => {
    for (const group of [',', '.']) {
      expect(value('0,3', group)).to.equal(0.3);
      expect(value('0.3', group)).to.equal(0.3);
      expect(value(',5', group)).to.equal(0.5);
      expect(value('12,75', group)).to.equal(12.75);
      expect(value('  2.5 ', group)).to.equal(2.5);
      expect(value('4000', group)).to.equal(4000);
      expect(value('-1,5', group)).to.equal(-1.5);
      expect(value('0,125', group)).to.equal(0.125);
      expect(value('1234,567', group)).to.equal(1234.567);
    }
  });

  it('reads empty input as no number', () => {
    expect(value('')).to.equal(null);
    expect(value('   ')).to.equal(null);
  });

  it('refuses a point and a comma together, or repeated signs, instead of guessing', () => {
    expect(refusal('1.000,5', '.')).to.match(/more than one point or comma.*without thousands separators/);
    expect(refusal('1,000.5', ',')).to.match(/more than one point or comma/);
    expect(refusal('1.000.000', '.')).to.match(/more than one point or comma/);
  });

  it('refuses a sign that the locale reads as a thousands separator before three digits', () => {
    // English: "1,500" is fifteen hundred to most readers and one and a half to others.
    expect(refusal('1,500', ',')).to.equal('"1,500" could mean 1500 or 1.500. Type 1500 for the first or 1.500 for the second.');
    expect(value('1.500', ',')).to.equal(1.5);
    // German: the other way round.
    expect(refusal('1.500', '.')).to.equal('"1.500" could mean 1500 or 1,500. Type 1500 for the first or 1,500 for the second.');
    expect(value('1,500', '.')).to.equal(1.5);
  });

  it('refuses what is not a plain number', () => {
    for (const text of ['abc', '1e3', '3 000', '0x10', 'Infinity', '5 mm', '1,2,3']) expect(refusal(text)).to.be.a('string');
  });

  it('writes a stored number with the person’s decimal sign and no grouping', () => {
    expect(formatDecimalText(0.3, ',')).to.equal('0,3');
    expect(formatDecimalText(0.3, '.')).to.equal('0.3');
    expect(formatDecimalText(12000, ',')).to.equal('12000');
    expect(formatDecimalText(null)).to.equal('');
    expect(parseDecimalText(formatDecimalText(1234.5, ','), '.')).to.deep.equal({ ok: true, value: 1234.5 });
  });
});
