import { expect } from 'chai';
import { displayName, email, enteredPassword, idParam, newPassword, username } from '../../../../shared/schemas/fields';
import { toFieldErrors } from '../../../../shared/validation';

describe('shared/schemas/fields', () => {
  describe('username', () => {
    it('trims and lower-cases valid names', () => {
      expect(username.parse('  Ines.Author ')).to.equal('ines.author');
      expect(username.parse('a_b-c.9')).to.equal('a_b-c.9');
    });
    it('refuses short, long, non-ASCII and spaced names with a message', () => {
      for (const bad of ['ab', 'a'.repeat(41), 'jürgen', 'ｉｎｅｓ', 'two words', "x' OR '1'='1", '', 42]) {
        const result = username.safeParse(bad);
        expect(result.success, String(bad)).to.equal(false);
        if (!result.success) expect(result.error.issues[0]!.message).to.be.a('string').and.not.equal('');
      }
    });
  });

  describe('passwords', () => {
    it('new passwords: 10 to 200 characters, any Unicode, not only spaces', () => {
      expect(newPassword.safeParse('Ångström-42').success).to.equal(true);
      expect(newPassword.safeParse('x'.repeat(200)).success).to.equal(true);
      expect(newPassword.safeParse('x'.repeat(9)).success).to.equal(false);
      expect(newPassword.safeParse('x'.repeat(201)).success).to.equal(false);
      expect(newPassword.safeParse(' '.repeat(12)).success).to.equal(false);
    });
    it('entered passwords: anything from 1 to 200 characters, untrimmed', () => {
      expect(enteredPassword.parse(' a ')).to.equal(' a ');
      expect(enteredPassword.safeParse('').success).to.equal(false);
      expect(enteredPassword.safeParse('x'.repeat(201)).success).to.equal(false);
    });
  });

  it('display names are trimmed, required and at most 100 characters; stored verbatim otherwise', () => {
    expect(displayName.parse("  Robert'); DROP TABLE users;-- ")).to.equal("Robert'); DROP TABLE users;--");
    expect(displayName.safeParse('   ').success).to.equal(false);
    expect(displayName.safeParse('x'.repeat(101)).success).to.equal(false);
  });

  it('e-mail may be empty or a valid address', () => {
    expect(email.parse('')).to.equal('');
    expect(email.parse(' a@lab.example ')).to.equal('a@lab.example');
    expect(email.safeParse('not-an-address').success).to.equal(false);
  });

  it('ids are positive whole numbers, also from text', () => {
    expect(idParam.parse('12')).to.equal(12);
    for (const bad of ['0', '-1', '1.5', 'abc', '']) expect(idParam.safeParse(bad).success, bad).to.equal(false);
  });

  it('toFieldErrors turns issues into {path, message} with dotted paths', () => {
    const result = username.array().safeParse(['ok.name', 'x']);
    expect(result.success).to.equal(false);
    if (!result.success) expect(toFieldErrors(result.error)).to.deep.equal([{ path: '1', message: 'Username must be at least 3 characters.' }]);
  });
});
