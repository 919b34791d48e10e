import { expect } from 'chai';
import { changePasswordBody, preferencesBody, signInBody } from '../../../../shared/schemas/session';
import { toFieldErrors } from '../../../../shared/validation';

function paths(result: { success: boolean; error?: unknown }): string[] {
  return result.success ? [] : toFieldErrors(result.error as never).map((e) => e.path);
}

describe('shared/schemas/session', () => {
  it('signInBody: trims the name, keeps the password as typed, refuses extra fields', () => {
    expect(signInBody.parse({ username: ' Ines ', password: ' pw ' })).to.deep.equal({ username: 'Ines', password: ' pw ' });
    expect(paths(signInBody.safeParse({ username: '', password: '' }))).to.have.members(['username', 'password']);
    expect(paths(signInBody.safeParse({ username: 'a'.repeat(41), password: 'x' }))).to.deep.equal(['username']);
    expect(paths(signInBody.safeParse({ username: 'a', password: 'x', remember: true }))).to.deep.equal(['']);
  });

  it('changePasswordBody: the new password must be valid and differ from the current one', () => {
    expect(changePasswordBody.safeParse({ currentPassword: 'old', newPassword: 'a-new-password' }).success).to.equal(true);
    expect(paths(changePasswordBody.safeParse({ currentPassword: 'same-password-1', newPassword: 'same-password-1' }))).to.deep.equal(['newPassword']);
    expect(paths(changePasswordBody.safeParse({ currentPassword: '', newPassword: 'short' }))).to.have.members(['currentPassword', 'newPassword']);
  });

  it('preferencesBody: only the two unit choices', () => {
    expect(preferencesBody.parse({ units: 'metric+imperial' })).to.deep.equal({ units: 'metric+imperial' });
    expect(paths(preferencesBody.safeParse({ units: 'imperial' }))).to.deep.equal(['units']);
  });
});
